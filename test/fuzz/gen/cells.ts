import fc from 'fast-check';

/** A marker no report writes of its own: if it appears raw in the HTML, data went in unescaped. */
export const MARKUP = ['<script>nrFuzz()</script>', '<img src=x onerror=nrFuzz()>', '"><b>nrFuzz</b>'] as const;
export const JS_URL = 'javascript:nrFuzz()';
/** What a spreadsheet would run as a formula when a cell starts with it. */
export const FORMULA_LEAD = /^[=+\-@\t\r]/;

const number = fc.oneof(
  fc.integer({ min: -1000, max: 1000 }).map(String),
  fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true }).map((x) => String(Math.round(x * 1000) / 1000)),
);

/** Values no statistic can use: they must be listed as not numbers, never crash a computation. */
export const NON_FINITE = ['inf', '-inf', 'NaN', 'nan', 'Infinity', '1e309', '-1e309', '1e308', '-1e308', '1e200'] as const;
export const nonFinite = fc.constantFrom(...NON_FINITE);

export const markup = fc.constantFrom(...MARKUP, JS_URL);
export const formula = fc.constantFrom('=1+1', '=HYPERLINK("http://x")', '+1', '-1+1', '@SUM(A1)', '\tx', '\rx', "=cmd|' /c calc'!A0");
const text = fc.oneof(
  fc.constantFrom('NA', '', ' ', 'n/a', '<5', '1,234', '3,5', '12 kg', 'yes', 'TRUE', '"q"', 'a,b', 'é€’–', '007', '7.0'),
  fc.string({ maxLength: 8 }),
  fc.string({ unit: 'grapheme', maxLength: 6 }),
);
const long = fc.integer({ min: 500, max: 20_000 }).map((n) => 'x'.repeat(n));
const multiline = fc.constantFrom('a\nb', 'a\r\nb', 'line\rend');

/** The kind of hostile content a case mixes into its cells (one per case, so failures name their cause). */
export const HOSTILE_KINDS = ['none', 'non-finite', 'markup', 'formula', 'text', 'long-field', 'multiline'] as const;
export type HostileKind = (typeof HOSTILE_KINDS)[number];

const HOSTILE: Record<Exclude<HostileKind, 'none'>, fc.Arbitrary<string>> = {
  'non-finite': nonFinite,
  markup,
  formula,
  text,
  'long-field': long,
  multiline,
};

/** A cell of an outcome or level-1 column: mostly numbers, sometimes of the case's hostile kind. */
export function valueCell(kind: HostileKind): fc.Arbitrary<string> {
  if (kind === 'none') return number;
  return fc.oneof({ weight: 6, arbitrary: number }, { weight: 1, arbitrary: HOSTILE[kind] });
}

/** A cell of an ID column: a few codes, so that groups have several records; sometimes hostile. */
export function idCell(kind: HostileKind, codes: number): fc.Arbitrary<string> {
  const plain = fc.integer({ min: 1, max: codes }).map((k) => `G${k}`);
  const odd: Partial<Record<HostileKind, fc.Arbitrary<string>>> = {
    text: fc.constantFrom('', 'NA', ' G1', 'g1'),
    markup,
    formula,
    multiline,
  };
  const hostile = odd[kind];
  return hostile ? fc.oneof({ weight: 12, arbitrary: plain }, { weight: 1, arbitrary: hostile }) : plain;
}
