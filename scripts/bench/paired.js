// @ts-check
// A command timed beside a JSON audit of the same delivery, alternating, with CPU time and peak
// RSS: the compare and draft cases (their targets are ratios to one audit).
import { fmtInt } from './config.js';
import { timed } from './spawn.js';

/**
 * @typedef {object} PairedRun
 * @property {string} kind 'audit' or the other command's name
 * @property {boolean} ok
 * @property {number} wallMs
 * @property {number | null} cpuMs
 * @property {number | null} maxRssMB
 * @property {number} load1
 */

/**
 * @param {{ name: string, rows: number, repeat: number, audit: string[], other: string[] }} opt
 *   the arguments of the two processes (node and the script first)
 * @returns {Promise<PairedRun[]>}
 */
export async function runPaired(opt) {
  /** @type {PairedRun[]} */
  const runs = [];
  for (let i = 0; i < opt.repeat; i++) {
    for (const kind of ['audit', opt.name]) {
      process.stderr.write(`bench: ${opt.name} case ${fmtInt(opt.rows)} rows, run ${i + 1}/${opt.repeat}: ${kind}\n`);
      const p = await timed(kind === 'audit' ? opt.audit : opt.other);
      runs.push({ kind, ok: p.code === 0 || p.code === 1, wallMs: p.wallMs, cpuMs: p.cpuMs, maxRssMB: p.maxRssMB, load1: p.load1 });
    }
  }
  return runs;
}

/** @param {string} title @param {string} name @param {PairedRun[]} runs */
export function printPaired(title, name, runs) {
  const s = (/** @type {number | null} */ ms) => (ms === null ? 'n/a' : `${(ms / 1000).toFixed(2)} s`);
  const mb = (/** @type {number | null} */ x) => (x === null ? 'n/a' : `${Math.round(x)} MB`);
  console.log(`\n${title}`);
  for (let i = 0; i + 1 < runs.length; i += 2) {
    const [a, c] = [runs[i], runs[i + 1]];
    const ratio = (x = 0, y = 0) => (x && y ? `${(y / x).toFixed(2)}x` : 'n/a');
    console.log(
      `  run ${i / 2 + 1}: audit ${s(a.wallMs)} (cpu ${s(a.cpuMs)}, ${mb(a.maxRssMB)}), ${name} ${s(c.wallMs)} ` +
        `(cpu ${s(c.cpuMs)}, ${mb(c.maxRssMB)}); ratio ${ratio(a.wallMs, c.wallMs)} wall, ` +
        `${ratio(a.cpuMs ?? 0, c.cpuMs ?? 0)} cpu; load ${a.load1.toFixed(1)}${a.ok && c.ok ? '' : '  FAILED'}`,
    );
  }
}
