// @ts-check
// One run of each side: the synthetic delivery, the bare DuckDB group-by, and the audit through
// bench-child.js (its result file says how the audit's time was spent).
import { existsSync, readFileSync, renameSync, rmSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { writeSynthetic } from '../synth.js';
import { BASELINE, CHILD, fmtInt, WORK } from './config.js';
import { timed } from './spawn.js';

/**
 * The result line bench-child.js writes.
 * @typedef {object} ChildResult
 * @property {number} maxRssMB
 * @property {number} exitCode
 * @property {{ kind: string, atMs: number, error: string } | null} failedQuery
 * @property {Record<string, number | null>} timings
 * @property {object[]} queries
 */
/**
 * @typedef {object} BaselineRun
 * @property {boolean} ok
 * @property {number} wallMs
 * @property {number | null} [cpuMs]
 * @property {number} load1
 * @property {number} [maxRssMB]
 * @property {number} [innerWallMs]
 * @property {number} [groups]
 * @property {string} [error]
 */
/**
 * @typedef {object} AuditRun
 * @property {boolean} ok
 * @property {boolean} [harness] true when bench-child.js itself broke (no result at all)
 * @property {number} wallMs
 * @property {number | null} [cpuMs]
 * @property {number} load1
 * @property {number} [maxRssMB]
 * @property {number} [exitCode]
 * @property {ChildResult['failedQuery']} [failedQuery]
 * @property {ChildResult['timings']} [timings]
 * @property {object[]} [queries]
 * @property {object | null} [report]
 * @property {string} [error]
 */

/**
 * The synthetic delivery for (rows, groups, seed): reused if present, else generated.
 * @param {number} rows
 * @param {number} groups
 * @param {number} seed
 */
export async function delivery(rows, groups, seed) {
  const path = join(WORK, `synth-r${rows}-g${groups}-s${seed}.csv`);
  if (existsSync(path)) return { path, generated: false, bytes: statSync(path).size, genMs: 0 };
  const part = `${path}.${process.pid}.part`; // renamed only once complete, so a present file is whole
  process.stderr.write(`bench: generating ${fmtInt(rows)} rows x ${fmtInt(groups)} groups -> ${path}\n`);
  try {
    const res = await writeSynthetic({ path: part, rows, groups, seed });
    renameSync(part, path);
    return { path, generated: true, bytes: res.bytes, genMs: res.ms };
  } catch (e) {
    rmSync(part, { force: true });
    throw e;
  }
}

/** @param {string} file @returns {Promise<BaselineRun>} */
export async function runBaseline(file) {
  const p = await timed([BASELINE, file, 'site_code']);
  let inner = null;
  try {
    inner = JSON.parse(p.stdout.trim().split('\n').pop() ?? '');
  } catch {
    // reported as an error below
  }
  if (p.code !== 0 || !inner) {
    return { ok: false, wallMs: p.wallMs, load1: p.load1, error: `exit ${p.code ?? p.signal}: ${p.stderr.trim().slice(0, 500)}` };
  }
  return {
    ok: true,
    wallMs: p.wallMs,
    cpuMs: p.cpuMs,
    load1: p.load1,
    maxRssMB: inner.maxRssMB,
    innerWallMs: inner.wallMs,
    groups: inner.groups,
  };
}

/**
 * @param {string} file
 * @param {string} roles
 * @param {string} tag names the report and result files
 * @param {{ memoryLimit?: string, keep: boolean }} opt
 * @returns {Promise<AuditRun>}
 */
export async function runAudit(file, roles, tag, opt) {
  const out = join(WORK, `report-${tag}.json`);
  const resultFile = join(WORK, `child-${tag}.json`);
  rmSync(resultFile, { force: true });
  const args = [CHILD, file, roles, out];
  if (opt.memoryLimit) args.push(opt.memoryLimit);
  const p = await timed(args, { NESTREADY_BENCH_RESULT: resultFile });
  /** @type {ChildResult | null} */
  let res = null;
  try {
    res = JSON.parse(readFileSync(resultFile, 'utf8'));
  } catch {
    // reported below
  }
  rmSync(resultFile, { force: true });
  if (!res) {
    // no result line at all: the harness itself broke (bench-child.js did not get past main)
    const error = `no result from bench-child.js (exit ${p.code ?? p.signal}): ${p.stderr.trim().slice(0, 500)}`;
    return { ok: false, harness: true, wallMs: p.wallMs, load1: p.load1, error };
  }
  const { maxRssMB, exitCode, timings, queries } = res;
  // 0 and 1 are gate results (1 = a blocker finding); 2/3 mean the audit did not run through
  if (exitCode !== 0 && exitCode !== 1) {
    if (!opt.keep) rmSync(out, { force: true });
    const msg = (p.stderr.trim().split('\n')[0] || '').replace(/^nestready: /, '');
    const { wallMs, cpuMs, load1 } = p;
    return {
      ok: false,
      wallMs,
      cpuMs,
      load1,
      maxRssMB,
      exitCode,
      failedQuery: res.failedQuery,
      timings,
      queries,
      error: `exit ${exitCode}: ${msg}`,
    };
  }
  let report = null;
  try {
    const r = JSON.parse(readFileSync(out, 'utf8'));
    /** @type {{ rule?: string, id?: string }[]} */
    const findings = r.findings ?? [];
    report = {
      rows: r.input?.rows,
      groups: r.groups?.count,
      grade: r.grade ?? null,
      verdict: r.verdict ?? null,
      findings: findings.map((f) => f.rule ?? f.id),
    };
  } catch {
    // a report is not needed for the figures
  }
  if (!opt.keep) rmSync(out, { force: true });
  return { ok: true, wallMs: p.wallMs, cpuMs: p.cpuMs, load1: p.load1, maxRssMB, exitCode, timings, queries, report };
}
