import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { stringify } from 'yaml';
import { catalogue } from '../../rules/index.js';
import type { AuditOptions } from '../../src/audit.js';
import { audit } from '../../src/audit.js';
import type { Report } from '../../src/report/types.js';
import { parseRoles } from '../../src/roles/load.js';
import type { Finding } from '../../src/rules/types.js';

/** One record of a test delivery: column → value (null/undefined is written as an empty field). */
export type Row = Record<string, string | number | null | undefined>;

/** Where a test delivery was written; `remove()` deletes the temp dir. */
export interface Delivery {
  dir: string;
  csv: string;
  roles: string;
  remove(): void;
}

/** Quote a CSV field when it needs it (delimiter, quote, newline, or edge whitespace). */
function field(v: Row[string]): string {
  if (v === null || v === undefined) return '';
  const s = String(v);
  return /[",\r\n]|^\s|\s$/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** CSV text for rows: the header is every key in first-seen order. */
export function toCsv(rows: readonly Row[]): string {
  const header: string[] = [];
  for (const r of rows) for (const k of Object.keys(r)) if (!header.includes(k)) header.push(k);
  const lines = [header.map(field).join(','), ...rows.map((r) => header.map((h) => field(r[h])).join(','))];
  return `${lines.join('\n')}\n`;
}

/** A role map as YAML text (objects are stringified with the `yaml` package). */
export function toYaml(roles: string | Record<string, unknown>): string {
  return typeof roles === 'string' ? roles : stringify(roles);
}

/** Write a delivery (rows or CSV text) and its role map to a fresh temp dir. */
export function writeDelivery(data: readonly Row[] | string, roles: string | Record<string, unknown>, name = 'delivery.csv'): Delivery {
  const dir = mkdtempSync(join(tmpdir(), 'nestready-test-'));
  const csv = join(dir, name);
  const rolesPath = join(dir, 'roles.yaml');
  writeFileSync(csv, typeof data === 'string' ? data : toCsv(data));
  writeFileSync(rolesPath, toYaml(roles));
  return { dir, csv, roles: rolesPath, remove: () => rmSync(dir, { recursive: true, force: true }) };
}

/** Write a delivery, audit it with the library API and the built-in catalogue, return the Report. */
export async function auditRows(
  data: readonly Row[] | string,
  roles: string | Record<string, unknown>,
  options: AuditOptions = {},
): Promise<Report> {
  const d = writeDelivery(data, roles);
  try {
    const yamlText = toYaml(roles);
    return await audit(d.csv, parseRoles(yamlText, d.roles, catalogue), { threads: 1, ...options });
  } finally {
    d.remove();
  }
}

/** The findings of one rule. */
export function findingsOf(report: Report, rule: string): Finding[] {
  return report.findings.filter((f) => f.rule === rule);
}

/** The single finding of one rule (fails when there are none or several). */
export function onlyFinding(report: Report, rule: string, column?: string): Finding {
  const list = findingsOf(report, rule).filter((f) => column === undefined || f.column === column);
  if (list.length !== 1) {
    throw new Error(
      `expected exactly one ${rule}${column ? ` (${column})` : ''} finding, got ${list.length}: ` +
        `${JSON.stringify(report.findings, null, 1)}`,
    );
  }
  return list[0];
}

/** Group IDs G01, G02, … padded to sort as text in numeric order. */
export function groupId(j: number, width = 3): string {
  return `G${String(j + 1).padStart(width, '0')}`;
}

/**
 * `count` groups of `size` records each (groups in order, records within groups in order);
 * `row(j, i)` adds columns to record i of group j. The group column is `g`.
 */
export function groupedRows(count: number, size: number | ((j: number) => number), row: (j: number, i: number) => Row = () => ({})): Row[] {
  const rows: Row[] = [];
  for (let j = 0; j < count; j++) {
    const n = typeof size === 'number' ? size : size(j);
    for (let i = 0; i < n; i++) rows.push({ g: groupId(j), ...row(j, i) });
  }
  return rows;
}
