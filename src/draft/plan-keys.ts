import { readsAsNumbers } from '../profile/reads-as-numbers.js';
import type { Profile } from '../profile/types.js';
import type { Census } from '../source/plan/census.js';
import { constancy } from './constancy.js';
import { count } from './numbers.js';
import type { Choice, DraftPlan } from './plan.js';

/** At most this many distinct times for an occasion column (a schedule of waves, not a clock; common practice). */
const MAX_OCCASIONS = 20;
/** Words that name an occasion, whole words of the column name. */
const OCCASION_WORDS = new Set([
  'time',
  'wave',
  'occasion',
  'visit',
  'week',
  'month',
  'day',
  'year',
  'session',
  'round',
  'period',
  'followup',
]);
/** Names of a weight: whole words, or `weight`/`wgt` anywhere in the name. */
const WEIGHT_WORDS = new Set(['w', 'wt', 'pw', 'sw']);

type Keys = Pick<DraftPlan, 'time' | 'weights' | 'counts'>;

/**
 * The model-plan keys a draft can propose from the data, all written commented out for the
 * analyst to take or leave: the time of longitudinal data, sampling weights, and `count` for an
 * outcome candidate of non-negative whole numbers.
 *
 * @param levels the draft's level-1, level-2 and outcome choices so far
 */
export function planKeys(census: Census, profile: Profile, levels: Pick<DraftPlan, 'level1' | 'level2' | 'outcomes'>): Keys {
  const byName = new Map(census.columns.map((c) => [c.name, c]));
  const weights: DraftPlan['weights'] = [];
  for (const [level, list] of [
    ['level1', levels.level1],
    ['level2', levels.level2],
  ] as const) {
    for (const c of list) {
      const col = profile.column(c.column);
      if (!weightName(c.column) || !readsAsNumbers(col) || !((col.numMin ?? 0) > 0)) continue;
      weights.push({ column: c.column, level, evidence: `positive (${col.numMin} to ${col.numMax}), named like a weight; ${c.evidence}` });
    }
  }
  const weightColumns = new Set(weights.map((w) => w.column));
  let time: Choice | undefined;
  for (const c of levels.level1) {
    const col = profile.column(c.column);
    const distinct = byName.get(c.column)?.distinct ?? Number.POSITIVE_INFINITY;
    if (time || weightColumns.has(c.column) || !occasionName(c.column) || !readsAsNumbers(col) || distinct > MAX_OCCASIONS) continue;
    const k = constancy(profile, c.column);
    if (k.groups === 0 || 2 * (k.groups - k.constant) < k.groups) continue;
    const range = col.numMin === col.numMax ? '' : ` (${col.numMin} to ${col.numMax})`;
    time = {
      column: c.column,
      evidence:
        `${count(distinct)} distinct values${range}, varies within ${count(k.groups - k.constant)} of ${count(k.groups)} groups; ` +
        'named like an occasion',
    };
  }
  const counts: Choice[] = [];
  for (const c of levels.outcomes) {
    const col = profile.column(c.column);
    const census1 = byName.get(c.column);
    if (
      !census1 ||
      weightColumns.has(c.column) ||
      c.column === time?.column ||
      census1.fractional > 0 ||
      col.type === 'binary' ||
      census1.distinct <= 2 ||
      !((col.numMin ?? -1) >= 0)
    )
      continue;
    counts.push({ column: c.column, evidence: `whole numbers ${col.numMin} to ${col.numMax}: a count, if it is the outcome` });
  }
  return { ...(time && { time }), weights, counts };
}

/** The lower-case words of a name (`visitNo` → visit, no; `wave_2` → wave). */
function words(name: string): string[] {
  return name
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .toLowerCase()
    .split(/[^a-z]+/)
    .filter(Boolean);
}

function occasionName(name: string): boolean {
  return words(name).some((w) => OCCASION_WORDS.has(w));
}

function weightName(name: string): boolean {
  return /weight|wgt/i.test(name) || words(name).some((w) => WEIGHT_WORDS.has(w));
}

/**
 * The levels without the weight candidates: a weight plays no other part in a role map, so a
 * weight left in level1 or level2 would make uncommenting `weights` an error.
 */
export function apartFromWeights<L extends Pick<DraftPlan, 'level1' | 'level2' | 'outcomes'>>(levels: L, keys: Keys): L {
  const taken = new Set(keys.weights.map((w) => w.column));
  const keep = (list: Choice[]) => list.filter((c) => !taken.has(c.column));
  return { ...levels, level1: keep(levels.level1), level2: keep(levels.level2), outcomes: keep(levels.outcomes) };
}
