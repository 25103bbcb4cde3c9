/** A number for people: fixed digits, "n/a" for NaN/Infinity, no "-0". */
export function formatNumber(x: number, digits: number): string {
  if (!Number.isFinite(x)) return 'n/a';
  const s = x.toFixed(digits);
  return /^-0(\.0*)?$/.test(s) ? s.slice(1) : s;
}

/**
 * A p-value's relation and value, as a table cell under "p" shows it: "< .001", "= .032",
 * "> .999", "= 1". Three decimals without the leading zero (a p-value cannot exceed 1),
 * "< .001" below that, as the APA Publication Manual (7th ed., §6.36) writes them.
 */
function pParts(p: number): [string, string] {
  if (!Number.isFinite(p)) return ['=', 'n/a'];
  if (p < 0.001) return ['<', '.001'];
  if (p >= 1) return ['=', '1'];
  const s = formatNumber(p, 3);
  return s === '1.000' ? ['>', '.999'] : ['=', s.replace(/^0/, '')];
}

/** A p-value on its own, for a cell headed "p": ".032", "< .001". */
export function formatP(p: number): string {
  const [rel, value] = pParts(p);
  return rel === '=' ? value : `${rel} ${value}`;
}

/** A p-value in running text: "p = .032", "p < .001" (never "p = < .001"). */
export function pClause(p: number): string {
  const [rel, value] = pParts(p);
  return `p ${rel} ${value}`;
}
