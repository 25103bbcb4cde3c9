import { readsAsNumbers } from '../profile/reads-as-numbers.js';
import type { Profile } from '../profile/types.js';
import type { Roles } from '../roles/types.js';
import type { OutcomeStats } from '../stats/types.js';

/**
 * The outcomes a linear mixed model is fitted to: those with null-model statistics, read as numbers
 * and not declared binary (a 0/1 outcome's within-group variance is fixed by its mean and its model
 * is logistic, so linear slopes, variances and F tests of it would mislead).
 */
export function linearOutcomes(profile: Profile, roles: Roles, outcomes: Record<string, OutcomeStats>): string[] {
  return roles.outcomes.filter((name) => {
    if (!outcomes[name]) return false;
    const col = profile.column(name);
    return readsAsNumbers(col) && col.type !== 'binary';
  });
}
