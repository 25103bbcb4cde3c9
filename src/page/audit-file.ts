import { catalogue } from '../../rules/index.js';
import { auditSource } from '../audit-source.js';
import { problemRowsOfSource } from '../problems/rows-of-source.js';
import type { ProblemRows } from '../problems/types.js';
import type { Report } from '../report/types.js';
import type { LoadedRoles } from '../roles/load.js';
import { openPicked } from '../source/engines/wasm/open.js';
import type { PickedFile } from '../source/engines/wasm/picked.js';
import type { WasmDatabase } from '../source/engines/wasm/types.js';
import { settleSource } from '../source/plan/settle.js';
import type { PageSettings } from './settings.js';

/** A step of the audit, for the page's progress line. */
export type Phase = 'reading' | 'checking' | 'problem rows';

/**
 * The command line's audit and problem rows of a picked file, on DuckDB-WASM: the same rule
 * modules, statistics, grading and problem-row queries (src/audit-source.ts,
 * src/problems/rows-of-source.ts), on a source opened by the WASM engine.
 */
export async function auditPicked(
  db: WasmDatabase,
  picked: PickedFile,
  loaded: LoadedRoles,
  settings: PageSettings,
  onPhase: (phase: Phase) => void,
): Promise<{ report: Report; rows: ProblemRows }> {
  onPhase('reading');
  const source = await openPicked(db, picked, loaded.roles, { missing: loaded.roles.missing });
  try {
    onPhase('checking');
    const report = await auditSource(source, loaded, { tool: settings.tool, catalogue });
    onPhase('problem rows');
    // the command line opens the file again for its problem rows; the page settles the source it has
    const rejected = await settleSource(source);
    const rows = await problemRowsOfSource(source, rejected, loaded.roles, report.findings, catalogue);
    return { report, rows };
  } finally {
    await source.close();
  }
}
