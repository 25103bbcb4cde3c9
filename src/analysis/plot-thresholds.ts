import type { Roles } from '../roles/types.js';
import type { AnyRule } from '../rules/define.js';
import { resolveParams } from '../rules/engine.js';

/**
 * Groups with fewer records than this are marked small on the size plot when the catalogue has
 * no small-groups rule to take it from: Clarke (2008) found valid estimates with an average of
 * five records per group and biased ones at two.
 */
export const SMALL_GROUP_THRESHOLD = 5;

/** The thresholds the plots mark, as the rules that ran use them. */
export interface PlotThresholds {
  /** groups below this many records count as small; absent when small-groups is off */
  smallGroups?: number;
  /** the ICC below which low-icc speaks; absent when the rule is off or not in the catalogue */
  lowIcc?: number;
}

/**
 * The plots' thresholds from the params the rules run with (schema defaults under the role map's
 * settings), so that a plot marks the very line a finding was judged by.
 *
 * @param catalogue the rules of the audit
 * @param roles the normalised role map
 */
export function plotThresholds(catalogue: readonly AnyRule[], roles: Roles): PlotThresholds {
  const out: PlotThresholds = {};
  const small = ruleParam(catalogue, roles, 'small-groups', 'size_below', SMALL_GROUP_THRESHOLD);
  if (small !== undefined) out.smallGroups = small;
  const lowIcc = ruleParam(catalogue, roles, 'low-icc', 'icc_below', undefined);
  if (lowIcc !== undefined) out.lowIcc = lowIcc;
  return out;
}

/** A numeric param of a rule; undefined when the rule is off, `fallback` when the catalogue lacks it. */
function ruleParam(catalogue: readonly AnyRule[], roles: Roles, id: string, param: string, fallback: number | undefined) {
  const rule = catalogue.find((r) => r.meta.id === id);
  if (!rule) return fallback;
  const params = resolveParams(rule, roles);
  if (params === 'off') return undefined;
  return typeof params[param] === 'number' ? (params[param] as number) : fallback;
}
