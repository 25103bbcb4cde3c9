import { changeCatalogue } from '../changes/index.js';
import { catalogue as builtIn } from '../rules/index.js';
import { countOutcome } from './analysis/count-outcome.js';
import { fitAdvice } from './analysis/fit-advice.js';
import { withoutPlanValues } from './analysis/plan-values.js';
import { buildPlotData } from './analysis/plot-data.js';
import { plotThresholds } from './analysis/plot-thresholds.js';
import { addPrecision } from './analysis/precision.js';
import { rulesRun } from './analysis/rules-run.js';
import { slopeStatistics } from './analysis/slopes.js';
import { threeLevelOf } from './analysis/three-level.js';
import { weightFactors, weightsAudit } from './analysis/weights.js';
import { measure } from './compare/measure.js';
import { withChanges } from './compare/run-changes.js';
import type { AnyChangeRule, Baseline } from './compare/types.js';
import { InputError, readError } from './errors.js';
import { grade } from './grade.js';
import type { ProfileNeed } from './profile/build.js';
import { ALL_PROFILE_NEEDS, buildProfile } from './profile/build.js';
import { groupSizes } from './profile/group-stats.js';
import { readsAsNumbers } from './profile/reads-as-numbers.js';
import type { Profile } from './profile/types.js';
import type { Report } from './report/types.js';
import { REPORT_SCHEMA } from './report/types.js';
import { checkColumns } from './roles/check-columns.js';
import type { LoadedRoles } from './roles/load.js';
import type { Roles } from './roles/types.js';
import type { AnyRule } from './rules/define.js';
import { runRules } from './rules/engine.js';
import type { Lookup } from './source/lookups/lookup.js';
import { createLookup } from './source/lookups/lookup.js';
import { withheldWords } from './source/plan/binary-words.js';
import type { Source } from './source/types.js';
import { outcomeStats } from './stats/index.js';
import { binaryGroupsFromMoments, logisticNullModel, momentsAreZeroOne } from './stats/logistic-null-model.js';
import type { OutcomeStats } from './stats/types.js';
import { median } from './util/median.js';

// The audit of an opened delivery, whatever the engine that opened it: the command line's
// DuckDB or PostgreSQL (src/audit.ts opens them) or DuckDB-WASM in the page (src/page/). It
// imports nothing Node-only; scripts/page-build.js fails when anything it reaches does.

/** What the audit of an opened source reads beyond the source and the role map. */
export interface SourceAuditOptions {
  /** keep raw data values in findings (default true); IDs and record numbers always stay */
  includeValues?: boolean;
  catalogue?: readonly AnyRule[];
  /** any line that cannot be read is an input error instead of a finding */
  strict?: boolean;
  /**
   * compute the report's `plots` (default true): the HTML and Markdown reports read them; a JSON
   * or terminal report does not (they cost a REML fit per level-1 column)
   */
  plotData?: boolean;
  /**
   * add the snapshot a later delivery is compared with (one extra pass; README: Snapshot);
   * `groups`: with each sketched column's bins per group too (compare keeps them in memory)
   */
  snapshot?: boolean | 'groups';
  /** with level-1 weights declared: every group's scale factors in the report object's `weightFactors` (one entry per group) */
  weightFactors?: boolean;
  /** compare with this previous delivery: the report gains `changes` and change findings (implies `snapshot`) */
  baseline?: Baseline;
  /** keep the unit IDs with their groups in this Parquet file, for `compare` (DuckDB only) */
  keepUnits?: string;
  /** the change checks (default changes/) */
  changeCatalogue?: readonly AnyChangeRule[];
  /** the report's `tool` (the command line reads its package.json; the page has it baked in) */
  tool: { name: string; version: string };
}

/** A role map as the audit takes it: loaded with positions, or plain (errors then name "role map"). */
export function loadedRoles(roleMap: LoadedRoles | Roles): LoadedRoles {
  return 'roles' in roleMap ? roleMap : { roles: roleMap, file: 'role map', locate: () => 'role map' };
}

/**
 * Audit a delivery already opened as a Source: profile once, run the rules, grade. The source
 * stays open (its opener closes it), but nothing started here is left querying it.
 */
