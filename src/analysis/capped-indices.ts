/**
 * Which positions of a sorted list of `total` items to keep when at most `max` may be shown:
 * all of them when they fit; otherwise the `ends` lowest and `ends` highest (the groups a reader
 * looks for first) and an evenly spaced sample of the rest, so the sorted curve keeps its shape.
 *
 * @returns ascending 0-based positions, at most `max` of them
 */
export function cappedIndices(total: number, max: number, ends: number): number[] {
  if (total <= max) return Array.from({ length: total }, (_, i) => i);
  const keepEnds = Math.min(ends, Math.floor(max / 2));
  const middle = max - 2 * keepEnds;
  const out: number[] = [];
  for (let i = 0; i < keepEnds; i++) out.push(i);
  // middle positions keepEnds … total−keepEnds−1, sampled at even steps
  const from = keepEnds;
  const span = total - 2 * keepEnds;
  for (let k = 0; k < middle; k++) out.push(from + Math.floor(((k + 0.5) * span) / middle));
  for (let i = total - keepEnds; i < total; i++) out.push(i);
  return out;
}
