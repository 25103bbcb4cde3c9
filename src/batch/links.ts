import { dirname, relative, resolve, sep } from 'node:path';
import type { BatchSummary, DeliveryFiles } from './types.js';

/**
 * The summary as written to `target` (null: stdout): each delivery's files named relative to the
 * folder the summary is written in (the working folder for stdout), with `/` between folders, so
 * that the links of an HTML or Markdown summary work wherever the two are moved together.
 */
export function summaryAt(summary: BatchSummary, target: string | null): BatchSummary {
  const base = target === null ? process.cwd() : dirname(resolve(target));
  const from = (p: string) => relative(base, resolve(p)).split(sep).join('/');
  return {
    ...summary,
    deliveries: summary.deliveries.map((row) => {
      if (!row.files) return row;
      const files: DeliveryFiles = { html: from(row.files.html), json: from(row.files.json), problems: from(row.files.problems) };
      return { ...row, files };
    }),
  };
}
