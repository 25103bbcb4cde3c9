/**
 * Histogram of group sizes: one entry per distinct size, ascending. Its length is the number of
 * distinct sizes, so it stays small for a million groups.
 *
 * @example sizeHistogram([3, 1, 3]) // => [{ size: 1, count: 1 }, { size: 3, count: 2 }]
 */
export function sizeHistogram(sizes: readonly number[]): { size: number; count: number }[] {
  const counts = new Map<number, number>();
  for (const n of sizes) counts.set(n, (counts.get(n) ?? 0) + 1);
  return [...counts.entries()].sort((a, b) => a[0] - b[0]).map(([size, count]) => ({ size, count }));
}
