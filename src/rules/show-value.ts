/** A value as a reason quotes it: numbers without a trailing ".0", text in quotes. */
export function showValue(v: unknown): string {
  if (typeof v === 'number') return String(v);
  if (typeof v === 'bigint') return v.toString();
  return `"${String(v)}"`;
}
