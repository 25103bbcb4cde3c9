import type { ValueType } from '../roles/types.js';
import type { MissingCandidate } from './missing-codes.js';

/** A column the draft gives a role, with the evidence for it (written as a comment). */
export interface Choice {
  column: string;
  evidence: string;
}

/** What the draft proposes: a role map with its evidence, before it is written as YAML. */
export interface DraftPlan {
  /** the delivery as named in the header comment */
  input: string;
  rows: number;
  group: Choice;
  /** the other group candidates, best first (comments only) */
  otherGroups: Choice[];
  unit?: Choice;
  parent?: Choice;
  level1: Choice[];
  level2: Choice[];
  /** numeric columns that vary within groups: the analyst picks the outcome (written commented out) */
  outcomes: Choice[];
  types: (Choice & { type: ValueType })[];
  /** the time of longitudinal data, proposed commented out */
  time?: Choice;
  /** sampling weight candidates by level, proposed commented out (taken out of level1/level2) */
  weights: (Choice & { level: 'level1' | 'level2' })[];
  /** outcome candidates of non-negative whole numbers: `types: count`, proposed commented out */
  counts: Choice[];
  /** columns left out (no values to judge by) */
  left: Choice[];
  missing: { defaults: string[]; candidates: MissingCandidate[] };
}
