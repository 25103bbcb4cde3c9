/** A number for people: fixed digits, "n/a" for NaN/Infinity, no "-0". */
export function formatNumber(x: number, digits: number): string {
  if (!Number.isFinite(x)) return 'n/a';
  const s = x.toFixed(digits);
  return /^-0(\.0*)?$/.test(s) ? s.slice(1) : s;
}

/** A p-value for people: four decimals, or "< 0.0001". */
export function formatP(p: number): string {
  return Number.isFinite(p) && p < 0.0001 ? '< 0.0001' : formatNumber(p, 4);
}
