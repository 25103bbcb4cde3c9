import type { Report } from './types.js';

export interface JsonOptions {
  /**
   * Write the whole report object, with `plots`, `rulesRun` and `weightFactors`, e.g. to render HTML or JUnit from
   * it later. Off by default: the JSON contract (shared/design.md) has fixed stable fields.
   */
  withPlotData?: boolean;
}

/** The machine-readable report: the stable fields of the report object (NaN and Infinity become null). */
export function renderJson(report: Report, options: JsonOptions = {}): string {
  const { plots, rulesRun, weightFactors, ...stable } = report;
  const whole = { ...(plots && { plots }), ...(rulesRun && { rulesRun }), ...(weightFactors && { weightFactors }) };
  const out = options.withPlotData ? { ...stable, ...whole } : stable;
  return `${JSON.stringify(out, null, 2)}\n`;
}
