import { groupSizes } from '../profile/group-stats.js';
import { readsAsNumbers } from '../profile/reads-as-numbers.js';
import type { Profile } from '../profile/types.js';
import type { Census } from '../source/plan/census.js';
import { nonEmptyGroups, remlComponents } from '../stats/index.js';
import { formatNumber } from '../util/format.js';
import { codeLike } from './candidates.js';
import { constancy, isConstant } from './constancy.js';
import { count } from './numbers.js';
import type { Choice, DraftPlan } from './plan.js';
import type { CandidateEvidence } from './rank.js';

/** What classify needs to know besides the chosen group's profile. */
export interface ClassifyInput {
  census: Census;
  chosen: CandidateEvidence;
  /** the profiling pass by the chosen group column */
  profile: Profile;
  /** every screened candidate (the chosen one included) */
  candidates: readonly CandidateEvidence[];
  unit?: Choice;
}

type Levels = Pick<DraftPlan, 'parent' | 'level1' | 'level2' | 'outcomes' | 'types' | 'left'>;

/**
 * Level 2: constant within (almost) every group of the chosen group column; level 1: the rest.
 * The parent is a level-2 code column with at most half as many values as there are groups that either holds
 * columns of its own constant (a level above) or stands among the identifier columns that open
 * the header. Outcome candidates are the numeric level-1 columns that are not codes of records.
 */
export function classify({ census, chosen, profile, candidates, unit }: ClassifyInput): Levels {
  const byName = new Map(census.columns.map((c) => [c.name, c]));
  const taken = new Set([chosen.column, unit?.column]);
  const level1: Choice[] = [];
  const level2: Choice[] = [];
  const left: Choice[] = [];
  for (const name of profile.header) {
    if (taken.has(name)) continue;
    const k = constancy(profile, name);
    if (k.groups === 0) left.push({ column: name, evidence: 'no values in any group of two records or more: left out' });
    else if (isConstant(k)) level2.push({ column: name, evidence: `constant within ${count(k.constant)} of ${count(k.groups)} groups` });
    else level1.push({ column: name, evidence: `varies within ${count(k.groups - k.constant)} of ${count(k.groups)} groups` });
  }

  const parent = pickParent(chosen, groupSizes(profile.groups).length, candidates, level2, census);
  const level2Kept = parent ? level2.filter((c) => c.column !== parent.column) : level2;

  const outcomes: Choice[] = [];
  for (const c of level1) {
    const col = profile.column(c.column);
    const census1 = byName.get(c.column);
    const recordCode = census1 !== undefined && codeLike(census1) && census1.distinct >= census1.nonMissing / 2;
    if (!readsAsNumbers(col) || recordCode) continue;
    outcomes.push({ column: c.column, evidence: iccEvidence(profile, c.column) });
  }

  const types: Levels['types'] = [];
  for (const c of [...level1, ...level2Kept]) {
    const col = profile.column(c.column);
    if (readsAsNumbers(col) && col.type === 'binary') types.push({ column: c.column, type: 'binary', evidence: 'values 0 and 1 only' });
    else if (!readsAsNumbers(col)) types.push({ column: c.column, type: 'categorical', evidence: 'text values' });
  }
  return { parent, level1, level2: level2Kept, outcomes, types, left };
}

function pickParent(
  chosen: CandidateEvidence,
  groups: number,
  candidates: readonly CandidateEvidence[],
  level2: readonly Choice[],
  census: Census,
): Choice | undefined {
  const byName = new Map(census.columns.map((c) => [c.name, c]));
  // the identifier columns that open the header: codes, up to the first measurement
  const opening = new Set<string>();
  for (const c of census.columns) {
    if (!codeLike(c)) break;
    opening.add(c.name);
  }
  const options = level2
    .map((choice) => {
      const c = byName.get(choice.column);
      const own = candidates.find((e) => e.column === choice.column);
      const ownColumns = own ? own.constantColumns.filter((name) => name !== chosen.column) : [];
      return { choice, c, own, ownColumns };
    })
    .filter(({ c, own }) => c && codeLike(c) && 2 * (own ? own.groups : c.distinct) <= groups && c.distinct >= 2)
    .filter(({ choice, ownColumns }) => ownColumns.length > 0 || opening.has(choice.column))
    .sort((a, b) => b.ownColumns.length - a.ownColumns.length || (b.own?.groups ?? 0) - (a.own?.groups ?? 0));
  const best = options[0];
  if (!best) return undefined;
  const why =
    best.ownColumns.length > 0
      ? `its own values hold ${best.ownColumns.length} other column(s) constant (${best.ownColumns.join(', ')})`
      : 'it stands among the identifier columns that open the header';
  return { column: best.choice.column, evidence: `each group lies within one of its values (${best.choice.evidence}); ${why}` };
}

function iccEvidence(profile: Profile, column: string): string {
  const groups = nonEmptyGroups(profile.moments(column));
  if (groups.length < 2) return 'numeric, varies within groups';
  return `ICC ${formatNumber(remlComponents(groups).icc, 2)} (REML, null model by the group)`;
}
