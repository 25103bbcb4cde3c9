import type { Roles } from '../roles/types.js';
import type { AnyRule } from '../rules/define.js';
import { resolveParams } from '../rules/engine.js';
import type { FindingRecords } from '../rules/rows.js';
import type { Finding } from '../rules/types.js';
import type { FoundRecord, RecordQueries } from '../source/lookups/records.js';
import { countRecordsSql, recordQueries, selectRecordsSql } from '../source/lookups/records.js';
import type { RejectedLine, Source } from '../source/types.js';
import type { ProblemRow, ProblemRows } from './types.js';
import { DEFAULT_MAX_ROWS } from './types.js';

/**
 * The problem rows of the findings from a source opened and settled as the audit read it
 * (see collectProblemRows): engine-free, shared by the command line and the page.
 *
 * @param rejected the unreadable lines of the settled source's full read
 */
export async function problemRowsOfSource(
  source: Source,
  rejected: readonly RejectedLine[],
  roles: Roles,
  findings: readonly Finding[],
  rules: readonly AnyRule[],
  options: { maxRows?: number; includeValues?: boolean } = {},
): Promise<ProblemRows> {
  const { maxRows = DEFAULT_MAX_ROWS, includeValues = true } = options;
  const records = recordQueries(source, roles.group);
  const rows: ProblemRow[] = [];
  let total = 0;
  for (const f of findings) {
    const rule = rules.find((r) => r.meta.id === f.rule);
    const part = (await ownRows(rule, f, { roles, records, rejected, includeValues })) ?? listedRows(f, rule, records);
    if (!part) continue;
    const room = Math.max(0, maxRows - rows.length);
    if ('lines' in part) {
      total += part.lines.length;
      for (const line of part.lines.slice(0, room)) rows.push(lineRow(f, line, part.reason(line)));
      continue;
    }
    const [{ k }] = await source.all<{ k: unknown }>(countRecordsSql(part.query));
    total += Number(k);
    if (room <= 0) continue;
    const found = await source.all<FoundRecord>(selectRecordsSql(source, part.query, roles.group, roles.unit, room));
    for (const r of found) rows.push(recordRow(f, r, part.reason(r)));
  }
  return { rows, total, omitted: total - rows.length, maxRows };
}

/** The rule's own account of the finding's records, with the params it ran with. */
async function ownRows(
  rule: AnyRule | undefined,
  f: Finding,
  ctx: { roles: Roles; records: RecordQueries; rejected: readonly RejectedLine[]; includeValues: boolean },
): Promise<FindingRecords | null> {
  if (!rule?.rows) return null;
  const params = resolveParams(rule, ctx.roles);
  if (params === 'off') return null;
  return (await rule.rows(f, { ...ctx, params })) ?? null;
}

/** The records the finding lists, with the rule's title (else its message cut short) as the reason. */
function listedRows(f: Finding, rule: AnyRule | undefined, records: RecordQueries): FindingRecords | null {
  if (!f.rows?.length) return null;
  const title = rule?.meta.title;
  const reason = title
    ? `${title}${f.column !== undefined ? ` (${f.column})` : ''}: one of the records the report lists`
    : f.message.length > 120
      ? `${f.message.slice(0, 119)}…`
      : f.message;
  return { query: records.listed(f.rows), reason: () => reason };
}

function recordRow(f: Finding, r: FoundRecord, reason: string): ProblemRow {
  const row: ProblemRow = { record: Number(r.rec), group: r.grp, unit: r.unit, rule: f.rule, severity: f.severity, reason };
  if (f.column !== undefined) row.column = f.column;
  return row;
}

/** An unreadable line: no record number; the column only where a value failed to convert. */
function lineRow(f: Finding, r: RejectedLine, reason: string): ProblemRow {
  const row: ProblemRow = { record: null, group: null, unit: null, rule: f.rule, severity: f.severity, reason };
  if (r.column) row.column = r.column;
  return row;
}
