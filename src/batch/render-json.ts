import type { BatchSummary } from './types.js';

/** The batch summary for machines (`nestready/batch@1`, README "Auditing a folder of deliveries"). */
export function renderBatchJson(summary: BatchSummary): string {
  return `${JSON.stringify(summary, null, 2)}\n`;
}
