import type { Roles } from '../roles/types.js';
import type { ColumnRole } from './types.js';

/** The role a column plays in the role map ('other' when it is not named). */
export function roleOf(name: string, roles: Roles): ColumnRole {
  if (name === roles.group) return 'group';
  if (name === roles.unit) return 'unit';
  if (name === roles.parent) return 'parent';
  if (roles.outcomes.includes(name)) return 'outcome';
  if (roles.level1.includes(name)) return 'level1';
  if (roles.level2.includes(name)) return 'level2';
  if (name === roles.weights?.level1 || name === roles.weights?.level2) return 'weight';
  return 'other';
}
