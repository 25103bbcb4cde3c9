import type { ColumnProfile } from './types.js';

/**
 * The share of a declared variable's values that must be numbers for it to read as numbers: a
 * few stray tokens ("n/a", "<5") are reported by non-numeric-values rather than turning the
 * whole column into text.
 */
export const NUMBER_SHARE = 0.95;

/**
 * Whether counted values read as numbers: all of them are numbers, or the column is a declared
 * variable (outcome, level-1, level-2) and at least NUMBER_SHARE of them are.
 *
 * @param numericCount non-missing values that are numbers
 * @param nonMissing non-missing values
 * @param variable whether the role map declares the column as a variable
 */
export function mostlyNumbers(numericCount: number, nonMissing: number, variable: boolean): boolean {
  return numericCount > 0 && (numericCount === nonMissing || (variable && numericCount >= NUMBER_SHARE * nonMissing));
}

/**
 * Whether a profiled column reads as numbers: it has per-group number statistics and its type,
 * declared or inferred with mostlyNumbers, is not categorical. Rules, statistics and plots all
 * decide with this.
 */
export function readsAsNumbers(col: Pick<ColumnProfile, 'numericProfiled' | 'type'>): boolean {
  return col.numericProfiled && col.type !== 'categorical';
}
