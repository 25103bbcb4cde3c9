import { readFileSync, statSync } from 'node:fs';
import { InputError } from '../errors.js';
import type { RuleMeta } from '../rules/types.js';
import type { LoadedRoles, RoleOptions } from './load.js';
import { parseRoles } from './load.js';
import { checkRoleMapBytes } from './yaml-guards.js';

// Reading the role map's file is the command line's and the library's; parsing it (load.ts) is
// shared with the page, which gets the text from the data manager's pick.

/** Read, validate and normalise a role map file. Errors are one line naming file:line:col. */
export function loadRoles(file: string, catalogue: readonly { meta: RuleMeta }[], options: RoleOptions = {}): LoadedRoles {
  let text: string;
  try {
    // a role map beyond the size limit is refused unread
    checkRoleMapBytes(statSync(file).size, file);
    text = readFileSync(file, 'utf8');
  } catch (e) {
    if (e instanceof InputError) throw e;
    throw new InputError(`${file}: cannot read the role map (${(e as NodeJS.ErrnoException).code ?? e})`);
  }
  return parseRoles(text, file, catalogue, options);
}
