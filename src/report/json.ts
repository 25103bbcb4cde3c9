import type { Report } from './types.js';

export interface JsonOptions {
  /**
   * Write the whole report object, with `plots` and `rulesRun`, e.g. to render HTML or JUnit from
   * it later. Off by default: the JSON contract (shared/design.md) has fixed stable fields.
   */
  withPlotData?: boolean;
}

/** The machine-readable report: the stable fields of the report object (NaN and Infinity become null). */
export function renderJson(report: Report, options: JsonOptions = {}): string {
  const { plots, rulesRun, ...stable } = report;
  const out = options.withPlotData ? { ...stable, ...(plots && { plots }), ...(rulesRun && { rulesRun }) } : stable;
  return `${JSON.stringify(out, null, 2)}\n`;
}
