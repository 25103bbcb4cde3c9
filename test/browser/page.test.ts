import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { tmpdir } from 'node:os';
import { extname, join, resolve } from 'node:path';
import { parse } from 'csv-parse/sync';
import type { Browser, Page } from 'playwright-core';
import { chromium } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import type { InputError } from '../../src/errors.js';
import { writePage } from '../../src/page-command.js';
import { problemRows } from '../../src/problem-rows.js';
import { problemsCsv } from '../../src/problems/csv.js';
import type { Report } from '../../src/report/types.js';
import type { LoadedRoles } from '../../src/roles/load.js';
import { parseRoles } from '../../src/roles/load.js';
import { loadRoles } from '../../src/roles/load-file.js';

// One browser, one page, several uploads: the page built by `nestready page` for the demo role
// map, served on loopback, must give the library's findings and problem rows for the same file.
const CHROMIUM = '/usr/bin/chromium';
const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run'];
const ARGS_QUIET = ['--disable-background-networking', '--disable-component-update', '--disable-sync'];
const OUT = resolve('test-output');
const available = existsSync(CHROMIUM);
if (!available && process.env.CI) throw new Error(`${CHROMIUM} is missing: .ci/run should have installed chromium`);

const DEMO = 'fixtures/demo/repairs-delivery.csv';
const HSB = 'fixtures/reference/hsb.csv';
const HSB_ROLES = 'group: school\nunit: student\noutcome: mathach\nlevel1: [ses, minority, sex]\nlevel2: [sector, size, meanses]\n';
const TYPES: Record<string, string> = { '.html': 'text/html', '.js': 'text/javascript', '.wasm': 'application/wasm' };

/** What a finding is, apart from its wording. */
const gist = (r: Report) => ({
  verdict: r.verdict,
  grade: r.grade,
  rows: r.input.rows,
  findings: r.findings.map((f) => ({ rule: f.rule, messageId: f.messageId, severity: f.severity, groups: f.groups, rows: f.rows })),
});

/** Every number of a JSON value to 12 significant digits. */
const rounded = (v: unknown): unknown =>
  JSON.parse(JSON.stringify(v), (_, x) => (typeof x === 'number' && Number.isFinite(x) ? Number(x.toPrecision(12)) : x));

