import { InputError, nameList, quoteName } from '../errors.js';
import type { Roles } from './types.js';

type Locate = (path: (string | number)[]) => string;

/** Every column the role map names must be in the delivery's header; the error lists the header. */
export function checkColumns(roles: Roles, header: readonly string[], locate: Locate, deliveryPath: string): void {
  const named: [string, (string | number)[]][] = [];
  const add = (column: string | undefined, path: (string | number)[]) => column !== undefined && named.push([column, path]);
  add(roles.group, ['group']);
  add(roles.unit, ['unit']);
  add(roles.parent, ['parent']);
  // before the level lists: a slope, the time and the predictor are added to them when left out
  for (const [i, c] of (roles.slopes ?? []).entries()) add(c, ['slopes', i]);
  add(roles.time, ['time']);
  add(roles.weights?.level1, ['weights', 'level1']);
  add(roles.weights?.level2, ['weights', 'level2']);
  add(roles.detect?.predictor, ['detect', 'predictor']);
  for (const [i, c] of roles.outcomes.entries()) add(c, ['outcomes', i]);
  for (const [i, c] of roles.level1.entries()) add(c, ['level1', i]);
  for (const [i, c] of roles.level2.entries()) add(c, ['level2', i]);
  for (const c of Object.keys(roles.types)) add(c, ['types', c]);
  const have = new Set(header);
  for (const [column, path] of named) {
    if (have.has(column)) continue;
    const near = header.find((h) => h.trim().toLowerCase() === column.trim().toLowerCase());
    const hint = near ? ` (did you mean ${quoteName(near)}?)` : '';
    throw new InputError(
      `${locate(path)}: column ${quoteName(column)} is not in ${deliveryPath}${hint}; its header is: ${nameList(header)}`,
    );
  }
}
