// @ts-check
// The compare case: `nestready compare PREV CUR` of two synthetic deliveries (seeds s and s + 1,
// the same record IDs in other sites: every unit "moves", the unit join's worst case), timed beside
// a JSON audit of the current delivery, alternating, with CPU time and peak RSS.
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { CLI, fmtInt, WORK } from './config.js';
import { delivery } from './runs.js';
import { timed } from './spawn.js';

/**
 * @typedef {object} CompareRun
 * @property {'audit' | 'compare'} kind
 * @property {boolean} ok
 * @property {number} wallMs
 * @property {number | null} cpuMs
 * @property {number | null} maxRssMB
 * @property {number} load1
 */

/**
 * @param {{ rows: number, groups: number, seed: number, repeat: number, rolesPath: string, memoryLimit?: string }} opt
 * @returns {Promise<{ rows: number, groups: number, runs: CompareRun[] }>}
 */
export async function runCompareCase(opt) {
  const prev = await delivery(opt.rows, opt.groups, opt.seed);
  const cur = await delivery(opt.rows, opt.groups, opt.seed + 1);
  const out = join(WORK, `compare-out-${process.pid}.json`);
  const limit = opt.memoryLimit ? ['--memory-limit', opt.memoryLimit] : [];
  const common = ['--roles', opt.rolesPath, '-f', 'json', '-o', out, ...limit];
  /** @type {CompareRun[]} */
  const runs = [];
  for (let i = 0; i < opt.repeat; i++) {
    for (const kind of /** @type {const} */ (['audit', 'compare'])) {
      process.stderr.write(`bench: compare case ${fmtInt(opt.rows)} rows, run ${i + 1}/${opt.repeat}: ${kind}\n`);
      const args = kind === 'audit' ? [CLI, 'audit', cur.path, ...common] : [CLI, 'compare', prev.path, cur.path, ...common];
      const p = await timed(args);
      runs.push({ kind, ok: p.code === 0 || p.code === 1, wallMs: p.wallMs, cpuMs: p.cpuMs, maxRssMB: p.maxRssMB, load1: p.load1 });
    }
  }
  rmSync(out, { force: true });
  return { rows: opt.rows, groups: opt.groups, runs };
}

/** @param {{ rows: number, groups: number, runs: CompareRun[] }} r */
export function printCompare(r) {
  const s = (/** @type {number | null} */ ms) => (ms === null ? 'n/a' : `${(ms / 1000).toFixed(2)} s`);
  const mb = (/** @type {number | null} */ x) => (x === null ? 'n/a' : `${Math.round(x)} MB`);
  console.log(`\ncompare: two deliveries of ${fmtInt(r.rows)} rows x ${fmtInt(r.groups)} groups (whole catalogue, JSON)`);
  for (let i = 0; i + 1 < r.runs.length; i += 2) {
    const [a, c] = [r.runs[i], r.runs[i + 1]];
    const ratio = (x = 0, y = 0) => (x && y ? `${(y / x).toFixed(2)}x` : 'n/a');
    console.log(
      `  run ${i / 2 + 1}: audit ${s(a.wallMs)} (cpu ${s(a.cpuMs)}, ${mb(a.maxRssMB)}), compare ${s(c.wallMs)} ` +
        `(cpu ${s(c.cpuMs)}, ${mb(c.maxRssMB)}); ratio ${ratio(a.wallMs, c.wallMs)} wall, ` +
        `${ratio(a.cpuMs ?? 0, c.cpuMs ?? 0)} cpu; load ${a.load1.toFixed(1)}${a.ok && c.ok ? '' : '  FAILED'}`,
    );
  }
}
