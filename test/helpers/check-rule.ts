import { catalogue } from '../../rules/index.js';
import { loadArquero } from '../../src/profile/build.js';
import type { Profile } from '../../src/profile/types.js';
import { parseRoles } from '../../src/roles/load.js';
import { runRules } from '../../src/rules/engine.js';
import type { Finding, RuleContext } from '../../src/rules/types.js';
import type { OutcomeStats } from '../../src/stats/types.js';
import { groupId, toYaml } from './delivery.js';

/**
 * A profile of groups of the given sizes, built in memory: for the threshold cases of rules that
 * read only the group table's IDs and sizes, so they need no delivery and no DuckDB. IDs default
 * to G001, G002, …; like the real profile's, they should be in ascending order.
 */
export async function profileOfGroups(
  sizes: readonly number[],
  ids: readonly string[] = sizes.map((_, j) => groupId(j)),
): Promise<Profile> {
  if (ids.length !== sizes.length) throw new Error('one ID per group size');
  const aq = await loadArquero();
  const none = (name: string): never => {
    throw new Error(`a profile of group sizes has no column "${name}": test this case with a delivery`);
  };
  return {
    rows: sizes.reduce((a, b) => a + b, 0),
    rejected: [],
    header: ['g'],
    missingGroupRows: 0,
    groups: aq.table({ group: [...ids], n: Float64Array.from(sizes) }),
    columns: aq.from([]),
    column: none,
    moments: none,
  };
}

/**
 * Run one rule of the catalogue on a built profile as the audit would (its params and severity
 * from the role map, messages rendered, findings sorted), without the other rules. A rule that
 * asks for a look-up fails: such cases need a delivery (test/helpers/delivery.ts).
 */
export async function checkRule(
  id: string,
  profile: Profile,
  roles: string | Record<string, unknown> = { group: 'g' },
  outcomes: Record<string, OutcomeStats> = {},
  includeValues = true,
): Promise<Finding[]> {
  const rule = catalogue.find((r) => r.meta.id === id);
  if (!rule) throw new Error(`no rule "${id}" in the catalogue`);
  const { roles: parsed } = parseRoles(toYaml(roles), 'roles.yaml', catalogue);
  const lookup = new Proxy(
    {},
    {
      get: (_, name) => () => {
        throw new Error(`${id} asked for lookup.${String(name)}: test this case with a delivery`);
      },
    },
  ) as RuleContext<unknown>['lookup'];
  return runRules([rule], { profile, roles: parsed, outcomes, lookup }, { includeValues });
}
