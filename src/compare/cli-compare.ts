import type { AuditOptions } from '../audit.js';
import type { Roles } from '../roles/types.js';
import { loadPreviousReport } from './load-previous.js';

/**
 * The audit options `audit --baseline` and the JSON outputs add: a snapshot when a JSON report is
 * written (the next delivery is compared with it), and the previous report as the baseline.
 */
export function baselineFor(
  file: string | undefined,
  roles: Roles,
  targets: readonly { format: string }[],
): Pick<AuditOptions, 'snapshot' | 'baseline'> {
  const snapshot = targets.some((t) => t.format === 'json');
  if (file === undefined) return { snapshot };
  return { snapshot, baseline: { report: loadPreviousReport(file, roles), from: 'report' } };
}
