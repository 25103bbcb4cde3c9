import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';
import type { GroupMoments } from '../../src/stats/index.js';
import { momentsFromValues } from '../../src/stats/index.js';

/** Relative errors seen by expectRel in this test file, for logRelativeErrors. */
const relativeErrors: { label: string; error: number }[] = [];

/**
 * Assert |actual − expected| ≤ tol·|expected| and record the relative error.
 *
 * @param actual computed value
 * @param expected reference value
 * @param tol relative tolerance
 * @param label name for the log of errors
 */
export function expectRel(actual: number, expected: number, tol: number, label = ''): void {
  const error = Math.abs(actual - expected) / Math.abs(expected);
  relativeErrors.push({ label, error });
  expect(error, `${label}: actual ${actual}, expected ${expected}, relative error ${error}`).toBeLessThanOrEqual(tol);
}

/**
 * Print every relative error expectRel recorded in this file and the largest one; call it from
 * afterAll so reference agreement is visible in the run log, not only pass/fail.
 */
export function logRelativeErrors(): void {
  if (relativeErrors.length === 0) return;
  const worst = relativeErrors.reduce((a, b) => (b.error > a.error ? b : a));
  const lines = relativeErrors.map((r) => `  ${r.label}: ${r.error.toExponential(2)}`);
  console.log(`${lines.join('\n')}\n  max relative error: ${worst.error.toExponential(2)} (${worst.label})`);
}

/**
 * Read a fixture CSV with a header row and no quoted fields.
 *
 * @param name file name under fixtures/reference
 * @returns one record per data row, keyed by column name
 */
export function readReferenceCsv(name: string): Record<string, string>[] {
  const path = fileURLToPath(new URL(`../../fixtures/reference/${name}`, import.meta.url));
  const [header, ...rows] = readFileSync(path, 'utf8').trim().split(/\r?\n/);
  const columns = header.split(',');
  return rows.map((row) => {
    const cells = row.split(',');
    return Object.fromEntries(columns.map((column, i) => [column, cells[i]]));
  });
}

/**
 * Values of one numeric column split by a grouping column, groups in first-seen order.
 *
 * @param records parsed CSV rows
 * @param groupColumn level-2 id column
 * @param valueColumn numeric column
 * @returns one array of values per group
 */
export function valuesByGroup(records: Record<string, string>[], groupColumn: string, valueColumn: string): number[][] {
  const groups = new Map<string, number[]>();
  for (const record of records) {
    const key = record[groupColumn];
    const values = groups.get(key) ?? [];
    values.push(Number(record[valueColumn]));
    groups.set(key, values);
  }
  return [...groups.values()];
}

/**
 * Group moments of one column of a reference CSV.
 *
 * @param name file name under fixtures/reference
 * @param groupColumn level-2 id column
 * @param valueColumn numeric column
 * @returns GroupMoments per group
 */
export function referenceMoments(name: string, groupColumn: string, valueColumn: string): GroupMoments[] {
  return momentsFromValues(valuesByGroup(readReferenceCsv(name), groupColumn, valueColumn));
}

import { mulberry32 } from '../helpers/prng.js';

export { mulberry32 };

/**
 * Seeded standard-normal generator by the Box–Muller transform (Box & Muller 1958).
 *
 * @param uniform a uniform [0, 1) generator
 * @returns a function returning the next N(0, 1) draw
 */
export function normalGenerator(uniform: () => number): () => number {
  return () => {
    // 1 − u is in (0, 1], so the log is finite.
    const u1 = 1 - uniform();
    const u2 = uniform();
    return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
  };
}

/**
 * Simulate y_ij = u_j + e_ij with Var(u) = icc and Var(e) = 1 − icc, so the true ICC is `icc`.
 *
 * @param sizes group sizes n_j
 * @param icc true intraclass correlation
 * @param seed PRNG seed
 * @returns one array of values per group
 */
export function simulateGroups(sizes: number[], icc: number, seed: number): number[][] {
  const normal = normalGenerator(mulberry32(seed));
  const tau = Math.sqrt(icc);
  const sigma = Math.sqrt(1 - icc);
  return sizes.map((n) => {
    const u = tau * normal();
    return Array.from({ length: n }, () => u + sigma * normal());
  });
}

/**
 * Integer sizes drawn uniformly from [min, max].
 *
 * @param count number of groups
 * @param min smallest size
 * @param max largest size
 * @param seed PRNG seed
 * @returns the sizes
 */
export function randomSizes(count: number, min: number, max: number, seed: number): number[] {
  const uniform = mulberry32(seed);
  return Array.from({ length: count }, () => min + Math.floor(uniform() * (max - min + 1)));
}
