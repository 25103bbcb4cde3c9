// @ts-check
// The draft case: `nestready draft FILE` of a synthetic delivery (10 columns), timed beside a
// JSON audit of the same file with the bench's role map, alternating, with CPU time and peak RSS.
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { BIN, fmtInt, WORK } from './config.js';
import { printPaired, runPaired } from './paired.js';
import { delivery } from './runs.js';

/**
 * @param {{ rows: number, groups: number, seed: number, repeat: number, rolesPath: string, memoryLimit?: string }} opt
 * @returns {Promise<{ rows: number, groups: number, runs: import('./paired.js').PairedRun[] }>}
 */
export async function runDraftCase(opt) {
  const d = await delivery(opt.rows, opt.groups, opt.seed);
  const out = join(WORK, `draft-out-${process.pid}`);
  const limit = opt.memoryLimit ? ['--memory-limit', opt.memoryLimit] : [];
  const runs = await runPaired({
    name: 'draft',
    rows: opt.rows,
    repeat: opt.repeat,
    audit: [BIN, 'audit', d.path, '--roles', opt.rolesPath, '-f', 'json', '-o', `${out}.json`, ...limit],
    other: [BIN, 'draft', d.path, '-q', '-o', `${out}.yaml`, ...limit],
  });
  rmSync(`${out}.json`, { force: true });
  rmSync(`${out}.yaml`, { force: true });
  return { rows: opt.rows, groups: opt.groups, runs };
}

/** @param {{ rows: number, groups: number, runs: import('./paired.js').PairedRun[] }} r */
export function printDraft(r) {
  printPaired(
    `draft: one delivery of ${fmtInt(r.rows)} rows x ${fmtInt(r.groups)} groups, 10 columns (audit: whole catalogue, JSON)`,
    'draft',
    r.runs,
  );
}
