import type { Roles } from '../roles/types.js';
import type { AnyRule } from '../rules/define.js';
import type { RuleRun } from './types.js';

/** The rules of `catalogue` that the role map leaves on, in catalogue order (for the JUnit report). */
export function rulesRun(catalogue: readonly AnyRule[], roles: Roles): RuleRun[] {
  return catalogue
    .filter((r) => roles.rules[r.meta.id] !== 'off')
    .map((r) => ({ id: r.meta.id, title: r.meta.title, level: r.meta.level }));
}
