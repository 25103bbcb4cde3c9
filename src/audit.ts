import { catalogue as builtIn } from '../rules/index.js';
import { grade } from './grade.js';
import { buildProfile } from './profile/build.js';
import type { Profile } from './profile/types.js';
import { checkColumns } from './roles/check-columns.js';
import type { LoadedRoles } from './roles/load.js';
import type { Roles } from './roles/types.js';
import { REPORT_SCHEMA } from './report/types.js';
import type { Report } from './report/types.js';
import type { AnyRule } from './rules/define.js';
import { runRules } from './rules/engine.js';
import { createLookup } from './rules/lookup.js';
import { openDelivery } from './source/open.js';
import { outcomeStats } from './stats/index.js';
import type { OutcomeStats } from './stats/types.js';
import { median } from './util/median.js';
import { TOOL } from './version.js';

export interface AuditOptions {
  /** keep raw data values in findings (default true); IDs and record numbers always stay */
  includeValues?: boolean;
  /** DuckDB memory limit before it spills to disk, e.g. "200MB" */
  memoryLimit?: string;
  threads?: number;
  catalogue?: readonly AnyRule[];
}

/** Audit one delivery against a role map: open, profile once, run the rules, grade. */
export async function audit(path: string, roleMap: LoadedRoles | Roles, options: AuditOptions = {}): Promise<Report> {
  const loaded: LoadedRoles = 'roles' in roleMap ? roleMap : { roles: roleMap, file: 'role map', locate: () => 'role map' };
  const { roles } = loaded;
  const source = await openDelivery(path, roles, {
    missing: roles.missing,
    memoryLimit: options.memoryLimit,
    threads: options.threads,
  });
  try {
    checkColumns(roles, source.header, loaded.locate, path);
    const profile = await buildProfile(source, roles);
    const outcomes = outcomeStatistics(profile, roles);
    const findings = await runRules(
      options.catalogue ?? builtIn,
      { profile, roles, outcomes, lookup: createLookup(source, roles.group) },
      { includeValues: options.includeValues ?? true },
    );
    return {
      schema: REPORT_SCHEMA,
      tool: TOOL,
      input: { path, rows: profile.rows, rowsRejected: profile.rejected.length, columns: profile.header },
      roles,
      groups: groupSummary(profile),
      outcomes,
      findings,
      ...grade(findings),
    };
  } finally {
    source.close();
  }
}

/** Null-model statistics for every numeric (or 0/1) outcome, from the profile's group moments. */
function outcomeStatistics(profile: Profile, roles: Roles): Record<string, OutcomeStats> {
  const out: Record<string, OutcomeStats> = {};
  for (const name of roles.outcomes) {
    const col = profile.column(name);
    if (!col.numericProfiled || col.type === 'categorical') continue;
    out[name] = outcomeStats(profile.moments(name));
  }
  return out;
}

function groupSummary(profile: Profile): Report['groups'] {
  const sizes = profile.groups.array('n') as number[];
  const count = sizes.length;
  const sorted = [...sizes].sort((a, b) => a - b);
  return {
    count,
    singletons: sizes.filter((n) => n === 1).length,
    sizes: count
      ? { min: sorted[0], median: median(sorted), mean: sizes.reduce((a, b) => a + b, 0) / count, max: sorted[count - 1] }
      : { min: 0, median: 0, mean: 0, max: 0 },
  };
}
