/** Counts as a reader reads them: 7,185. */
export function count(n: number): string {
  return n.toLocaleString('en-US');
}
