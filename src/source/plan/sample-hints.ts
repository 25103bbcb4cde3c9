import type { Roles } from '../../roles/types.js';
import type { Dialect } from '../dialect.js';
import type { Storage } from '../sql.js';
import { ident } from '../sql.js';
import type { BinaryWords } from '../types.js';
import { binaryWords, wordAggregates, wordCandidates } from './binary-words.js';

/** How many groups the sampled records show, and how many of those were seen once and twice. */
export interface GroupSample {
  /** records sampled (fewer than SAMPLE_ROWS: the whole delivery) */
  records: number;
  groups: number;
  seenOnce: number;
  seenTwice: number;
}

/** Rows sampled to tell text columns that hold numbers from those that hold none. */
export const SAMPLE_ROWS = 20480;

/**
 * Read the first rows once: a text column whose sampled values are all numbers is probed (the
 * profile decides whether it is numeric throughout); one whose sampled values hold no number
 * (and whose type the role map leaves open) gets no numeric reading — converting every value of
 * a text column such as "18-29" only to fail is the dearest thing a pass can do. A variable
 * written in two words (yes/no) is read as 0/1 (`binaryWords`; see plan/binary-words.ts). The same read
 * counts the groups the first rows show (DuckDB sizes its memory from them).
 */
export async function sampleHints(
  all: <T>(sql: string) => Promise<T[]>,
  view: string,
  header: readonly string[],
  storage: Map<string, Storage>,
  roles: Roles,
  ids: Set<string | undefined>,
  probing: boolean,
  d: Pick<Dialect, 'numeric' | 'ordered'>,
): Promise<{ probe: Set<string>; textOnly: Set<string>; groups: GroupSample; binaryWords: Map<string, BinaryWords> }> {
  const { numeric } = d;
  const probe = new Set<string>();
  const textOnly = new Set<string>();
  const candidates = header.filter((c) => storage.get(c) === 'text' && !ids.has(c) && roles.types[c] !== 'categorical');
  // each sampled record with the number of sampled records of its group, so that the groups seen
  // once and twice are counted in the same read (an estimate of the delivery's groups needs them)
  const g = ident(roles.group);
  // a role map may name a group the header lacks (checked and reported after opening)
  const hasGroup = header.includes(roles.group);
  const seen = (k: number) => `count(*) FILTER (WHERE nr_seen = ${k} AND ${g} IS NOT NULL)`;
  const aggs = [
    hasGroup
      ? `count(*) AS sampled_records, count(DISTINCT ${g}) AS sampled_groups, ${seen(1)} AS seen_once, ${seen(2)} / 2 AS seen_twice`
      : 'count(*) AS sampled_records, 0 AS sampled_groups, 0 AS seen_once, 0 AS seen_twice',
    ...candidates.map((c, i) => `count(${ident(c)}) AS n${i}, count(${numeric(ident(c))}) AS k${i}`),
  ];
  const worded = wordCandidates(header, storage, roles);
  aggs.push(...wordAggregates(worded, d));
  const [row] = await all<Record<string, unknown>>(
    `SELECT ${aggs.join(', ')} FROM (SELECT *, count(*) OVER (PARTITION BY ${hasGroup ? g : 'NULL'}) AS nr_seen ` +
      `FROM (SELECT * FROM ${view} LIMIT ${SAMPLE_ROWS}) AS nr_first) AS nr_sample`,
  );
  const words = binaryWords(row, worded, roles);
  candidates.forEach((c, i) => {
    const n = Number(row[`n${i}`]);
    const k = Number(row[`k${i}`]);
    // a column of words read as 0/1 is read as text with digits in it (never probed, never text only)
    if (words.has(c)) return;
    if (probing && n > 0 && k === n) probe.add(c);
    // an outcome is always read for numbers: if it holds none, the finding that says so counts them
    else if (n > 0 && k === 0 && roles.types[c] === undefined && !roles.outcomes.includes(c)) textOnly.add(c);
  });
  const groups = {
    records: Number(row.sampled_records),
    groups: Number(row.sampled_groups),
    seenOnce: Number(row.seen_once),
    seenTwice: Number(row.seen_twice),
  };
  return { probe, textOnly, groups, binaryWords: words };
}

/** Missing tokens that are numbers, compared as numbers in numeric columns ("-999" ↔ -999.0). */
export function numericTokens(missing: readonly string[]): number[] {
  return [...new Set(missing.filter((t) => t.trim() !== '' && Number.isFinite(Number(t))).map(Number))];
}
