import type { Report } from '../types.js';
import { groupMeansChart } from './group-means.js';
import { groupSizesChart } from './group-sizes.js';
import { iccChart } from './icc.js';
import { predictorSharesChart } from './predictor-shares.js';
import type { Chart } from './types.js';

/** The charts of a report, by section; empty when the report carries no plot data. */
export function reportCharts(report: Report): { sizes: Chart | null; means: Chart[]; icc: Chart | null; predictors: Chart | null } {
  const plots = report.plots;
  if (!plots) return { sizes: null, means: [], icc: null, predictors: null };
  const means = Object.entries(plots.groupMeans)
    .map(([outcome, m], i) => groupMeansChart(outcome, m, i))
    .filter((c): c is Chart => c !== null);
  return {
    sizes: groupSizesChart(plots),
    means,
    icc: iccChart(report.outcomes, plots.lowIccThreshold),
    predictors: predictorSharesChart(plots),
  };
}
