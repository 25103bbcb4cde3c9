import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Browser } from 'playwright-core';
import { chromium } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderHtml } from '../../src/report/html.js';
import { demoReport, hostileReport } from '../report/fixtures/reports.js';

// .ci/run installs Debian's chromium; elsewhere the test is skipped when it is missing (never in CI)
const CHROMIUM = '/usr/bin/chromium';
const ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];
const OUT = resolve('test-output');
const available = existsSync(CHROMIUM);
if (!available && process.env.CI) throw new Error(`${CHROMIUM} is missing: .ci/run should have installed chromium`);

interface PageRun {
  url: string;
  requests: string[];
  consoleErrors: string[];
  pageErrors: string[];
  dialogs: string[];
}

describe.skipIf(!available)('the HTML report in a real browser', () => {
  let browser: Browser;
  beforeAll(async () => {
    mkdirSync(OUT, { recursive: true });
    browser = await chromium.launch({ executablePath: CHROMIUM, args: ARGS, timeout: 15_000 });
  });
  afterAll(async () => {
    await browser?.close();
  });

  /** Write the page, open it as file://, and collect everything it tried to do. */
  async function open(name: string, html: string, screenshot?: string) {
    const file = join(OUT, name);
    writeFileSync(file, html);
    const url = pathToFileURL(file).href;
    const page = await browser.newPage({ viewport: { width: 1200, height: 900 } });
    const run: PageRun = { url, requests: [], consoleErrors: [], pageErrors: [], dialogs: [] };
    page.on('request', (r) => run.requests.push(r.url()));
    page.on('console', (m) => {
      if (m.type() === 'error' || m.type() === 'warning') run.consoleErrors.push(m.text());
    });
    page.on('pageerror', (e) => run.pageErrors.push(String(e)));
    page.on('dialog', async (d) => {
      run.dialogs.push(d.message());
      await d.dismiss();
    });
    await page.goto(url, { waitUntil: 'load' });
    // hover over everything that could carry an injected handler
    await page.mouse.move(300, 300);
    await page.mouse.move(600, 1200);
    const charts = await page.$$eval('figure.chart svg[role="img"]', (svgs) =>
      svgs.map((svg) => {
        const marks = [...svg.querySelectorAll('g[class^="mark-"] > path, g[class^="mark-"] > line, g[class^="mark-"] > rect')];
        const drawn = marks.filter((m) => {
          const b = (m as SVGGraphicsElement).getBBox();
          return b.width > 0 || b.height > 0;
        });
        const box = svg.getBoundingClientRect();
        return {
          label: svg.getAttribute('aria-labelledby'),
          title: svg.querySelector('title')?.textContent ?? '',
          desc: svg.querySelector('desc')?.textContent ?? '',
          drawn: drawn.length,
          width: box.width,
          height: box.height,
        };
      }),
    );
    const pwned = await page.evaluate(() => (window as unknown as { __pwned?: unknown }).__pwned);
    const scripts = await page.$$eval('script', (s) => s.length);
    const headings = await page.$$eval('h1, h2, h3', (hs) => hs.map((h) => `${h.tagName} ${h.textContent?.trim()}`));
    if (screenshot) await page.screenshot({ path: join(OUT, screenshot), fullPage: true });
    await page.close();
    return { run, charts, pwned, scripts, headings };
  }

  it('renders the demo report: no console errors, no network, every chart drawn', async () => {
    const { run, charts, headings } = await open('report-demo.html', await renderHtml(demoReport()), 'report-demo.png');
    expect(run.requests).toEqual([run.url]);
    expect(run.consoleErrors).toEqual([]);
    expect(run.pageErrors).toEqual([]);
    expect(charts).toHaveLength(4);
    for (const c of charts) {
      expect(c.title.length).toBeGreaterThan(5);
      expect(c.desc.length).toBeGreaterThan(20);
      expect(c.drawn, c.title).toBeGreaterThan(3);
      expect(c.width).toBeGreaterThan(200);
      expect(c.height).toBeGreaterThan(80);
    }
    expect(headings.slice(0, 5)).toEqual([
      'H1 fixtures/demo/repairs-delivery.csv',
      'H2 Not ready for a multilevel model',
      'H2 Findings',
      'H3 ■ Blockers: send back to the sender (3)',
      'H3 ○ Notes: for the record (1)',
    ]);
    expect(existsSync(join(OUT, 'report-demo.png'))).toBe(true);
  });

  it('runs nothing from hostile values: no script, no handler, no dialog, no request', async () => {
    const { run, charts, pwned, scripts } = await open('report-hostile.html', await renderHtml(hostileReport()), 'report-hostile.png');
    expect(pwned).toBeUndefined();
    expect(scripts).toBe(0);
    expect(run.dialogs).toEqual([]);
    expect(run.requests).toEqual([run.url]);
    expect(run.consoleErrors).toEqual([]);
    expect(run.pageErrors).toEqual([]);
    expect(charts).toHaveLength(4);
  });
});
