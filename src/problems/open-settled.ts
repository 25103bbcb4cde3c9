import type { ProblemOptions } from './types.js';
import type { Roles } from '../roles/types.js';
import { openDelivery } from '../source/open.js';
import type { RejectedLine, Source } from '../source/open.js';

/**
 * Open the delivery as the audit read it: one full read of every column, and columns whose
 * values failed to convert re-read as text (as buildProfile does), so that record numbers and
 * unreadable lines match the report's.
 */
export async function openSettled(
  path: string,
  roles: Roles,
  options: Pick<ProblemOptions, 'memoryLimit' | 'threads' | 'format' | 'encoding' | 'sheet'>,
): Promise<{ source: Source; rejected: RejectedLine[] }> {
  const source = await openDelivery(path, roles, {
    missing: roles.missing,
    memoryLimit: options.memoryLimit,
    threads: options.threads,
    format: options.format,
    encoding: options.encoding,
    sheet: options.sheet,
  });
  try {
    for (;;) {
      // count(COLUMNS(*)) converts every column, so every unreadable line is seen; run as a full
      // read (columns), on the connection whose rejects log rejects() reads
      await source.columns(`SELECT count(COLUMNS(*)) FROM ${source.view}`);
      const rejected = await source.rejects();
      const retype = [...new Set(rejected.filter((r) => r.column && source.storage.get(r.column) === 'double').map((r) => r.column!))];
      if (retype.length === 0) return { source, rejected };
      await source.readAsText(retype);
    }
  } catch (e) {
    source.close();
    throw e;
  }
}
