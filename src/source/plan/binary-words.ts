import { NUMBER_SHARE } from '../../profile/reads-as-numbers.js';
import type { Roles } from '../../roles/types.js';
import type { Dialect } from '../dialect.js';
import type { Storage } from '../sql.js';
import { ident, literal } from '../sql.js';
import type { BinaryWords, ValueReading } from '../types.js';

/**
 * The pairs of words a binary variable is commonly written in, the conventional positive first:
 * it is read as 1 unless the role map names the other (`types: { x: { binary: { one: … } } }`).
 * Compared in lower case, trimmed: "Yes", "YES" and "yes" are one word.
 */
export const WORD_PAIRS: readonly (readonly [one: string, zero: string])[] = [
  ['yes', 'no'],
  ['true', 'false'],
  ['y', 'n'],
];

/** The variables whose words may be read as 0/1: text, of a declared role, typed binary or not typed. */
export function wordCandidates(header: readonly string[], storage: Map<string, Storage>, roles: Roles): string[] {
  const variables = new Set([...roles.outcomes, ...roles.level1, ...roles.level2]);
  const ids = new Set([roles.group, roles.unit, roles.parent]);
  return header.filter((c) => {
    const type = roles.types[c];
    return variables.has(c) && !ids.has(c) && storage.get(c) === 'text' && (type === undefined || type === 'binary');
  });
}

/** A value as words are compared: trimmed, lower case (the same in both engines). */
const folded = (c: string) => `lower(trim(${c}))`;

/**
 * The share of a column's first values that must be the two words for them to be read as 0/1: a
 * stray value ("maybe") is then reported as a value that is not a number, not left to turn the
 * whole column into text (the share reads-as-numbers asks of a declared variable).
 */
export const WORD_SHARE = NUMBER_SHARE;

/** Aggregates over the first records that tell a two-word column (see binaryWords). */
export function wordAggregates(candidates: readonly string[], d: Pick<Dialect, 'ordered'>): string[] {
  return candidates.map((name, i) => {
    const c = ident(name);
    const o = d.ordered(c);
    const pairs = WORD_PAIRS.map((p, k) => `count(*) FILTER (WHERE ${folded(c)} IN (${p.map(literal).join(', ')})) AS wp${i}_${k}`).join(
      ', ',
    );
    return (
      `count(${c}) AS wn${i}, ${pairs}, count(DISTINCT ${folded(c)}) AS wd${i}, min(${d.ordered(folded(c))}) AS wlo${i}, ` +
      `max(${d.ordered(folded(c))}) AS whi${i}, count(DISTINCT ${c}) AS wr${i}, min(${o}) AS wrlo${i}, max(${o}) AS wrhi${i}`
    );
  });
}

/**
 * The words read as 1 and 0 per column, from the aggregates of wordAggregates: the first values
 * are (WORD_SHARE of them) the words of a known pair, or, with the role map naming the word that
 * is 1, exactly two words of a column typed binary. Any other value is left as it is written, so
 * that it is counted and listed as a value that is not a number, never dropped.
 */
export function binaryWords(row: Record<string, unknown>, candidates: readonly string[], roles: Roles): Map<string, BinaryWords> {
  const out = new Map<string, BinaryWords>();
  candidates.forEach((c, i) => {
    const n = Number(row[`wn${i}`]);
    if (!(n > 0)) return;
    const named = roles.binaryOne?.[c]?.trim().toLowerCase();
    const pair = WORD_PAIRS.find((_, k) => Number(row[`wp${i}_${k}`]) >= WORD_SHARE * n);
    const distinct = Number(row[`wd${i}`]);
    const seen = [row[`wlo${i}`], row[`whi${i}`]].map(String);
    let words: { one: string; zero: string } | undefined;
    if (pair) {
      if (named === undefined || named === pair[0]) words = { one: pair[0], zero: pair[1] };
      else if (named === pair[1]) words = { one: pair[1], zero: pair[0] };
    } else if (named !== undefined && roles.types[c] === 'binary' && distinct === 2 && seen.includes(named)) {
      words = { one: named, zero: seen[0] === named ? seen[1] : seen[0] };
    }
    if (!words) return;
    // as written, when the first records hold just the two words, each written one way ("Yes"/"No")
    const raw = [row[`wrlo${i}`], row[`wrhi${i}`]].map(String);
    const form = (w: string) => raw.find((r) => r.trim().toLowerCase() === w);
    const one = form(words.one);
    const zero = form(words.zero);
    const plain = one === words.one && zero === words.zero;
    const written = distinct === 2 && Number(row[`wr${i}`]) === 2 && one !== undefined && zero !== undefined && !plain;
    out.set(c, { ...words, ...(written && { written: { one, zero } }) });
  });
  return out;
}

/**
 * A column's two words as the text "1" and "0", every other value as written: the profile's
 * numeric reading then sees a 0/1 variable, and a stray value stays a value that is not a number.
 */
export function wordsAsDigits(text: string, words: BinaryWords): string {
  return (
    `CASE WHEN ${folded(text)} = ${literal(words.one)} THEN '1' ` +
    `WHEN ${folded(text)} = ${literal(words.zero)} THEN '0' ELSE ${text} END`
  );
}

/**
 * The reading as a report with values withheld may state it: the words of a known pair are ours
 * to name, the delivery's own spelling of them and words of no known pair are its values.
 */
export function withheldWords(reading: ValueReading): ValueReading {
  if (!reading.binary) return reading;
  const binary: Record<string, BinaryWords> = {};
  for (const [column, { one, zero }] of Object.entries(reading.binary)) {
    const known = WORD_PAIRS.some((p) => p.includes(one) && p.includes(zero));
    binary[column] = known ? { one, zero } : { one: WITHHELD, zero: WITHHELD };
  }
  return { ...reading, binary };
}

const WITHHELD = '(value withheld)';
