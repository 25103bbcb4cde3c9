const KINDS: [string, RegExp][] = [
  // read by some parsers, but no statistic can use them: not numbers here
  ['non-finite value', /^[-+]?(inf|infinity|nan)$/i],
  ['out-of-range value', /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i],
  ['missing code', /^(n\/?a|na|nan|null|none|missing|unknown|unk|-+|\?+|\.|x|\*|not applicable|refused|dk)$/i],
  ['censored value', /^[<>]=?\s*[-+]?\d/],
  ['thousands separator', /^[-+]?\d{1,3}(,\d{3})+(\.\d+)?$/],
  ['decimal comma', /^[-+]?\d+,\d+$/],
  ['number with a unit', /^[-+]?\d+(\.\d+)?\s*[a-z%µ]+\.?$/i],
];

/** What a token probably is, taken alone, so that the fix can be specific. */
export function tokenKind(token: string): string {
  const t = token.trim();
  return KINDS.find(([, re]) => re.test(t))?.[0] ?? 'other text';
}

/** "1,234": a thousands separator or a decimal comma with three decimals; its column decides. */
const EITHER = /^[-+]?\d{1,3},\d{3}$/;

/**
 * The kind of each token of one column, read together: a "1,234" beside values that can only be
 * decimal commas ("12,5", "0,75") is a decimal comma too, unless the column also writes numbers
 * that can only have thousands separators ("1,234,567", "1,234.5").
 */
export function tokenKinds(tokens: readonly string[]): (token: string) => string {
  const alone = tokens.map((t) => tokenKind(t));
  const commas = alone.some((k) => k === 'decimal comma');
  const thousands = tokens.some((t, i) => alone[i] === 'thousands separator' && !EITHER.test(t.trim()));
  const decimal = commas && !thousands;
  return (token) => (decimal && EITHER.test(token.trim()) ? 'decimal comma' : tokenKind(token));
}

/** Kinds with their counts, most first: "3 missing codes, 1 censored value". */
export function kindCounts(tokens: readonly { token: string; count: number }[]): { kind: string; count: number }[] {
  const kindOf = tokenKinds(tokens.map((t) => t.token));
  const kinds = new Map<string, number>();
  for (const t of tokens) kinds.set(kindOf(t.token), (kinds.get(kindOf(t.token)) ?? 0) + t.count);
  return [...kinds].map(([kind, count]) => ({ kind, count })).sort((a, b) => b.count - a.count);
}

/** "3 missing codes, 1 censored value" */
export function describeKinds(kinds: readonly { kind: string; count: number }[]): string {
  return kinds.map(({ kind, count }) => `${count} ${kind}${count === 1 ? '' : 's'}`).join(', ');
}
