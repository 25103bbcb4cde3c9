import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { AuditInput, AuditOptions } from '../audit.js';
import { audit } from '../audit.js';
import type { Report } from '../report/types.js';
import type { LoadedRoles } from '../roles/load.js';
import type { Roles } from '../roles/types.js';
import { isReportFile, loadPreviousReport } from './load-previous.js';
import { changesOnly } from './run-changes.js';
import type { Baseline } from './types.js';

/** The previous delivery as a baseline: its JSON report as it is, or a delivery audited with a snapshot. */
export async function baselineOf(
  previous: AuditInput,
  roleMap: LoadedRoles | Roles,
  options: AuditOptions,
  unitsFile?: string,
): Promise<Baseline> {
  const roles = 'roles' in roleMap ? roleMap.roles : roleMap;
  if (typeof previous === 'string' && isReportFile(previous)) return { report: loadPreviousReport(previous, roles), from: 'report' };
  const report = await audit(previous, roleMap, { ...options, plotData: false, snapshot: 'groups', keepUnits: unitsFile });
  return {
    report: report as Baseline['report'],
    from: 'delivery',
    ...(unitsFile && existsSync(unitsFile) && { unitsFile }),
  };
}

/**
 * Compare a delivery with the previous one (a delivery, or its JSON report): the current
 * delivery's report whose findings are the change findings only, graded on them, with the
 * `changes` summary. Unit moves need both deliveries as files (their IDs are joined in the engine).
 */
export async function compare(
  previous: AuditInput,
  current: AuditInput,
  roleMap: LoadedRoles | Roles,
  options: AuditOptions = {},
): Promise<Report> {
  const dir = mkdtempSync(join(tmpdir(), 'nestready-compare-'));
  try {
    const baseline = await baselineOf(previous, roleMap, options, join(dir, 'units.parquet'));
    return changesOnly(await audit(current, roleMap, { ...options, baseline }));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
