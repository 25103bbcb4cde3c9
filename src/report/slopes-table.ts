import type { OutcomeStats } from '../stats/types.js';
import { formatNumber as f } from '../util/format.js';
import type { StatTable } from './stat-tables.js';

/** The planned random slopes of an outcome: the moment estimate of each slope's variance (null without planned slopes). */
export function slopesTable(name: string, o: OutcomeStats): StatTable | null {
  const slopes = Object.entries(o.slopes ?? {});
  if (!slopes.length) return null;
  return {
    caption: `${name}: planned random slopes, moment estimate from per-group OLS slopes`,
    head: ['slope', 'groups', 'mean slope', 'variance of slopes', 'mean sampling variance', 'τ₁₁ estimate', 'reliability'],
    rows: slopes.map(([col, s]) => [
      col,
      String(s.groups),
      f(s.meanSlope, 3),
      f(s.observedVariance, 4),
      f(s.meanSamplingVariance, 4),
      f(s.tau11, 4),
      f(s.reliability, 3),
    ]),
    numeric: [1, 2, 3, 4, 5, 6],
  };
}
