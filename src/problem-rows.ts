import { catalogue as builtIn } from '../rules/index.js';
import { collectProblemRows } from './problems/collect.js';
import type { ProblemOptions, ProblemRows } from './problems/types.js';
import type { Roles } from './roles/types.js';
import type { AnyRule } from './rules/define.js';
import type { Finding } from './rules/types.js';
import type { DeliveryInput } from './source/open.js';

/**
 * The problem rows of an audit's findings (see collectProblemRows): the records each finding
 * covers, read again from the delivery the audit read (a file, or a table or query in
 * PostgreSQL), by the rules of `options.catalogue` (default the built-in catalogue).
 */
export function problemRows(
  input: DeliveryInput,
  roles: Roles,
  findings: readonly Finding[],
  options: ProblemOptions & { catalogue?: readonly AnyRule[] } = {},
): Promise<ProblemRows> {
  const { catalogue = builtIn, ...rest } = options;
  return collectProblemRows(input, roles, findings, catalogue, rest);
}
