import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { gzipSync } from 'node:zlib';
import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BatchRow, BatchSummary } from '../../src/batch/types.js';
import { batchSchema } from '../../src/report/batch-schema.js';
import { createAjv } from '../../src/util/ajv.js';
import type { Run } from '../helpers/cli.js';
import { nestready } from '../helpers/cli.js';

// Deliveries cut from the demo by network, each as one sender would send it: the clean file's
// rows of a network are ready (the two group-count rules are off: a network has 7-14 workshops),
// the delivery's rows of a network keep the planted defects there (fixtures/demo/README.md).
const ROLES = `group: workshop
unit: job_id
parent: network
outcomes: [repair_minutes]
level1: [item_kind, item_age_years, helpers]
level2: [workshop_format, benches, opened_year]
missing: ["", "NA", "-999"]
types: { fixed: binary }
rules: { few-groups: off, groups-per-level2-predictor: off }
`;

type Table = string[][];
const read = (file: string): Table => parse(readFileSync(file), { relax_column_count: true }) as Table;
const field = (v: string) => (/[",\r\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v);
const csv = (t: Table, sep = ',') => `${t.map((r) => r.map(field).join(sep)).join('\n')}\n`;
const network = (t: Table, name: string): Table => [t[0], ...t.slice(1).filter((r) => r[t[0].indexOf('network')] === name)];

let dir: string;
/** each readable delivery's records as written: [header, ...records] */
const inputs = new Map<string, Table>();
const runs: Record<string, Run> = {};
let summary: BatchSummary;

async function writeParquet(t: Table, path: string): Promise<void> {
  const source = `${path}.source.csv`;
  writeFileSync(source, csv(t));
  const { DuckDBInstance } = await import('@duckdb/node-api');
  const db = await DuckDBInstance.create(':memory:', { threads: '1' });
  const con = await db.connect();
  try {
    await con.run(`COPY (SELECT * FROM read_csv('${source}', header = true, all_varchar = true)) TO '${path}' (FORMAT parquet)`);
  } finally {
    con.closeSync();
    db.closeSync();
    rmSync(source);
  }
}

const inDir = (name: string) => join(dir, 'in', name);
const cli = (...args: string[]) => nestready(...args.map((a) => (a.startsWith('@') ? join(dir, a.slice(1)) : a)));

beforeAll(async () => {
  if (!existsSync('dist/bundle/cli.js')) throw new Error('dist/bundle/cli.js is missing: run `npm run build` first (npm test does)');
  dir = mkdtempSync(join(tmpdir(), 'nestready-batch-'));
  mkdirSync(join(dir, 'in', 'old'), { recursive: true });
  mkdirSync(join(dir, 'sum'));
  writeFileSync(join(dir, 'roles.yaml'), ROLES);
  const clean = read('fixtures/demo/repairs-clean.csv');
  const defective = read('fixtures/demo/repairs-delivery.csv');
  const put = (name: string, t: Table) => inputs.set(inDir(name), t);
  put('amber_jan.csv', network(clean, 'amber'));
  writeFileSync(inDir('amber_jan.csv'), csv(network(clean, 'amber')));
  put('birch_jan.csv.gz', network(clean, 'birch'));
  writeFileSync(inDir('birch_jan.csv.gz'), gzipSync(csv(network(clean, 'birch'))));
  put('cobalt_jan.parquet', network(defective, 'cobalt'));
  await writeParquet(network(defective, 'cobalt'), inDir('cobalt_jan.parquet'));
  const ember = network(defective, 'ember');
  put('ember_jan.ndjson', ember);
  const objects = ember.slice(1).map((r) => JSON.stringify(Object.fromEntries(ember[0].map((h, i) => [h, r[i]]))));
  writeFileSync(inDir('ember_jan.ndjson'), `${objects.join('\n')}\n`);
  // unreadable: a header and no record; a file without the group column
  writeFileSync(inDir('fern_jan.csv'), csv([clean[0]]));
  writeFileSync(
    inDir('dune_jan.tsv'),
    csv(
      [
        ['job_id', 'minutes'],
        ['J1', '3'],
      ],
      '\t',
    ),
  );
  writeFileSync(inDir('README.md'), '# deliveries of January\n');
  put('old/amber_dec.csv', network(clean, 'amber').slice(0, 300));
  writeFileSync(inDir('old/amber_dec.csv'), csv(network(clean, 'amber').slice(0, 300)));

  const common = ['--roles', '@roles.yaml', '--at-once', '2', '-q'];
  const [folder, list, blocker, warning] = await Promise.all([
    // a folder: every format, the summary in three files, each delivery's files under rep/
    cli(
      'audit',
      '@in',
      ...common,
      '--reports-dir',
      '@rep',
      '--sender-from',
      '^(?<sender>[a-z]+)_',
      '--fail-on',
      'warning',
      '--out',
      '@sum/batch.json',
      '--out',
      '@sum/batch.html',
      '--out',
      '@sum/batch.md',
    ),
    // a list (as a shell expands one): two senders named alike; the gate set to never
    cli(
      'audit',
      '@in/amber_jan.csv',
      '@in/old/amber_dec.csv',
      '@in/cobalt_jan.parquet',
      ...common,
      '--reports-dir',
      '@rep2',
      '--sender-from',
      '^([a-z]+)_',
      '--fail-on',
      'never',
      '-f',
      'json',
    ),
    // a quoted pattern, once per gate
    cli('audit', `${dir}/in/[ae]*_jan.*`, ...common, '--fail-on', 'blocker'),
    cli('audit', `${dir}/in/[ae]*_jan.*`, ...common, '--fail-on', 'warning', '-f', 'json'),
  ]);
  Object.assign(runs, { folder, list, blocker, warning });
  summary = JSON.parse(readFileSync(join(dir, 'sum/batch.json'), 'utf8'));
}, 60_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const row = (s: BatchSummary, file: string): BatchRow => s.deliveries.find((r) => r.file.endsWith(file))!;

describe('nestready audit of a folder', () => {
  it('exits 2 (an unreadable delivery beats a failed gate) and writes a summary the schema accepts', () => {
    expect(runs.folder.code, runs.folder.stderr).toBe(2);
    expect(runs.folder.stderr).toBe('');
    const validate = createAjv({ checkSchemas: true }).compile(batchSchema);
    expect(validate(summary), JSON.stringify(validate.errors)).toBe(true);
    expect(summary).toMatchObject({ schema: 'nestready/batch@1', failOn: 'warning', exitCode: 2 });
    expect(summary.counts).toEqual({ deliveries: 6, unreadable: 2, notReady: 1, caveats: 1, ready: 2, skipped: 1 });
  });

  it('has one row per delivery, worst first: unreadable, not ready, caveats, ready, then by name', () => {
    const order = summary.deliveries.map((r) => [r.file.slice(dir.length + 4), r.status === 'audited' ? r.verdict : r.status]);
    expect(order).toEqual([
      ['dune_jan.tsv', 'unreadable'],
      ['fern_jan.csv', 'unreadable'],
      ['cobalt_jan.parquet', 'not-ready'],
      ['ember_jan.ndjson', 'caveats'],
      ['amber_jan.csv', 'ready'],
      ['birch_jan.csv.gz', 'ready'],
    ]);
    expect(summary.deliveries.map((r) => r.sender)).toEqual(['dune', 'fern', 'cobalt', 'ember', 'amber', 'birch']);
    // the subfolder is not searched without --recurse; a file whose name names no format is listed
    expect(summary.skipped).toEqual([{ file: inDir('README.md'), reason: 'its name names no delivery format' }]);
  });

  it('gives an unreadable delivery its one-line error, and an audited one its counts, records, groups and ICC', () => {
    expect(row(summary, 'fern_jan.csv')).toMatchObject({
      status: 'unreadable',
      gate: 'fail',
      error: 'fern_jan.csv: no records (a header and nothing under it)',
    });
    expect(row(summary, 'dune_jan.tsv').error).toMatch(/column "workshop" is not in dune_jan\.tsv/);
    for (const r of summary.deliveries) expect(r.error ?? '').not.toContain('\n');
    const cobalt = row(summary, 'cobalt_jan.parquet');
    // the demo's planted defects in network cobalt (fixtures/demo/README.md): a workshop attribute
    // that varies and records without a workshop block; a repeated job ID and "n/a" minutes warn
    expect(cobalt).toMatchObject({ verdict: 'not-ready', grade: 'F', blockers: 2, warnings: 2, gate: 'fail', folder: 'cobalt' });
    for (const [file, t] of inputs) {
      const r = summary.deliveries.find((x) => x.file === file);
      if (!r) continue;
      expect(r.records, file).toBe(t.length - 1);
      expect(r.groups, file).toBe(
        new Set(
          t
            .slice(1)
            .map((x) => x[t[0].indexOf('workshop')])
            .filter((w) => w !== '' && w !== 'NA'),
        ).size,
      );
      expect(r.icc?.repair_minutes, file).toBeGreaterThan(0);
    }
  });

  it("writes each delivery's reports and problem rows under its sender's folder, with only that sender's records", () => {
    for (const r of summary.deliveries.filter((x) => x.status === 'audited')) {
      const input = inputs.get(r.file)!;
      const [h, records] = [input[0], input.slice(1)];
      const report = JSON.parse(readFileSync(join(dir, 'rep', r.folder!, 'report.json'), 'utf8'));
      expect(report.input.path).toBe(r.file.split('/').pop()); // the sender's own file name, not the manager's folders
      expect(report.verdict).toBe(r.verdict);
      expect(readFileSync(join(dir, 'rep', r.folder!, 'report.html'), 'utf8')).toMatch(/^<!DOCTYPE html>/);
      const problems = parse(readFileSync(join(dir, 'rep', r.folder!, 'problem-rows.csv')), { columns: true }) as Record<string, string>[];
      if (r.verdict !== 'ready') expect(problems.length, r.file).toBeGreaterThan(0);
      for (const p of problems) {
        if (p.record === '') continue;
        // the record numbered so in this delivery is the one named: its unit and group IDs match
        const rec = records[Number(p.record) - 1];
        expect(rec, `${r.file} record ${p.record}`).toBeDefined();
        expect(p.unit).toBe(rec[h.indexOf('job_id')]);
        expect(p.group).toBe(['', 'NA'].includes(rec[h.indexOf('workshop')]) ? '' : rec[h.indexOf('workshop')]);
      }
    }
    expect(existsSync(join(dir, 'rep', 'fern'))).toBe(false); // an unreadable delivery has no report
  });

  it('links each delivery of the HTML and Markdown summaries to files that exist', () => {
    const html = readFileSync(join(dir, 'sum/batch.html'), 'utf8');
    const md = readFileSync(join(dir, 'sum/batch.md'), 'utf8');
    const htmlLinks = [...html.matchAll(/href="([^"#]+)"/g)].map((m) => m[1]);
    const mdLinks = [...md.matchAll(/\]\(([^)]+)\)/g)].map((m) => m[1]);
    expect(htmlLinks).toHaveLength(4 * 3);
    expect(mdLinks).toHaveLength(4 * 3);
    for (const link of [...htmlLinks, ...mdLinks]) expect(existsSync(resolve(join(dir, 'sum'), decodeURIComponent(link))), link).toBe(true);
    expect(htmlLinks[0]).toBe('../rep/cobalt/report.html');
    expect(summary.deliveries[2].files).toEqual({
      html: '../rep/cobalt/report.html',
      json: '../rep/cobalt/report.json',
      problems: '../rep/cobalt/problem-rows.csv',
    });
    expect(html).not.toMatch(/<script/i);
  });
});

describe('nestready audit of a list and of a pattern', () => {
  it('tells senders named alike apart by number, in file-name order; --fail-on never passes a batch with blockers', () => {
    expect(runs.list.code, runs.list.stderr).toBe(0);
    const s: BatchSummary = JSON.parse(runs.list.stdout);
    expect(s.deliveries.map((r) => [r.sender, r.folder])).toEqual([
      ['cobalt', 'cobalt'],
      ['amber', 'amber'],
      ['amber', 'amber-2'],
    ]);
    expect(row(s, 'old/amber_dec.csv').records).toBe(299);
    expect(existsSync(join(dir, 'rep2', 'amber-2', 'problem-rows.csv'))).toBe(true);
    expect(s.deliveries.every((r) => r.gate === 'pass')).toBe(true);
  });

  it('expands a quoted pattern; the gate follows --fail-on (blocker: 0, warning: 1)', () => {
    expect(runs.blocker.code, runs.blocker.stderr).toBe(0);
    expect(runs.blocker.stdout).toMatch(/^nestready batch: 2 deliveries: 1 with caveats, 1 ready\n/);
    expect(runs.blocker.stdout).toMatch(/◆ caveats +\/\S+ember_jan\.ndjson +ember_jan +B/);
    expect(runs.warning.code, runs.warning.stderr).toBe(1);
    const s: BatchSummary = JSON.parse(runs.warning.stdout);
    expect(s.deliveries.map((r) => [r.sender, r.gate])).toEqual([
      ['ember_jan', 'fail'],
      ['amber_jan', 'pass'],
    ]);
    expect(s.deliveries[0].files).toBeUndefined(); // no --reports-dir: the summary alone
  });
});
