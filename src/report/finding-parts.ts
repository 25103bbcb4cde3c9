import type { Severity } from '../roles/types.js';
import type { Finding } from '../rules/types.js';
import { visibleValue } from './visible.js';

/** "a, b, c … (+7 more)": the listed items and how many the finding counts beyond them. */
export function listed(items: readonly string[], total?: number): string {
  const more = total !== undefined && total > items.length ? ` … (+${total - items.length} more)` : '';
  return items.join(', ') + more;
}

/** Values worth showing beside the message (not when the message already quotes them), invisible characters marked. */
export function shownValues(f: Finding): string[] {
  if (!f.values?.length || !f.values.join('').length || f.message.includes(f.values[0])) return [];
  return f.values.map(visibleValue);
}

/** The groups a finding lists, invisible characters marked, and how many more it counts. */
export function listedGroups(f: Finding): string {
  return listed((f.groups ?? []).map(visibleValue), f.count);
}

/** Findings of one severity, in report order. */
export function bySeverity(findings: readonly Finding[], severity: Severity): Finding[] {
  return findings.filter((f) => f.severity === severity);
}

/** Where a finding comes from, said plainly after its message: "rule level2-varies, column benches". */
export function origin(f: Finding): string {
  return `rule ${f.rule}${f.column !== undefined ? `, column ${visibleValue(f.column)}` : ''}`;
}
