import { existsSync, mkdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Browser, Page } from 'playwright-core';
import { chromium } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import { renderHtml } from '../../src/report/html.js';
import type { Report } from '../../src/report/types.js';
import { parseRoles } from '../../src/roles/load.js';
import { loadRoles } from '../../src/roles/load-file.js';
import { hostileReport } from '../report/fixtures/reports.js';
import { measureCharts } from './measure-charts.js';

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

const HSB_ROLES = 'group: school\nunit: student\noutcome: mathach\nlevel1: [ses, minority, sex]\nlevel2: [sector, size, meanses]\n';
/** The axes that count groups or records: their ticks must be whole numbers. */
const COUNT_TITLES = ['groups', 'records per group', 'groups, sorted by mean'];

interface PageRun {
  url: string;
  requests: string[];
  consoleErrors: string[];
  pageErrors: string[];
  dialogs: string[];
}

describe.skipIf(!available)('the HTML report in a real browser', () => {
  let browser: Browser;
  let demo: Report;
  let hsb: Report;
  beforeAll(async () => {
    mkdirSync(OUT, { recursive: true });
    [browser, demo, hsb] = await Promise.all([
      chromium.launch({ executablePath: CHROMIUM, args: ARGS, timeout: 15_000 }),
      audit('fixtures/demo/repairs-delivery.csv', loadRoles('fixtures/demo/repairs-delivery.roles.yaml', catalogue)),
      audit('fixtures/reference/hsb.csv', parseRoles(HSB_ROLES, 'hsb.roles.yaml', catalogue)),
    ]);
  });
  afterAll(async () => {
    await browser?.close();
  });

  /**
   * Write the page, open it as file:// at a width, and collect everything it tried to do and the
   * geometry of every chart; with `print`, print it to PDF and measure it again as printed.
   */
  async function open(name: string, html: string, width: number, print = false) {
    const file = join(OUT, `${name}.html`);
    writeFileSync(file, html);
    const url = pathToFileURL(file).href;
    const page = await browser.newPage({ viewport: { width, height: 900 } });
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
    const charts = await page.$$eval('figure.chart', measureCharts);
    const pwned = await page.evaluate(() => (window as unknown as { __pwned?: unknown }).__pwned);
    const scripts = await page.$$eval('script', (s) => s.length);
    const headings = await page.$$eval('h1, h2, h3', (hs) => hs.map((h) => `${h.tagName} ${h.textContent?.trim()}`));
    const markers = await page.$$eval('main .inv', (els) => els.map((el) => `${el.textContent} ${el.getAttribute('title')}`));
    await page.screenshot({ path: join(OUT, `${name}-${width}.png`), fullPage: true });
    const printed = print ? await printAndMeasure(page, join(OUT, `${name}.pdf`)) : undefined;
    await page.close();
    return { run, charts, pwned, scripts, headings, markers, printed };
  }

  type Opened = Awaited<ReturnType<typeof open>>;

  /** Print the page to PDF (A4 from its @page rule), then lay it out as printed and measure the charts and cards. */
  async function printAndMeasure(page: Page, pdf: string) {
    await page.pdf({ path: pdf, preferCSSPageSize: true });
    await page.emulateMedia({ media: 'print' });
    const charts = await page.$$eval('figure.chart', measureCharts);
    const unbroken = await page.$$eval('figure.chart, li.finding, .verdict, .table-scroll', (els) =>
      els.map((el) => getComputedStyle(el).breakInside),
    );
    return { charts, unbroken };
  }

  /** What every chart of every page must hold, at any width. */
  function chartsFit(opened: Opened) {
    for (const c of opened.charts) {
      // exactly one drawing shown, filling the card
      expect(c.shown, c.id).toBe(1);
      expect(c.width / c.inner, c.id).toBeGreaterThanOrEqual(0.9);
      expect(c.width / c.inner, c.id).toBeLessThanOrEqual(1.001);
      expect(c.title.length).toBeGreaterThan(5);
      expect(c.desc.length).toBeGreaterThan(20);
      expect(c.drawn, c.id).toBeGreaterThan(3);
      // no text outside the drawing's box, none cut short by an ellipsis
      expect(c.outside, c.id).toEqual([]);
      expect(
        c.texts.filter((t) => t.endsWith('…')),
        c.id,
      ).toEqual([]);
      // count axes have whole-number ticks
      for (const axis of c.axes.filter((a) => COUNT_TITLES.includes(a.title))) {
        expect(axis.labels.length, `${c.id} ${axis.title}`).toBeGreaterThan(1);
        for (const label of axis.labels) expect(label, `${c.id} ${axis.title}`).toMatch(/^\d+$/);
      }
    }
    const titles = opened.charts.flatMap((c) => c.axes.map((a) => a.title));
    for (const t of COUNT_TITLES) expect(titles).toContain(t);
  }

  /** The legend entries each chart should have: only what the report's data hold, none when there is one kind. */
  function expectedLegends(report: Report): Record<string, string[]> {
    const plots = report.plots!;
    const threshold = plots.smallGroupThreshold!;
    const sizes = plots.groupSizes.filter((h) => h.count > 0);
    const kinds = [
      ...(sizes.some((h) => h.size === 1) ? ['singleton (1 record)'] : []),
      ...(sizes.some((h) => h.size > 1 && h.size < threshold) ? [`small (fewer than ${threshold})`] : []),
      ...(sizes.some((h) => h.size >= threshold) ? ['other groups'] : []),
    ];
    const single = Object.values(plots.groupMeans)[0].points.some((p) => p.n === 1);
    return {
      'chart-group-sizes': kinds.length > 1 ? kinds : [],
      'chart-means-0': single ? ['group mean ± 1.96·SE', 'singleton group (1 record: no interval)'] : [],
      'chart-icc': ['REML', 'ML', 'ANOVA ICC(1)'],
      'chart-predictor-shares': [],
    };
  }

  describe.each([
    ['demo', () => demo],
    ['hsb', () => hsb],
  ])('the %s report at 760 and 1,280 px', (name, report) => {
    const pages: Record<number, Opened> = {};
    beforeAll(async () => {
      const html = await renderHtml(report());
      for (const width of [760, 1280]) {
        // the demo is also printed (print stylesheet, A4 from the page's @page rule)
        pages[width] = await open(`report-${name}`, html, width, name === 'demo' && width === 1280);
      }
    });

    it('runs nothing and asks for nothing: no console error, no request but the page', () => {
      for (const { run } of Object.values(pages)) {
        expect(run.requests).toEqual([run.url]);
        expect(run.consoleErrors).toEqual([]);
        expect(run.pageErrors).toEqual([]);
      }
    });

    it('draws every chart across its card, with no text cut off and whole-number count axes', () => {
      for (const opened of Object.values(pages)) {
        expect(opened.charts).toHaveLength(4);
        chartsFit(opened);
      }
      // the narrow drawing at 760 px, the wide one at 1,280 px
      expect(pages[760].charts.map((c) => c.variant)).toEqual(['narrow', 'narrow', 'narrow', 'narrow']);
      expect(pages[1280].charts.map((c) => c.variant)).toEqual(['wide', 'wide', 'wide', 'wide']);
    });

    it('lists in each legend only the categories the chart shows', () => {
      const expected = expectedLegends(report());
      for (const opened of Object.values(pages)) {
        for (const c of opened.charts) expect(c.legend, c.id).toEqual(expected[c.id]);
      }
    });

    it('opens with the verdict and findings; the hidden trailing space of the demo is a marker', () => {
      const { headings, markers } = pages[1280];
      if (name === 'hsb') {
        expect(headings[0]).toBe('H1 fixtures/reference/hsb.csv');
        expect(markers).toEqual([]);
        return;
      }
      expect(headings.slice(0, 4)).toEqual([
        'H1 fixtures/demo/repairs-delivery.csv',
        'H2 Not ready for a multilevel model',
        'H2 Findings',
        'H3 ■ Blockers: send back to the sender (4)',
      ]);
      // "W-014 " and "W-014" told apart: the trailing space is a marker, its meaning on hover
      expect(markers).toContain('␣ space at the start or end');
    });

    it('writes a screenshot at each width and the demo as a PDF, printed with the narrow charts across the page, no card split', () => {
      for (const width of [760, 1280]) expect(statSync(join(OUT, `report-${name}-${width}.png`)).size).toBeGreaterThan(10_000);
      if (name !== 'demo') return;
      expect(readFileSync(join(OUT, 'report-demo.pdf')).subarray(0, 5).toString()).toBe('%PDF-');
      const { charts, unbroken } = pages[1280].printed!;
      expect(charts.map((c) => c.variant)).toEqual(['narrow', 'narrow', 'narrow', 'narrow']);
      chartsFit({ ...pages[1280], charts });
      expect(new Set(unbroken)).toEqual(new Set(['avoid']));
    });
  });

  it('runs nothing from hostile values: no script, no handler, no dialog, no request', async () => {
    const { run, charts, pwned, scripts } = await open('report-hostile', await renderHtml(hostileReport()), 1200);
    expect(pwned).toBeUndefined();
    expect(scripts).toBe(0);
    expect(run.dialogs).toEqual([]);
    expect(run.requests).toEqual([run.url]);
    expect(run.consoleErrors).toEqual([]);
    expect(run.pageErrors).toEqual([]);
    expect(charts).toHaveLength(4);
  });
});
