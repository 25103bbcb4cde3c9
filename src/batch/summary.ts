import type { Ending } from '../cli-exit.js';
import type { Report } from '../report/types.js';
import type { FailOn } from '../severity.js';
import { failsGate } from '../severity.js';
import { TOOL } from '../version.js';
import type { BatchDelivery, BatchRow, BatchSummary, DeliveryFiles, SkippedFile } from './types.js';
import { BATCH_SCHEMA } from './types.js';

/** The summary row of an audited delivery: counts, grade and the outcomes' REML ICC, no data value. */
export function auditedRow(delivery: BatchDelivery, report: Report, failOn: FailOn, files?: DeliveryFiles): BatchRow {
  const count = (s: 'blocker' | 'warning' | 'note') => report.findings.filter((f) => f.severity === s).length;
  const icc = Object.fromEntries(
    Object.entries(report.outcomes).map(([name, o]) => [name, Number.isFinite(o.reml.icc) ? o.reml.icc : null]),
  );
  const row: BatchRow = {
    ...named(delivery),
    status: 'audited',
    gate: report.findings.some((f) => failsGate(f.severity, failOn)) ? 'fail' : 'pass',
    verdict: report.verdict,
    grade: report.grade,
    score: report.score,
    blockers: count('blocker'),
    warnings: count('warning'),
    notes: count('note'),
    records: report.input.rows,
    groups: report.groups.count,
    icc,
  };
  return files ? { ...row, files } : row;
}

/** The row of a delivery whose audit ended in an error: its one line, and always a failed gate. */
export function failedRow(delivery: BatchDelivery, ending: Ending): BatchRow {
  const line = (ending.line ?? 'unknown error').replace(/^nestready: /, '');
  return { ...named(delivery), status: ending.code === 2 ? 'unreadable' : 'error', error: line, gate: 'fail' };
}

function named(delivery: BatchDelivery): Pick<BatchRow, 'file' | 'sender' | 'folder'> {
  return { file: delivery.file, sender: delivery.sender, folder: delivery.folder };
}

const RANK = { 'not-ready': 1, caveats: 2, ready: 3 } as const;

/** Unreadable (and failed) deliveries first, then not ready, caveats, ready. */
function rank(row: BatchRow): number {
  return row.status === 'audited' && row.verdict ? RANK[row.verdict] : 0;
}

/** Worst first: by rank, then most blockers, most warnings, then file name (code-point order, the same everywhere). */
export function worstFirst(a: BatchRow, b: BatchRow): number {
  return (
    rank(a) - rank(b) ||
    (b.blockers ?? 0) - (a.blockers ?? 0) ||
    (b.warnings ?? 0) - (a.warnings ?? 0) ||
    (a.file < b.file ? -1 : a.file > b.file ? 1 : 0)
  );
}

/**
 * The batch's exit code: 3 when nestready failed on a delivery (a bug), else 2 when a delivery
 * could not be read, else 1 when one fails the gate, else 0. An unreadable delivery beats a
 * failed gate, whatever `--fail-on` says: a pipeline must not pass a batch it could not read whole.
 */
export function batchExitCode(rows: readonly BatchRow[]): 0 | 1 | 2 | 3 {
  if (rows.some((r) => r.status === 'error')) return 3;
  if (rows.some((r) => r.status === 'unreadable')) return 2;
  return rows.some((r) => r.gate === 'fail') ? 1 : 0;
}

/** The summary of a batch: its rows worst first, the tallies and the exit code. */
export function buildSummary(
  rows: readonly BatchRow[],
  skipped: readonly SkippedFile[],
  context: { roles: string; failOn: FailOn },
): BatchSummary {
  const verdicts = (v: string) => rows.filter((r) => r.status === 'audited' && r.verdict === v).length;
  return {
    schema: BATCH_SCHEMA,
    tool: { name: TOOL.name, version: TOOL.version },
    roles: context.roles,
    failOn: context.failOn,
    exitCode: batchExitCode(rows),
    counts: {
      deliveries: rows.length,
      unreadable: rows.filter((r) => r.status !== 'audited').length,
      notReady: verdicts('not-ready'),
      caveats: verdicts('caveats'),
      ready: verdicts('ready'),
      skipped: skipped.length,
    },
    deliveries: [...rows].sort(worstFirst),
    skipped: [...skipped],
  };
}
