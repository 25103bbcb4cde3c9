import fc from 'fast-check';
import { FORMULA_LEAD, HOSTILE_KINDS, MARKUP, NON_FINITE } from './cells.js';
import type { JsonDamage, TextDamage } from './formats.js';
import { jsonDamage, textDamage } from './formats.js';
import type { GeneratedRoles } from './role-map.js';
import { roleMap } from './role-map.js';
import type { Table } from './table.js';
import { table } from './table.js';

export const FORMATS = ['csv', 'tsv', 'json', 'ndjson', 'parquet', 'arrow', 'xlsx'] as const;
export type Format = (typeof FORMATS)[number];

/** One generated delivery and role map. */
export interface FuzzCase {
  format: Format;
  table: Table;
  text?: TextDamage;
  json?: JsonDamage;
  /** the delivery is an empty file (0 bytes) */
  empty: boolean;
  /** collect the problem rows too (always for a case with formula-leading cells) */
  problems: boolean;
  /** the delivery is given on standard input (`-`): such a case runs through the CLI */
  stdin: boolean;
  roles: GeneratedRoles;
}

/** A delimited text whose header quotes a name holding a line break (refused, naming the column). */
const lineBreakInHeader = (c: FuzzCase) => c.text !== undefined && c.table.header.some((h) => /[\r\n]/.test(h));

/**
 * The classes a case belongs to: its format and each kind of damage it carries. A failure is
 * reported by class, and a class can be switched off (PENDING in classes.ts) while it is fixed.
 */
export function classesOf(c: FuzzCase): string[] {
  const out: string[] = [c.format];
  const cells = c.table.rows.flat();
  if (c.empty) out.push('empty-file');
  else if (!c.table.rows.length) out.push('header-only');
  else if (c.table.rows.length === 1) out.push('one-row');
  if (c.text?.gzip || c.json?.gzip) out.push('gzip');
  if (c.text?.ragged.length) out.push('ragged-rows');
  if (c.text?.nul) out.push('nul-byte');
  if (c.text?.invalidUtf8) out.push('invalid-utf8');
  if (c.text?.lineEnds === 'mixed') out.push('mixed-line-ends');
  if (c.json?.duplicateKey) out.push('json-duplicate-key');
  if (c.json?.numbers === 'mixed') out.push('json-mixed-types');
  if (new Set(c.table.header).size < c.table.header.length) out.push('duplicate-header');
  if (c.table.header.some((h) => !/^[a-z]$/.test(h))) out.push('odd-column-name');
  if (c.table.header.some((h) => h.trim() !== h)) out.push('padded-column-name');
  if (c.table.header.some((h) => h.includes('"'))) out.push('quote-in-column-name');
  if (lineBreakInHeader(c)) out.push('line-break-in-header');
  if (cells.some((v) => (NON_FINITE as readonly string[]).includes(v))) out.push('non-finite');
  const names = [...cells, ...c.table.header];
  if (names.some((v) => MARKUP.some((m) => v === m) || v.startsWith('javascript:'))) out.push('markup');
  // a negative number is no formula (the problem rows still quote it: that check reads FORMULA_LEAD)
  if (cells.some((v) => FORMULA_LEAD.test(v) && !/^-[\d.]/.test(v))) out.push('formula');
  if (cells.some((v) => v.length >= 500)) out.push('long-field');
  if (c.roles.fault !== 'valid') out.push(`roles:${c.roles.fault}`);
  if (c.roles.oddMissing) out.push('odd-missing-token');
  if (c.stdin) out.push('stdin');
  if (c.problems || out.includes('formula')) out.push('problem-rows');
  return out;
}

/** A case: a table (hostile in most cases), a format with its damage, a role map. */
export const fuzzCase: fc.Arbitrary<FuzzCase> = fc
  .record({
    format: fc.constantFrom(...FORMATS),
    kind: fc.constantFrom(...HOSTILE_KINDS),
    oddNames: fc.oneof({ weight: 4, arbitrary: fc.constant(false) }, { weight: 1, arbitrary: fc.constant(true) }),
    empty: fc.oneof({ weight: 40, arbitrary: fc.constant(false) }, { weight: 1, arbitrary: fc.constant(true) }),
    problems: fc.oneof({ weight: 9, arbitrary: fc.constant(false) }, { weight: 1, arbitrary: fc.constant(true) }),
    // NDJSON with the problem rows once ran out of memory on one record: a third of those cases
    jsonProblems: fc.oneof({ weight: 2, arbitrary: fc.constant(false) }, { weight: 1, arbitrary: fc.constant(true) }),
    stdin: fc.oneof({ weight: 30, arbitrary: fc.constant(false) }, { weight: 1, arbitrary: fc.constant(true) }),
    text: textDamage,
    json: jsonDamage,
  })
  .chain(({ format, kind, oddNames, empty, problems, jsonProblems, stdin, text, json }) =>
    table(kind, oddNames).chain((t) =>
      roleMap(t).map((roles) => ({
        format,
        table: t,
        empty,
        problems: problems || (jsonProblems && (format === 'ndjson' || format === 'json')),
        stdin,
        roles,
        ...(format === 'csv' || format === 'tsv' ? { text: { ...text, ...(format === 'tsv' && { delim: '\t' as const }) } } : {}),
        ...(format === 'json' || format === 'ndjson' ? { json } : {}),
      })),
    ),
  );