describe.skipIf(!available)("the sender's page in a real browser", () => {
  let browser: Browser;
  let page: Page;
  let server: Server;
  let dir: string;
  let origin: string;
  const requests: string[] = [];
  const dialogs: string[] = [];
  const demoRoles = loadRoles('fixtures/demo/repairs-delivery.roles.yaml', catalogue);

  beforeAll(async () => {
    mkdirSync(OUT, { recursive: true });
    dir = join(mkdtempSync(join(tmpdir(), 'nestready-page-')), 'page');
    writePage({ roles: 'fixtures/demo/repairs-delivery.roles.yaml', out: dir });
    server = createServer((req, res) => {
      const file = join(dir, new URL(req.url ?? '/', 'http://x').pathname);
      if (!file.startsWith(dir) || !existsSync(file) || file.endsWith('/')) {
        res.writeHead(404).end();
        return;
      }
      res.writeHead(200, { 'content-type': TYPES[extname(file)] ?? 'application/octet-stream' }).end(readFileSync(file));
    });
    await new Promise<void>((done) => server.listen(0, '127.0.0.1', done));
    const address = server.address();
    origin = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`;
    browser = await chromium.launch({ executablePath: CHROMIUM, args: [...ARGS, ...ARGS_QUIET], timeout: 15_000 });
    page = await browser.newPage({ viewport: { width: 1200, height: 900 }, acceptDownloads: true });
    page.on('request', (r) => requests.push(r.url()));
    page.on('dialog', async (d) => {
      dialogs.push(d.message());
      await d.dismiss();
    });
    await page.goto(`${origin}/index.html`);
    await page.waitForFunction(() => document.body.dataset.state === 'ready');
    await page.screenshot({ path: join(OUT, 'page-before.png') });
  }, 60_000);

  afterAll(async () => {
    await browser?.close();
    server?.close();
    if (dir) rmSync(resolve(dir, '..'), { recursive: true, force: true });
  });

  /** Pick a file in the page and wait for its verdict (or its error). */
  async function check(file: string): Promise<{ state: string; status: string }> {
    await page.setInputFiles('#nr-file', file);
    await page.waitForFunction(() => document.body.dataset.state !== 'working');
    await page.waitForFunction(() => ['done', 'error'].includes(document.body.dataset.state ?? ''), null, { timeout: 120_000 });
    return page.evaluate(() => ({
      state: document.body.dataset.state ?? '',
      status: document.getElementById('nr-status')?.textContent ?? '',
    }));
  }

  async function downloaded(id: string): Promise<string> {
    const [download] = await Promise.all([page.waitForEvent('download'), page.click(`#${id}`)]);
    return readFileSync((await download.path()) as string, 'utf8');
  }

  /** The page's report and problem rows of a file, against the library's with the same role map. */
  async function compare(file: string, roles: LoadedRoles) {
    expect((await check(file)).state).toBe('done');
    const json = JSON.parse(await downloaded('nr-get-json')) as Report;
    const csv = await downloaded('nr-get-rows');
    const expected = await audit(file, roles, { plotData: false });
    expect(gist(json)).toEqual(gist(expected));
    // statistics to 12 significant digits: the hostile delivery's ML optimum differed in its last
    // binary digit between DuckDB-WASM and the native binding (the demo's and HSB's agree exactly)
    expect(rounded(json.outcomes)).toEqual(rounded(expected.outcomes));
    expect(csv).toBe(problemsCsv(await problemRows(file, roles.roles, expected.findings)));
    return { json, csv };
  }

  it('gives the demo delivery the findings and problem rows of the command line', async () => {
    const { json } = await compare(DEMO, demoRoles);
    expect(json.findings.length).toBeGreaterThan(5);
    await page.screenshot({ path: join(OUT, 'page-after.png'), fullPage: false });
    const verdict = await page.textContent('#nr-verdict');
    expect(verdict).toContain('not-ready');
    // the report is the HTML renderer's, in the sandboxed frame
    const frame = page.frames().find((f) => f !== page.mainFrame());
    expect(await frame?.evaluate(() => document.querySelector('h1')?.textContent)).toBe('repairs-delivery.csv');
  }, 120_000);

  it('reads JSON, Parquet and Arrow deliveries as the command line does, and names Excel as not read here', async () => {
    await compare('fixtures/formats/repairs.ndjson', demoRoles);
    // decoded in the page (hyparquet) and staged with the types DuckDB's Parquet reader gives
    const { json } = await compare('fixtures/formats/repairs.parquet', demoRoles);
    expect(json.findings.length).toBeGreaterThan(5);
    await compare('fixtures/formats/repairs-zstd.arrows', demoRoles);
    const excel = await check('fixtures/formats/repairs.xlsx');
    expect(excel).toEqual({
      state: 'error',
      status: expect.stringMatching(/^repairs\.xlsx: Excel files cannot be read in this page/),
    });
  }, 120_000);

  it('takes a role map in its panel, with the errors of the command line', async () => {
    const bad = 'group: school\nlevel1: [ses\n';
    let cli = '';
    try {
      parseRoles(bad, 'role map', catalogue);
    } catch (e) {
      cli = (e as InputError).message;
    }
    expect(cli).toMatch(/^role map:\d+:\d+: /);
    await page.click('summary');
    await page.fill('#nr-roles-text', bad);
    await page.click('#nr-roles-use');
    expect(await page.textContent('#nr-roles-status')).toBe(cli);
    await page.fill('#nr-roles-text', HSB_ROLES);
    await page.click('#nr-roles-use');
    await compare(HSB, parseRoles(HSB_ROLES, 'role map', catalogue));
  }, 120_000);

  it('runs nothing a hostile delivery carries, and neutralises its cells in the download', async () => {
    await page.fill('#nr-roles-text', readFileSync('fixtures/demo/repairs-delivery.roles.yaml', 'utf8'));
    await page.click('#nr-roles-use');
    const lines = readFileSync(DEMO, 'utf8').split('\n');
    const header = lines[0].split(',');
    const col = (name: string) => header.indexOf(name);
    const hostile = ['<script>window.__nrPwned=1</script>', 'javascript:alert(1)', '=HYPERLINK("http://x")', '+1+1', '-2', '@SUM(1)'];
    // the first records' workshop and job IDs replaced: new groups, a duplicated job ID, a variant
    const rows = lines.slice(1, 40).map((l, i) => {
      const cells = l.split(',');
      const bad = hostile[i % hostile.length];
      cells[col('workshop')] = `"${bad.replace(/"/g, '""')}"`;
      if (i % 2 === 0) cells[col('job_id')] = `"${bad.replace(/"/g, '""')}"`;
      return cells.join(',');
    });
    const file = join(OUT, 'page-hostile.csv');
    writeFileSync(file, [lines[0], ...rows, ...lines.slice(40)].join('\n'));
    const { csv } = await compare(file, demoRoles);
    expect(await page.evaluate(() => (window as unknown as { __nrPwned?: number }).__nrPwned)).toBeUndefined();
    expect(dialogs).toEqual([]);
    const cells = (parse(csv, { relax_column_count: true, comment: '#' }) as string[][]).flat();
    expect(cells.some((c) => c.includes('__nrPwned'))).toBe(true);
    expect(cells.filter((c) => /^[=+\-@]/.test(c))).toEqual([]);
  }, 120_000);

  it('asks for nothing outside its own origin', () => {
    expect(requests.length).toBeGreaterThan(3);
    expect(requests.filter((u) => !u.startsWith(`${origin}/`) && !u.startsWith('blob:') && !u.startsWith('data:'))).toEqual([]);
  });
});
