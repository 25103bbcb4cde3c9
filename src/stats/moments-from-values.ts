import type { GroupMoments } from './types.js';

/**
 * Per-group count, mean and within-group sum of squares from raw values, by the corrected
 * two-pass algorithm.
 *
 * The first pass gives a provisional mean m; the second sums d = y − m and d², and
 * ss = Σd² − (Σd)²/n removes the rounding left in m. This avoids the cancellation of the
 * textbook Σy² − n ȳ² when values are large relative to their spread. Source: Chan, Golub &
 * LeVeque (1983), "Algorithms for computing the sample variance", *The American Statistician*
 * 37(3), the corrected two-pass algorithm. An empty group gives { n: 0, mean: NaN, ss: 0 },
 * which the estimators drop.
 *
 * @param values one array of values per group
 * @returns one GroupMoments per input array, in order
 * @throws when a value is not a finite number
 */
export function momentsFromValues(values: readonly (readonly number[])[]): GroupMoments[] {
  return values.map((group, groupIndex) => {
    const n = group.length;
    let sum = 0;
    group.forEach((y, i) => {
      if (!Number.isFinite(y)) {
        throw new Error(`values[${groupIndex}][${i}] must be a finite number, got ${y}`);
      }
      sum += y;
    });
    if (n === 0) return { n: 0, mean: NaN, ss: 0 };
    const provisional = sum / n;
    let sumDev = 0;
    let sumDevSquared = 0;
    for (const y of group) {
      const d = y - provisional;
      sumDev += d;
      sumDevSquared += d * d;
    }
    // Cauchy–Schwarz makes the difference ≥ 0 in exact arithmetic; clamp the rounding residue.
    const ss = Math.max(0, sumDevSquared - (sumDev * sumDev) / n);
    return { n, mean: provisional + sumDev / n, ss };
  });
}
