import { readError } from '../errors.js';
import type { Roles } from '../roles/types.js';
import type { AnyRule } from '../rules/define.js';
import type { Finding } from '../rules/types.js';
import type { DeliveryInput } from '../source/open.js';
import { inputLabel } from '../source/open.js';
import { openSettled } from '../source/plan/open-settled.js';
import { problemRowsOfSource } from './rows-of-source.js';
import type { ProblemOptions, ProblemRows } from './types.js';
import { DEFAULT_MAX_ROWS } from './types.js';

/**
 * Every offending record behind the findings, for the file a data manager sends back: record
 * number, group ID, unit ID, rule, severity, column and a short reason. The delivery is opened
 * again in the engine the audit used, and one bounded query runs per finding, in report order.
 * Which records a finding covers, and why, is its rule's `rows` part; a rule without one sends
 * back the records its finding lists (its first 20, as in the report) with the rule's title as
 * the reason. Findings without records (few-groups, low-icc) give none. At most `maxRows` rows
 * are returned in all; `omitted` counts the rest, which are still counted by a query each.
 *
 * @param input the delivery the report was made from (a file, or a table or query in a database)
 * @param roles the role map it was audited with
 * @param findings the report's findings
 * @param rules the rules the report ran (their `rows` parts and titles)
 */
export async function collectProblemRows(
  input: DeliveryInput,
  roles: Roles,
  findings: readonly Finding[],
  rules: readonly AnyRule[],
  options: ProblemOptions = {},
): Promise<ProblemRows> {
  const { maxRows = DEFAULT_MAX_ROWS, includeValues = true, ...open } = options;
  if (!findings.length) return { rows: [], total: 0, omitted: 0, maxRows };
  const label = open.displayPath ?? inputLabel(input);
  const { source, rejected } = await openSettled(input, roles, open).catch((e: unknown) => {
    throw readError(e, label);
  });
  try {
    return await problemRowsOfSource(source, rejected, roles, findings, rules, { maxRows, includeValues });
  } catch (e) {
    throw readError(e, label);
  } finally {
    await source.close();
  }
}
