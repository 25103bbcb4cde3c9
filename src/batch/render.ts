import { renderBatchHtml } from './render-html.js';
import { renderBatchJson } from './render-json.js';
import { renderBatchMarkdown } from './render-markdown.js';
import { renderBatchText } from './render-text.js';
import type { BatchSummary } from './types.js';

/** The summary's formats: the report formats a summary of deliveries has a form in (JUnit has none). */
export const BATCH_FORMATS = {
  text: (s: BatchSummary, o: { color: 0 | 1 | 2 | 3 }) => renderBatchText(s, o),
  json: (s: BatchSummary) => renderBatchJson(s),
  md: (s: BatchSummary) => renderBatchMarkdown(s),
  html: (s: BatchSummary) => renderBatchHtml(s),
} as const;

export type BatchFormat = keyof typeof BATCH_FORMATS;

export function isBatchFormat(format: string): format is BatchFormat {
  return format in BATCH_FORMATS;
}
