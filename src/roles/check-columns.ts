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
