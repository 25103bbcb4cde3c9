import type { Roles } from '../../roles/types.js';
import type { Dialect } from '../dialect.js';
import type { Storage } from '../sql.js';
import { ident, literal } from '../sql.js';
import type { BinaryWords } from '../types.js';

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

/** Aggregates over the first records that tell a two-word column (see binaryWords). */
export function wordAggregates(candidates: readonly string[], d: Pick<Dialect, 'ordered'>): string[] {
  return candidates.map((name, i) => {
    const c = ident(name);
    const o = d.ordered(c);
    return (
      `count(DISTINCT ${folded(c)}) AS wd${i}, min(${d.ordered(folded(c))}) AS wlo${i}, max(${d.ordered(folded(c))}) AS whi${i}, ` +
      `count(DISTINCT ${c}) AS wr${i}, min(${o}) AS wrlo${i}, max(${o}) AS wrhi${i}`
    );
  });
}

/**
 * The words read as 1 and 0 per column, from the aggregates of wordAggregates: one or two
 * distinct words in the first records that are a known pair (or, with the role map naming the
 * word that is 1, any two words of a column typed binary). Any other value is left as it is
 * written, so that it is counted and listed as a value that is not a number, never dropped.
 */
export function binaryWords(row: Record<string, unknown>, candidates: readonly string[], roles: Roles): Map<string, BinaryWords> {
  const out = new Map<string, BinaryWords>();
  candidates.forEach((c, i) => {
    const distinct = Number(row[`wd${i}`]);
    if (distinct < 1 || distinct > 2) return;
    const seen = [row[`wlo${i}`], row[`whi${i}`]].map(String);
    const named = roles.binaryOne?.[c]?.trim().toLowerCase();
    const pair = WORD_PAIRS.find((p) => seen.every((w) => p.includes(w)));
    let words: { one: string; zero: string } | undefined;
    if (pair) {
      if (named === undefined || named === pair[0]) words = { one: pair[0], zero: pair[1] };
      else if (named === pair[1]) words = { one: pair[1], zero: pair[0] };
    } else if (named !== undefined && roles.types[c] === 'binary' && distinct === 2 && seen.includes(named)) {
      words = { one: named, zero: seen[0] === named ? seen[1] : seen[0] };
    }
    if (!words) return;
    // as written, when the first records write each word one way ("Yes"/"No")
    const raw = [row[`wrlo${i}`], row[`wrhi${i}`]].map(String);
    const form = (w: string) => raw.find((r) => r.trim().toLowerCase() === w);
    const one = form(words.one);
    const zero = form(words.zero);
    const written =
      Number(row[`wr${i}`]) === distinct && one !== undefined && zero !== undefined && (one !== words.one || zero !== words.zero);
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
