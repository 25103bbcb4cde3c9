// @ts-check
// The batch case: `nestready audit FOLDER` over many synthetic deliveries at once (the issue's
// 20 deliveries x 50,000 rows), timed and measured like the other cases, beside a bare DuckDB
// group-by over all of the folder's files in one query.
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { writeSynthetic } from '../synth.js';
import { BASELINE, CHILD, fmtInt, WORK } from './config.js';
import { timed } from './spawn.js';

/**
 * @typedef {object} BatchResult
 * @property {number} deliveries
 * @property {number} rows rows per delivery
 * @property {number} groups groups per delivery
 * @property {boolean} ok
 * @property {number} wallMs the whole `nestready audit FOLDER` process, Node start-up included
 * @property {number | null} cpuMs
 * @property {number | null} maxRssMB peak RSS of the batch's process: the audits run in it (DuckDB's threads
 *   too), so it is the whole tree's
 * @property {number | null} baselineWallMs one DuckDB group-by over every file of the folder (read_csv of a glob)
 * @property {number | null} baselineMaxRssMB
 * @property {number | null} baselineCpuMs
 * @property {number} load1
 * @property {number | null} exitCode
 * @property {Record<string, number> | null} counts the summary's tallies
 * @property {string} [error]
 */

/**
 * The folder of `deliveries` synthetic deliveries (reused when an earlier run kept it).
 * @param {number} deliveries @param {number} rows @param {number} groups @param {number} seed
 */
async function batchFolder(deliveries, rows, groups, seed) {
  const dir = join(WORK, `batch-${deliveries}x${rows}-g${groups}-s${seed}`);
  if (existsSync(join(dir, '.complete'))) return dir;
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  process.stderr.write(`bench: generating ${deliveries} deliveries of ${fmtInt(rows)} rows x ${fmtInt(groups)} groups -> ${dir}\n`);
  for (let i = 0; i < deliveries; i++) {
    const name = `sender${String(i + 1).padStart(2, '0')}_synth.csv`;
    await writeSynthetic({ path: join(dir, name), rows, groups, seed: seed * 1000 + i });
  }
  // a marker written last: a folder cut short by an interrupted run is made again
  writeFileSync(join(dir, '.complete'), '');
  return dir;
}

/**
 * One run of the batch case: the group-by baseline, then the batch with a report folder per
 * delivery (HTML, JSON, problem rows) and the JSON summary, through bench-child.js.
 * @param {{ deliveries: number, rows: number, groups: number, seed: number, memoryLimit?: string, rolesPath: string, keep: boolean }} opt
 * @returns {Promise<BatchResult>}
 */
export async function runBatchCase(opt) {
  const { deliveries, rows, groups, seed } = opt;
  const dir = await batchFolder(deliveries, rows, groups, seed);
  const base = await timed([BASELINE, join(dir, '*.csv'), 'site_code']);
  /** @type {{ wallMs: number, maxRssMB: number } | null} */
  let inner = null;
  try {
    inner = JSON.parse(base.stdout.trim().split('\n').pop() ?? '');
  } catch {
    // reported as null figures
  }
  const out = join(WORK, `batch-out-${deliveries}x${rows}-s${seed}`);
  rmSync(out, { recursive: true, force: true });
  mkdirSync(out, { recursive: true });
  const resultFile = join(out, 'child.json');
  const args = [CHILD, dir, opt.rolesPath, join(out, 'summary.json')];
  if (opt.memoryLimit) args.push(opt.memoryLimit);
  const p = await timed(args, {
    NESTREADY_BENCH_RESULT: resultFile,
    NESTREADY_BENCH_EXTRA: JSON.stringify(['--reports-dir', join(out, 'reports'), '--quiet']),
  });
  /** @type {{ maxRssMB: number, exitCode: number } | null} */
  let res = null;
  /** @type {Record<string, number> | null} */
  let counts = null;
  try {
    res = JSON.parse(readFileSync(resultFile, 'utf8'));
    counts = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8')).counts;
  } catch {
    // reported below
  }
  if (!opt.keep) rmSync(out, { recursive: true, force: true });
  const ok = res !== null && counts !== null && (res.exitCode === 0 || res.exitCode === 1);
  return {
    deliveries,
    rows,
    groups,
    ok,
    wallMs: p.wallMs,
    cpuMs: p.cpuMs,
    maxRssMB: res?.maxRssMB ?? null,
    baselineWallMs: inner ? base.wallMs : null,
    baselineMaxRssMB: inner?.maxRssMB ?? null,
    baselineCpuMs: inner ? base.cpuMs : null,
    load1: p.load1,
    exitCode: res?.exitCode ?? p.code,
    counts,
    ...(!ok && { error: `exit ${res?.exitCode ?? p.code}: ${p.stderr.trim().split('\n')[0] ?? ''}` }),
  };
}

/** @param {BatchResult} r */
export function printBatch(r) {
  const s = (/** @type {number | null} */ ms) => (ms === null ? 'n/a' : `${(ms / 1000).toFixed(2)} s`);
  const mb = (/** @type {number | null} */ x) => (x === null ? 'n/a' : `${Math.round(x)} MB`);
  console.log(
    `\nbatch: ${r.deliveries} deliveries x ${fmtInt(r.rows)} rows x ${fmtInt(r.groups)} groups` +
      ' (a report folder each: HTML, JSON, problem rows; JSON summary)\n' +
      `  nestready audit FOLDER  wall ${s(r.wallMs)}, cpu ${s(r.cpuMs)}, peak RSS ${mb(r.maxRssMB)}, load ${r.load1.toFixed(2)}` +
      `${r.ok ? '' : `  FAILED (${r.error})`}\n` +
      `  DuckDB group-by of all ${r.deliveries} files in one query  wall ${s(r.baselineWallMs)}, cpu ${s(r.baselineCpuMs)}, ` +
      `peak RSS ${mb(r.baselineMaxRssMB)}` +
      (r.baselineWallMs ? `\n  ratio ${(r.wallMs / r.baselineWallMs).toFixed(2)}x wall` : '') +
      (r.cpuMs && r.baselineCpuMs ? `, ${(r.cpuMs / r.baselineCpuMs).toFixed(2)}x cpu` : '') +
      (r.counts ? `\n  summary: ${JSON.stringify(r.counts)}` : ''),
  );
}
