/**
 * Population stability index of two binned distributions:
 * PSI = Σ_b (a_b − e_b) · ln(a_b / e_b), e the previous (expected) share of bin b, a the current.
 * Source: Siddiqi, N. (2006). *Credit Risk Scorecards: Developing and Implementing Intelligent
 * Credit Scoring*. Wiley, ch. 8 (the index, with bands < 0.10 little shift, 0.10–0.25 some,
 * > 0.25 a major shift; recalled from memory). A bin empty in one delivery has no logarithm: shares
 * are floored at `floor` (1e-4 by default, common practice), bins empty in both are skipped.
 *
 * @param expected counts per bin in the previous delivery
 * @param actual counts per bin in the current delivery, the same bins
 * @example
 * populationStability([50, 50], [50, 50]); // => 0
 */
export function populationStability(expected: readonly number[], actual: readonly number[], floor = 1e-4): number {
  const te = expected.reduce((s, x) => s + x, 0);
  const ta = actual.reduce((s, x) => s + x, 0);
  if (!(te > 0 && ta > 0)) return Number.NaN;
  let psi = 0;
  for (let b = 0; b < expected.length; b++) {
    if (expected[b] === 0 && actual[b] === 0) continue;
    const e = Math.max(expected[b] / te, floor);
    const a = Math.max(actual[b] / ta, floor);
    psi += (a - e) * Math.log(a / e);
  }
  return psi;
}
