import { closeSync, openSync, readFileSync, readSync } from 'node:fs';
import { InputError } from '../errors.js';
import type { Snapshot } from '../report/snapshot.js';
import type { Report } from '../report/types.js';
import { REPORT_SCHEMA } from '../report/types.js';
import type { Roles } from '../roles/types.js';

/**
 * Whether a file is a nestready JSON report rather than a delivery: the report's JSON opens with
 * its `schema` key (renderJson writes it first), which no delivery's first bytes hold.
 */
export function isReportFile(file: string): boolean {
  let head = '';
  try {
    const fd = openSync(file, 'r');
    try {
      const buf = Buffer.alloc(256);
      head = buf.subarray(0, readSync(fd, buf, 0, buf.length, 0)).toString('utf8');
    } finally {
      closeSync(fd);
    }
  } catch {
    return false; // the audit of it says what is wrong with the file
  }
  return /^\s*\{\s*"schema"\s*:\s*"nestready\/report@/.test(head);
}

/** Read a previous delivery's JSON report: it must carry a snapshot and group by the same column. */
export function loadPreviousReport(file: string, roles: Roles): Report & { snapshot: Snapshot } {
  let report: Partial<Report>;
  try {
    report = JSON.parse(readFileSync(file, 'utf8'));
  } catch (e) {
    throw new InputError(`${file}: not a readable JSON report (${(e as Error).message.split('\n')[0]})`);
  }
  if (report.schema !== REPORT_SCHEMA) throw new InputError(`${file}: not a ${REPORT_SCHEMA} report`);
  if (!report.snapshot) {
    throw new InputError(`${file}: the report has no snapshot; write the previous delivery's report with this version (--format json)`);
  }
  const group = report.roles?.group;
  if (group !== roles.group) {
    throw new InputError(`${file}: the previous report groups by ${JSON.stringify(group)}, the role map by ${JSON.stringify(roles.group)}`);
  }
  return report as Report & { snapshot: Snapshot };
}
