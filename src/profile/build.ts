import * as aq from 'arquero';
import type { Roles } from '../roles/types.js';
import type { Source } from '../source/open.js';
import { settleProbes } from '../source/probe.js';
import type { GroupMoments } from '../stats/types.js';
import { key, profileQuery } from './sql.js';
import type { Storage } from '../source/sql.js';
import type { ProfileColumnPlan } from './sql.js';
import { columnProfile } from './columns.js';
import { roleOf } from './role-of.js';
import type { ColumnProfile, Profile } from './types.js';

/**
 * Which statistics each column needs: numbers for every numeric column and declared variable
 * (not for a text column whose sample held no number and whose type the role map leaves open),
 * and for the source's probed columns.
 */
export function planColumns(
  header: readonly string[],
  roles: Roles,
  storage: Map<string, Storage>,
  hints: { probe?: ReadonlySet<string>; textOnly?: ReadonlySet<string> } = {},
): ProfileColumnPlan[] {
  return header
    .filter((name) => name !== roles.group)
    .map((name) => {
      const role = roleOf(name, roles);
      const isVariable = role === 'outcome' || role === 'level1' || role === 'level2';
      const s = storage.get(name) ?? 'text';
      const numeric =
        s === 'double' ||
        hints.probe?.has(name) === true ||
        (isVariable && roles.types[name] !== 'categorical' && !hints.textOnly?.has(name));
      return { name, storage: s, numeric };
    });
}

/**
 * Run the one profiling pass and hold its result as arquero tables. When a value in a column
 * read as DOUBLE is not a number, its line is rejected by the reader; those columns are then
 * read as text and the pass is run again, so no line is lost to a type guess.
 */
export async function buildProfile(source: Source, roles: Roles): Promise<Profile> {
  let plan: ProfileColumnPlan[];
  let result;
  let rejected;
  for (;;) {
    plan = planColumns(source.header, roles, source.storage, source);
    result = await source.columns(profileQuery(source.view, roles.group, plan, source.dialect));
    rejected = await source.rejects();
    const retype = [...new Set(rejected.filter((r) => r.column && source.storage.get(r.column) === 'double').map((r) => r.column!))];
    if (retype.length === 0) break;
    await source.readAsText(retype);
  }
  if (source.probe.size) {
    const textOnly = new Set(source.textOnly);
    plan = await settleProbes(result, plan, source, (name) =>
      planColumns([name], roles, new Map([[name, 'text']]), { textOnly })[0]?.numeric ?? false,
    );
  }
  const raw = aq.table(result);

  const rows = (Array.from(raw.array('n')) as number[]).reduce((a, b) => a + b, 0);
  const missingRow = raw.filter((d: { group: unknown }) => d.group === null);
  const missingGroupRows = missingRow.numRows() ? (missingRow.get('n', 0) as number) : 0;
  const groups = raw
    .filter((d: { group: unknown }) => d.group !== null)
    .orderby('group');

  const profiles = new Map<string, ColumnProfile>();
  for (const name of source.header) {
    const p = plan.find((c) => c.name === name);
    profiles.set(name, columnProfile(name, roles, raw, p, rows, missingGroupRows));
  }
  const columns = aq.from([...profiles.values()]);

  return {
    rows,
    rejected,
    header: source.header,
    missingGroupRows,
    groups,
    columns,
    column(name) {
      const p = profiles.get(name);
      if (!p) throw new Error(`no column "${name}" in the profile`);
      return p;
    },
    moments(name): GroupMoments[] {
      const n = groups.array(key(name, 'num')) as number[];
      const mean = groups.array(key(name, 'mean')) as number[];
      const ss = groups.array(key(name, 'ss')) as number[];
      const out: GroupMoments[] = [];
      for (let i = 0; i < n.length; i++) if (n[i] > 0) out.push({ n: n[i], mean: mean[i], ss: Math.max(0, ss[i]) });
      return out;
    },
  };
}
