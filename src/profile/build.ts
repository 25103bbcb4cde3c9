import type { ColumnTable } from 'arquero';
import type { Roles } from '../roles/types.js';
import type { RejectedLine, Source } from '../source/open.js';
import type { ProfileColumnPlan } from '../source/plan/profile-query.js';
import { profileQuery } from '../source/plan/profile-query.js';
import { settleProbes } from '../source/plan/settle-probes.js';
import type { Storage } from '../source/sql.js';
import type { GroupMoments } from '../stats/types.js';
import { columnProfile } from './columns.js';
import { groupSizes, groupStat } from './group-stats.js';
import { NUMBER_LIKE_PATTERN } from './number-like.js';
import { plannedPairs } from './pairs.js';
import { roleOf } from './role-of.js';
import type { ColumnProfile, Profile } from './types.js';

let arquero: Promise<typeof import('arquero')> | undefined;
/**
 * Load arquero (with its expression parser, a third of the engine's code). Called when an audit
 * starts, its code is compiled while DuckDB opens and sniffs the delivery, not before.
 */
export function loadArquero(): Promise<typeof import('arquero')> {
  arquero ??= import('arquero');
  return arquero;
}

/**
 * Optional statistics of the profiling pass: 'level1-pairs', the co-moments of each outcome with the
 * level-1 variables that are not planned slopes (a planned slope's pair is always computed: the
 * report's slope statistics read it); 'number-like', the count of values that may be numbers written
 * another way in untyped level-1/level-2 text columns.
 */
export type ProfileNeed = 'level1-pairs' | 'number-like';
export const ALL_PROFILE_NEEDS: readonly ProfileNeed[] = ['level1-pairs', 'number-like'];

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
  needs: readonly ProfileNeed[] = ALL_PROFILE_NEEDS,
): ProfileColumnPlan[] {
  const pairs = plannedPairs(roles, needs.includes('level1-pairs'));
  return header
    .filter((name) => name !== roles.group)
    .map((name) => {
      const role = roleOf(name, roles);
      const isVariable = role === 'outcome' || role === 'level1' || role === 'level2' || role === 'weight';
      const s = storage.get(name) ?? 'text';
      const numberStats =
        s === 'double' ||
        hints.probe?.has(name) === true ||
        (isVariable && roles.types[name] !== 'categorical' && !hints.textOnly?.has(name));
      const pairsWith = pairs.get(name);
      // a count outcome's zeros, per group: the count-outcome rule sets them against its model's
      const zeros = numberStats && role === 'outcome' && roles.types[name] === 'count';
      // an untyped level-1/level-2 text column: whether any value is a number written another way
      // (variable-without-statistics asks, and needs no scan of its own when none is)
      const numberLike = needs.includes('number-like') && s === 'text' && (role === 'level1' || role === 'level2') && !roles.types[name];
      return {
        name,
        storage: s,
        numberStats,
        ...(name === roles.unit && { textRange: false }),
        ...(pairsWith && { pairsWith }),
        ...(zeros && { zeros }),
        ...(numberLike ? { textPattern: NUMBER_LIKE_PATTERN } : {}),
      };
    });
}

/**
 * Run the one profiling pass and hold its result as arquero tables. When a value in a column
 * read as DOUBLE is not a number, its line is rejected by the reader; those columns are then
 * read as text and the pass is run again, so no line is lost to a type guess.
 *
 * @param options.onScanned called when a pass has read the delivery, before its result is
 *   converted (a look-up may start then; a pass run again comes with a new source.viewVersion)
 */
export async function buildProfile(
  source: Source,
  roles: Roles,
  options: { onScanned?: () => void; needs?: readonly ProfileNeed[] } = {},
): Promise<Profile> {
  const needs = options.needs ?? ALL_PROFILE_NEEDS;
  let plan: ProfileColumnPlan[];
  let result: Record<string, unknown[]>;
  let rejected: RejectedLine[];
  while (true) {
    plan = planColumns(source.header, roles, source.storage, source, needs);
    result = await source.columns(profileQuery(source.view, roles.group, plan, source.dialect), options);
    rejected = await source.rejects();
    const retype = [
      ...new Set(
        rejected
          .filter((r) => r.column !== undefined && source.storage.get(r.column) === 'double')
          .flatMap((r) => (r.column ? [r.column] : [])),
      ),
    ];
    if (retype.length === 0) break;
    await source.readAsText(retype);
  }
  if (source.probe.size) {
    const textOnly = new Set(source.textOnly);
    plan = await settleProbes(
      result,
      plan,
      source,
      (name) => planColumns([name], roles, new Map([[name, 'text']]), { textOnly }, needs)[0]?.numberStats ?? false,
    );
  }
  const aq = await loadArquero();
  const raw = directArrays(aq.table(result));

  const rows = groupSizes(raw).reduce((a, b) => a + b, 0);
  // the query orders the groups (missing ID first): the group table is the rest, its columns
  // shared with the raw table rather than filtered and sorted again (a million groups are common)
  const hasMissing = result.group.length > 0 && result.group[0] === null;
  const missingGroupRows = hasMissing ? (result.n[0] as number) : 0;
  const groups = hasMissing
    ? directArrays(
        aq.table(
          Object.fromEntries(
            Object.entries(result).map(([k, v]) => [k, ArrayBuffer.isView(v) ? (v as unknown as Float64Array).subarray(1) : v.slice(1)]),
          ),
        ),
      )
    : raw;

  const profiles = new Map<string, ColumnProfile>();
  for (const name of source.header) {
    const p = plan.find((c) => c.name === name);
    profiles.set(name, columnProfile(name, roles, raw, p, rows, missingGroupRows));
  }
  const columns = aq.from([...profiles.values()]);
  const momentCache = new Map<string, GroupMoments[]>();

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
      // computed once per column (the outcome statistics, several rules and the plots ask);
      // each caller gets its own array of frozen moments
      let out = momentCache.get(name);
      if (!out) {
        const n = groupStat(groups, name, 'numericCount');
        const mean = groupStat(groups, name, 'mean');
        const ss = groupStat(groups, name, 'ss');
        out = [];
        for (let i = 0; i < n.length; i++) {
          if (n[i] > 0) out.push(Object.freeze({ n: n[i], mean: mean[i] as number, ss: Math.max(0, ss[i] as number) }));
        }
        momentCache.set(name, out);
      }
      return out.slice();
    },
  };
}

/**
 * `table.array(name)` of an unfiltered, unordered table as a plain copy of the column, not a
 * scan with a callback per row: with a million groups the rules call it hundreds of times.
 * Same result (a new Array each call), so callers may still sort or change what they get.
 */
function directArrays(table: ColumnTable): ColumnTable {
  const scan = table.array.bind(table);
  table.array = ((name: string, arrayType?: ArrayConstructor) => {
    const column = table.column(name) as unknown;
    if ((arrayType && arrayType !== Array) || table.isFiltered() || table.isOrdered() || !column) return scan(name, arrayType);
    if (Array.isArray(column)) return column.slice();
    // a typed column (Float64Array): a counted loop, several times faster than Array.from's iterator
    const typed = column as ArrayLike<unknown>;
    const out = new Array(typed.length);
    for (let i = 0; i < typed.length; i++) out[i] = typed[i];
    return out;
  }) as ColumnTable['array'];
  return table;
}