export async function auditSource(source: Source, roleMap: LoadedRoles | Roles, options: SourceAuditOptions): Promise<Report> {
  const loaded = loadedRoles(roleMap);
  const { roles } = loaded;
  const path = source.path;
  const early: Promise<unknown>[] = [];
  try {
    checkColumns(roles, source.header, loaded.locate, path);
    const catalogue = options.catalogue ?? builtIn;
    const lookup = createLookup(source, roles.group);
    // the unit-ID check scans the delivery again: start it once the profile has read it, so it
    // runs while the profile's result is converted and the rules compute
    const unit = roles.unit;
    const prefetch =
      unit && wantsUnitIds(catalogue, roles) ? () => void early.push(lookup.unitIds(unit).catch(() => undefined)) : undefined;
    const profile = await buildProfile(source, roles, { onScanned: prefetch, needs: profileNeeds(catalogue, roles) });
    if (profile.rows === 0) throw noRecords(path, profile.rejected);
    if (options.strict && profile.rejected.length) {
      const first = profile.rejected[0];
      throw new InputError(
        `${path}: ${profile.rejected.length} line(s) could not be read (first: line ${first.line}, ${first.reason}); ` +
          'with --strict any unreadable line is an input error',
      );
    }
    const outcomes = outcomeStatistics(profile, roles);
    await kindModels(profile, roles, outcomes, lookup);
    addPrecision(outcomes, profile, roles, catalogue);
    const includeValues = options.includeValues ?? true;
    // the plots' data and the snapshot's pass need no finding: they run while the rules' look-ups
    // do, and all are let finish before an error is passed on (none may be left querying a closed source)
    const [ran, plotted, measuring] = await Promise.allSettled([
      runRules(catalogue, { profile, roles, outcomes, lookup }, { includeValues }),
      (async () => (options.plotData === false ? undefined : buildPlotData(profile, roles, outcomes, plotThresholds(catalogue, roles))))(),
      (async () => (options.snapshot || options.baseline ? measure(source, profile, roles, { ...options, includeValues }) : undefined))(),
    ]);
    const [findings, plots, measured] = [settled(ran), settled(plotted), settled(measuring)];
    const groups = groupSummary(profile);
    const audited = roles.weights && weightsAudit(profile, roles);
    const weights = includeValues ? audited : withoutPlanValues(outcomes, audited);
    const report: Report = {
      schema: REPORT_SCHEMA,
      tool: options.tool,
      input: {
        path,
        rows: profile.rows,
        rowsRejected: profile.rejected.length,
        columns: profile.header,
        ...(source.reading && { reading: options.includeValues === false ? withheldWords(source.reading) : source.reading }),
        ...(source.notes?.length && { notes: [...source.notes] }),
      },
      roles,
      groups,
      outcomes,
      findings,
      fitAdvice: fitAdvice({ roles, groups: groups.count, meanSize: groups.sizes.mean, outcomes, findings }),
      ...(weights && { weights }),
      ...(options.weightFactors && roles.weights?.level1 && { weightFactors: weightFactors(profile, roles.weights.level1) }),
      ...grade(findings),
      ...(plots && { plots }),
      rulesRun: rulesRun(catalogue, roles),
      ...(measured && { snapshot: measured.snapshot }),
    };
    if (!measured || !options.baseline) return report;
    return withChanges(report, measured, options.baseline, roles, options.changeCatalogue ?? changeCatalogue, { includeValues });
  } catch (e) {
    throw readError(e, path);
  } finally {
    // look-ups started early are let finish (an error is the rules' to report, if they ask)
    await Promise.all(early);
  }
}

/** The models an outcome's declared kind adds (count: the Poisson null model, one look-up each). */
async function kindModels(profile: Profile, roles: Roles, outcomes: Record<string, OutcomeStats>, lookup: Lookup): Promise<void> {
  for (const name of roles.outcomes) {
    if (outcomes[name] && roles.types[name] === 'count') outcomes[name].poisson = await countOutcome(profile, name, lookup);
  }
}

/** The value of a promise already known to be fulfilled. */
function settled<T>(result: PromiseSettledResult<T>): T {
  if (result.status === 'rejected') throw result.reason;
  return result.value;
}

/** Whether an enabled rule of the catalogue will ask for the unit-ID check. */
function wantsUnitIds(catalogue: readonly AnyRule[], roles: Roles): boolean {
  return catalogue.some((rule) => rule.meta.prefetch?.includes('unit-ids') && roles.rules[rule.meta.id] !== 'off');
}

/** The optional statistics of the profiling pass that an enabled rule of the catalogue reads. */
function profileNeeds(catalogue: readonly AnyRule[], roles: Roles): ProfileNeed[] {
  const on = catalogue.filter((rule) => roles.rules[rule.meta.id] !== 'off');
  return ALL_PROFILE_NEEDS.filter((need) => on.some((rule) => rule.meta.profileNeeds?.includes(need)));
}

/** Null-model statistics for every numeric (or 0/1) outcome, from the profile's group moments. */
function outcomeStatistics(profile: Profile, roles: Roles): Record<string, OutcomeStats> {
  const out: Record<string, OutcomeStats> = {};
  for (const name of roles.outcomes) {
    const col = profile.column(name);
    // no number at all (words of a declared binary, text of a declared numeric): no statistics,
    // and the variable-without-statistics rule says why
    if (!readsAsNumbers(col) || col.numericCount === 0) continue;
    const moments = profile.moments(name);
    out[name] = outcomeStats(moments);
    // a 0/1 outcome also gets the logistic null model (the binary-outcome rule reads it)
    const zeroOne = col.type === 'binary' && (col.numMin ?? 0) >= 0 && (col.numMax ?? 1) <= 1 && momentsAreZeroOne(moments);
    if (zeroOne) out[name].logistic = logisticNullModel(binaryGroupsFromMoments(moments));
    const slopes = roles.slopes?.length && col.type !== 'binary' ? slopeStatistics(profile, name, roles.slopes) : undefined;
    if (slopes) out[name].slopes = slopes;
    const threeLevel = roles.parent ? threeLevelOf(profile, roles.parent, name) : undefined;
    if (threeLevel) out[name].threeLevel = threeLevel;
  }
  return out;
}

function groupSummary(profile: Profile): Report['groups'] {
  const sizes = groupSizes(profile.groups);
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

/**
 * A delivery without a record has nothing to audit: an input error (exit 2) rather than findings
 * about zero groups, so that the sender learns the file is empty of records, or unreadable.
 */
function noRecords(path: string, rejected: readonly { line: number; reason: string }[]): InputError {
  if (!rejected.length) return new InputError(`${path}: no records (a header and nothing under it)`);
  const first = rejected[0];
  return new InputError(
    `${path}: no records: none of its ${rejected.length} line(s) under the header could be read (first: line ${first.line}, ` +
      `${first.reason})`,
  );
}
