// @ts-check
// The compare case: `nestready compare PREV CUR` of two synthetic deliveries (seeds s and s + 1,
// the same record IDs in other sites: every unit "moves", the unit join's worst case), timed beside
// a JSON audit of the current delivery, alternating, with CPU time and peak RSS.
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { BIN, fmtInt, WORK } from './config.js';
import { printPaired, runPaired } from './paired.js';
import { delivery } from './runs.js';

/**
 * @param {{ rows: number, groups: number, seed: number, repeat: number, rolesPath: string, memoryLimit?: string }} opt
 * @returns {Promise<{ rows: number, groups: number, runs: import('./paired.js').PairedRun[] }>}
 */
export async function runCompareCase(opt) {
  const prev = await delivery(opt.rows, opt.groups, opt.seed);
  const cur = await delivery(opt.rows, opt.groups, opt.seed + 1);
  const out = join(WORK, `compare-out-${process.pid}.json`);
  const limit = opt.memoryLimit ? ['--memory-limit', opt.memoryLimit] : [];
  const common = ['--roles', opt.rolesPath, '-f', 'json', '-o', out, ...limit];
  const runs = await runPaired({
    name: 'compare',
    rows: opt.rows,
    repeat: opt.repeat,
    audit: [BIN, 'audit', cur.path, ...common],
    other: [BIN, 'compare', prev.path, cur.path, ...common],
  });
  rmSync(out, { force: true });
  return { rows: opt.rows, groups: opt.groups, runs };
}

/** @param {{ rows: number, groups: number, runs: import('./paired.js').PairedRun[] }} r */
export function printCompare(r) {
  printPaired(`compare: two deliveries of ${fmtInt(r.rows)} rows x ${fmtInt(r.groups)} groups (whole catalogue, JSON)`, 'compare', r.runs);
}
