import type { Report } from './types.js';

/** The machine-readable report: the report object itself (NaN and Infinity become null). */
export function renderJson(report: Report): string {
  return `${JSON.stringify(report, null, 2)}\n`;
}
