import { readError } from '../errors.js';
import { catalogue } from '../../rules/index.js';
import type { Roles } from '../roles/types.js';
import { resolveParams } from '../rules/engine.js';
import type { Finding } from '../rules/types.js';
import type { RejectedLine, Source } from '../source/open.js';
import { openSettled } from './open-settled.js';
import { countSql, level2Query, listedRowsQuery, missingGroupQuery, numericShareSql, selectSql, singletonQuery } from './queries.js';
import type { RowQuery } from './queries.js';
import { DEFAULT_MAX_ROWS } from './types.js';
import type { ProblemOptions, ProblemRow, ProblemRows } from './types.js';

interface Found {
  rec: bigint | number;
  grp: string | null;
  unit: string | null;
  value?: unknown;
  expected?: unknown;
}

/**
 * Every offending record behind the findings, for the file a data manager sends back: record
 * number, group ID, unit ID, rule, severity, column and a short reason. The delivery is opened
 * again and one bounded query runs per finding, in report order:
 * - missing-group-id: every record whose group ID is missing;
 * - level2-varies: every record whose level-2 value differs from its group's most common value
 *   (beyond the rule's tolerance for numeric columns), in every group where it varies;
 * - singleton-groups: the record of every single-record group;
 * - unreadable-lines: each unreadable line (no record number; the reason names the line);
 * - any other finding: the records it lists (its first 20, as in the report), with the rule's
 *   title as the reason.
 * Findings without records (few-groups, low-icc) give none. At most `maxRows` rows are returned
 * in all; `omitted` counts the rest, which are still counted by a query each.
 *
 * @param path the delivery the report was made from
 * @param roles the role map it was audited with
 * @param findings the report's findings
 */
export async function problemRows(path: string, roles: Roles, findings: readonly Finding[], options: ProblemOptions = {}): Promise<ProblemRows> {
  const maxRows = options.maxRows ?? DEFAULT_MAX_ROWS;
  const includeValues = options.includeValues ?? true;
  if (!findings.length) return { rows: [], total: 0, omitted: 0, maxRows };
  const { source, rejected } = await openSettled(path, roles, options).catch((e: unknown) => {
    throw readError(e, path);
  });
  try {
    const rows: ProblemRow[] = [];
    let total = 0;
    for (const f of findings) {
      if (f.rule === 'unreadable-lines') {
        total += rejected.length;
        for (const r of rejected.slice(0, Math.max(0, maxRows - rows.length))) rows.push(unreadableRow(f, r));
        continue;
      }
      const q = await queryFor(f, source, roles);
      if (!q) continue;
      const [{ k }] = await source.all<{ k: bigint }>(countSql(q));
      total += Number(k);
      const room = maxRows - rows.length;
      if (room <= 0) continue;
      const found = await source.all<Found>(selectSql(q, roles.group, roles.unit, room));
      for (const r of found) rows.push(problemRow(f, r, roles, includeValues));
    }
    return { rows, total, omitted: total - rows.length, maxRows };
  } catch (e) {
    throw readError(e, path);
  } finally {
    source.close();
  }
}

async function queryFor(f: Finding, source: Source, roles: Roles): Promise<RowQuery | null> {
  if (f.rule === 'missing-group-id') return missingGroupQuery(source.numbered, roles.group);
  if (f.rule === 'singleton-groups') return singletonQuery(source.view, source.numbered, roles.group);
  if (f.rule === 'level2-varies' && f.column !== undefined && source.header.includes(f.column)) {
    const tolerance = (await readsAsNumber(source, roles, f.column)) ? level2Tolerance(roles) : null;
    return level2Query(source.view, source.numbered, roles.group, f.column, tolerance);
  }
  if (f.rows?.length) return listedRowsQuery(source.numbered, f.rows);
  return null;
}

/** Whether level2-varies compares the column as numbers: the profile's reading of its type. */
async function readsAsNumber(source: Source, roles: Roles, column: string): Promise<boolean> {
  const declared = roles.types[column];
  if (declared === 'categorical') return false;
  if (declared === 'numeric' || declared === 'binary' || source.storage.get(column) === 'double') return true;
  // a declared variable counts as numeric when at least 95% of its values are numbers (columnProfile)
  const [{ nn, num }] = await source.all<{ nn: bigint; num: bigint }>(numericShareSql(source.view, column));
  return Number(num) > 0 && Number(num) >= 0.95 * Number(nn);
}

function level2Tolerance(roles: Roles): number {
  const rule = catalogue.find((r) => r.meta.id === 'level2-varies');
  const params = rule ? resolveParams(rule, roles) : 'off';
  return params !== 'off' && typeof params.tolerance === 'number' ? params.tolerance : 0;
}

function problemRow(f: Finding, r: Found, roles: Roles, includeValues: boolean): ProblemRow {
  const row: ProblemRow = {
    record: Number(r.rec),
    group: r.grp,
    unit: r.unit,
    rule: f.rule,
    severity: f.severity,
    reason: reason(f, r, roles, includeValues),
  };
  if (f.column !== undefined) row.column = f.column;
  return row;
}

function reason(f: Finding, r: Found, roles: Roles, includeValues: boolean): string {
  switch (f.rule) {
    case 'missing-group-id':
      return `no ${roles.group} (blank or a missing code): the record belongs to no group`;
    case 'singleton-groups':
      return 'the only record of its group';
    case 'level2-varies':
      return includeValues
        ? `${f.column} is ${show(r.value)} here but ${show(r.expected)} in most records of the group`
        : `${f.column} differs from the value in most records of the group (values withheld)`;
    default:
      return shortReason(f);
  }
}

/** Any other rule: its title (the finding's full message is in the report), else the message cut short. */
function shortReason(f: Finding): string {
  const title = catalogue.find((r) => r.meta.id === f.rule)?.meta.title;
  if (title) return `${title}${f.column !== undefined ? ` (${f.column})` : ''}: one of the records the report lists`;
  return f.message.length > 120 ? `${f.message.slice(0, 119)}…` : f.message;
}

function unreadableRow(f: Finding, r: RejectedLine): ProblemRow {
  const row: ProblemRow = {
    record: null,
    group: null,
    unit: null,
    rule: f.rule,
    severity: f.severity,
    reason: `line ${r.line} (the header is line 1) could not be read: ${r.reason}`,
  };
  if (r.column) row.column = r.column;
  return row;
}

/** A value as it reads: numbers without a trailing ".0", text in quotes. */
function show(v: unknown): string {
  if (typeof v === 'number') return String(v);
  if (typeof v === 'bigint') return v.toString();
  return `"${String(v)}"`;
}
