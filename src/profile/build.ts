import * as aq from 'arquero';
import type { Roles } from '../roles/types.js';
import type { Source } from '../source/open.js';
import type { GroupMoments } from '../stats/types.js';
import { key, profileQuery } from './sql.js';
import type { ProfileColumnPlan } from './sql.js';
import { columnProfile } from './columns.js';
import { roleOf } from './role-of.js';
import type { ColumnProfile, Profile } from './types.js';

/** Which statistics each column needs: numbers for variables, distinct counts where constancy matters. */
export function planColumns(header: readonly string[], roles: Roles, sniffedNumeric: Set<string>): ProfileColumnPlan[] {
  return header
    .filter((name) => name !== roles.group)
    .map((name) => {
      const role = roleOf(name, roles);
      const declared = roles.types[name];
      const isId = role === 'unit' || role === 'parent';
      const isVariable = role === 'outcome' || role === 'level1' || role === 'level2';
      const numeric =
        declared === 'numeric' || declared === 'binary' || (declared !== 'categorical' && !isId && (isVariable || sniffedNumeric.has(name)));
      return { name, numeric, distinct: role === 'level2' || role === 'parent' };
    });
}

/** Run the one profiling pass and hold its result as arquero tables. */
export async function buildProfile(source: Source, roles: Roles): Promise<Profile> {
  const plan = planColumns(source.header, roles, source.sniffedNumeric);
  const reader = await source.con.runAndReadAll(profileQuery(source.view, roles.group, plan));
  const rejected = await source.rejects();
  const raw = aq.table(reader.getColumnsObjectJS() as Record<string, unknown[]>);

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
