#!/usr/bin/env node
// @ts-check
// The page against the command line on one synthetic delivery (not part of npm test):
//
//   npm run build && node scripts/bench/page.js [--rows 1000000] [--groups 5000]
//
// Writes the delivery (scripts/synth.js, its ten columns) and the page for its role map, times
// `nestready audit` on it, then the page in headless chromium (served on loopback) from the pick
// to the verdict, and prints both, their ratio, the page's size on disk and its load time.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:http';
import { tmpdir } from 'node:os';
import { extname, join, resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { chromium } from 'playwright-core';
import { writeSynthetic } from '../synth.js';
import { ROLES_YAML } from './config.js';

const { values } = parseArgs({ options: { rows: { type: 'string', default: '1000000' }, groups: { type: 'string', default: '5000' } } });
const root = resolve(import.meta.dirname, '../..');
const work = mkdtempSync(join(tmpdir(), 'nestready-bench-page-'));
try {
  const delivery = join(work, 'delivery.csv');
  const roles = join(work, 'roles.yaml');
  writeFileSync(roles, ROLES_YAML);
  await writeSynthetic({ path: delivery, rows: Number(values.rows), groups: Number(values.groups), seed: 1 });
  const pageDir = join(work, 'page');
  execFileSync(process.execPath, [join(root, 'bin/nestready.js'), 'page', '-q', '--roles', roles, '--out', pageDir]);

  let t = performance.now();
  try {
    execFileSync(process.execPath, [join(root, 'bin/nestready.js'), 'audit', delivery, '--roles', roles, '-q', '--format', 'json'], {
      stdio: ['ignore', 'ignore', 'inherit'],
    });
  } catch (e) {
    if (/** @type {{ status?: number }} */ (e).status !== 1) throw e;
  }
  const cli = (performance.now() - t) / 1000;

  const types = /** @type {Record<string, string>} */ ({ '.html': 'text/html', '.js': 'text/javascript', '.wasm': 'application/wasm' });
  const server = createServer((req, res) => {
    const file = join(pageDir, new URL(req.url ?? '/', 'http://x').pathname);
    if (!existsSync(file) || statSync(file).isDirectory()) return void res.writeHead(404).end();
    res.writeHead(200, { 'content-type': types[extname(file)] ?? 'application/octet-stream' }).end(readFileSync(file));
  });
  await new Promise((done) => server.listen(0, '127.0.0.1', () => done(undefined)));
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu'] });
  try {
    const page = await browser.newPage();
    page.on('pageerror', (e) => process.stderr.write(`page error: ${e}\n`));
    t = performance.now();
    await page.goto(`http://127.0.0.1:${port}/index.html`);
    await page.waitForFunction(() => document.body.dataset.state === 'ready');
    const load = (performance.now() - t) / 1000;
    t = performance.now();
    await page.setInputFiles('#nr-file', delivery);
    await page.waitForFunction(() => ['done', 'error'].includes(document.body.dataset.state ?? ''), null, { timeout: 1_800_000 });
    const inPage = (performance.now() - t) / 1000;
    const status = await page.textContent('#nr-status');
    const size = readdirSync(pageDir).reduce((sum, f) => sum + statSync(join(pageDir, f)).size, 0);
    const mb = (/** @type {number} */ n) => `${(n / 1e6).toFixed(1)} MB`;
    process.stdout.write(
      `delivery ${values.rows} rows x 10 columns, ${mb(statSync(delivery).size)}\n` +
        `cli  ${cli.toFixed(2)} s (process start to exit)\n` +
        `page ${inPage.toFixed(2)} s (pick to verdict, engine start included; ${status})\n` +
        `ratio ${(inPage / cli).toFixed(2)}\npage on disk ${mb(size)}, loaded in ${load.toFixed(2)} s\n`,
    );
  } finally {
    await browser.close();
    server.close();
  }
} finally {
  rmSync(work, { recursive: true, force: true });
}
