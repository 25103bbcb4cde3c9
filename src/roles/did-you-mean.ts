/** Edit distance (insertions, deletions, substitutions, adjacent swaps) between two short names. */
function distance(a: string, b: string): number {
  const d: number[][] = Array.from({ length: a.length + 1 }, (_, i) => [i, ...Array<number>(b.length).fill(0)]);
  for (let j = 1; j <= b.length; j++) d[0][j] = j;
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      d[i][j] = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
    }
  }
  return d[a.length][b.length];
}

/**
 * The known name a misspelt one most likely meant: the nearest within a third of its length
 * (at least one edit), case and `-`/`_` ignored; undefined when none is that near.
 */
export function closestName(name: string, known: readonly string[]): string | undefined {
  const norm = (s: string) => s.toLowerCase().replace(/[-_\s]/g, '');
  // very long names are not misspellings of a short key; the edit distance is quadratic in them
  if (name.length > 64) return undefined;
  const budget = Math.max(1, Math.floor(norm(name).length / 3));
  let best: { name: string; d: number } | undefined;
  for (const k of known) {
    const d = distance(norm(name), norm(k));
    if (d <= budget && (!best || d < best.d)) best = { name: k, d };
  }
  return best?.name;
}
