import type { CandidateScreen } from '../source/plan/census.js';
import { isConstant } from './constancy.js';

/** What the screening pass showed about one group candidate. */
export interface CandidateEvidence {
  column: string;
  groups: number;
  /** groups of two records or more */
  multiGroups: number;
  /** the other columns constant within (almost) every one of its groups */
  constantColumns: string[];
  /** the other columns looked at */
  otherColumns: number;
  /** position in the header */
  position: number;
}

/** A candidate's evidence from its screen. */
export function candidateEvidence(screen: CandidateScreen, header: readonly string[]): CandidateEvidence {
  const others = screen.columns.filter((c) => c.column !== screen.group);
  return {
    column: screen.group,
    groups: screen.groups,
    multiGroups: screen.multiGroups,
    constantColumns: others.filter((c) => isConstant(c)).map((c) => c.column),
    otherColumns: others.length,
    position: header.indexOf(screen.group),
  };
}

/**
 * Best first: the candidate whose groups hold the most other columns constant (a group ID
 * carries its level-2 variables, and a finer ID nested in a coarser one holds the coarser one's
 * too); at a tie the finer partition, then the earlier column (identifiers tend to come first).
 * A candidate none of whose groups has two records cannot be a group.
 */
export function rankCandidates(candidates: readonly CandidateEvidence[]): CandidateEvidence[] {
  return candidates
    .filter((c) => c.multiGroups > 0)
    .sort((a, b) => b.constantColumns.length - a.constantColumns.length || b.groups - a.groups || a.position - b.position);
}
