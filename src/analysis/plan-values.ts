import type { OutcomeStats } from '../stats/types.js';
import type { WeightsAudit } from './weights.js';

/**
 * The plan's report parts without raw data values, for `--no-values`: the smallest weight and the
 * predictor's category are values of the delivery; the statistics beside them are not.
 */
export function withoutPlanValues(outcomes: Record<string, OutcomeStats>, weights: WeightsAudit | undefined): WeightsAudit | undefined {
  for (const o of Object.values(outcomes)) {
    if (o.precision) delete o.precision.category;
  }
  if (!weights) return weights;
  const out = structuredClone(weights);
  if (out.level1) delete out.level1.min;
  if (out.level2) delete out.level2.min;
  return out;
}
