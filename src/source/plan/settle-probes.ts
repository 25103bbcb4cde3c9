import type { Roles } from '../../roles/types.js';
import type { Source } from '../types.js';

/** The plan entry of one column, as the profile builds it (kept structural to avoid an import cycle). */
interface PlanEntry {
  name: string;
  storage: 'text' | 'double';
  numberStats: boolean;
}

const sum = (xs: unknown[] | undefined) => (xs ?? []).reduce<number>((a, b) => a + (typeof b === 'number' ? b : 0), 0);

/**
 * Settle the probed columns (text columns whose sample was all numbers, on sources without a
 * typed reader) from the profile's own counts, so the result is what a typed read would have
 * given: a column whose every value is a number becomes double (its text min/max dropped, the
 * source re-reads it as numbers for the look-ups); any other keeps the numeric reading only
 * when the plan would have asked for it. No second pass over the data.
 */
export async function settleProbes<P extends PlanEntry>(
  columns: Record<string, unknown[]>,
  plan: P[],
  source: Source,
  wantsNumeric: (name: string) => boolean,
): Promise<P[]> {
  const toDouble: string[] = [];
  const settled = plan.map((p) => {
    if (!source.probe.has(p.name)) return p;
    const nn = sum(columns[`${p.name}:nn`]);
    const num = sum(columns[`${p.name}:num`]);
    if (nn > 0 && num === nn) {
      toDouble.push(p.name);
      delete columns[`${p.name}:min`];
      delete columns[`${p.name}:max`];
      return { ...p, storage: 'double' as const, numberStats: true };
    }
    if (wantsNumeric(p.name)) return p;
    for (const stat of ['num', 'nmin', 'nmax', 'mean', 'ss']) delete columns[`${p.name}:${stat}`];
    return { ...p, numberStats: false };
  });
  const rest = [...source.probe].filter((c) => !toDouble.includes(c));
  if (toDouble.length) await source.readAsDouble(toDouble);
  for (const c of rest) source.probe.delete(c);
  return settled;
}

export type { Roles };
