import type { Report } from '../types.js';
import { groupMeansChart } from './group-means.js';
import { groupSizesChart } from './group-sizes.js';
import { iccChart } from './icc.js';
import { predictorSharesChart } from './predictor-shares.js';
import type { Chart } from './types.js';

export interface ReportCharts {
  sizes: Chart | null;
  /** one per outcome with group means to plot */
  means: { outcome: string; chart: Chart }[];
  icc: Chart | null;
  predictors: Chart | null;
}

/** The charts of a report, by section; empty when the report carries no plot data. */
export function reportCharts(report: Report): ReportCharts {
  const plots = report.plots;
  if (!plots) return { sizes: null, means: [], icc: null, predictors: null };
  const means: ReportCharts['means'] = [];
  Object.entries(plots.groupMeans).forEach(([outcome, m], i) => {
    const chart = groupMeansChart(outcome, m, i);
    if (chart) means.push({ outcome, chart });
  });
  return {
    sizes: groupSizesChart(plots),
    means,
    icc: iccChart(report.outcomes, plots.lowIccThreshold),
    predictors: predictorSharesChart(plots),
  };
}
