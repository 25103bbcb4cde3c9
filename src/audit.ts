import { catalogue as builtIn } from '../rules/index.js';
import { fitAdvice } from './analysis/fit-advice.js';
import { withoutPlanValues } from './analysis/plan-values.js';
import { buildPlotData } from './analysis/plot-data.js';
import { plotThresholds } from './analysis/plot-thresholds.js';
import { addPrecision } from './analysis/precision.js';
import { rulesRun } from './analysis/rules-run.js';
import { weightsAudit } from './analysis/weights.js';
import { InputError, readError } from './errors.js';
import { grade } from './grade.js';
import { buildProfile, loadArquero } from './profile/build.js';
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
import { createLookup } from './source/lookups/lookup.js';
import type { DeliveryInput, Encoding, InputFormat, Source } from './source/open.js';
import { openSource } from './source/open.js';
import { withheldWords } from './source/plan/binary-words.js';
import { outcomeStats } from './stats/index.js';
import { binaryGroupsFromMoments, logisticNullModel, momentsAreZeroOne } from './stats/logistic-null-model.js';
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
  /** the delivery's format when not detected from its name and content */
  inputFormat?: InputFormat;
  /** text encoding of a CSV/TSV delivery (default UTF-8) */
  encoding?: Encoding;
  /** Excel: the worksheet to read (default the first) */
  sheet?: string;
  /**
   * CSV/TSV: read numbers written with a decimal comma (12,5). Without it they are read so when
   * the fields are not separated by commas and the first records leave no doubt.
   */
  decimalComma?: boolean;
  /** any line that cannot be read is an input error instead of a finding */
  strict?: boolean;
  /** what the report calls a file input (default its path; the CLI passes "-" for a spooled stdin) */
  displayPath?: string;
  /**
   * compute the report's `plots` (default true): the HTML and Markdown reports read them; a JSON
   * or terminal report does not (they cost a REML fit per level-1 column)
   */
  plotData?: boolean;
}

/** A delivery: a file path (`-` for standard input), or a table or query in PostgreSQL. */
export type AuditInput = DeliveryInput;

/** The delivery opened in the engine its kind calls for (src/source/engines/registry.ts). */
export function openInput(input: AuditInput, roles: Roles, options: AuditOptions): Promise<Source> {
  return openSource(input, roles, {
    missing: roles.missing,
    memoryLimit: options.memoryLimit,
    threads: options.threads,
    format: options.inputFormat,
    encoding: options.encoding,
    sheet: options.sheet,
    displayPath: options.displayPath,
    ...(options.decimalComma && { decimalComma: true }),
  });
}

/** Audit one delivery against a role map: open, profile once, run the rules, grade. */
export async function audit(input: AuditInput, roleMap: LoadedRoles | Roles, options: AuditOptions = {}): Promise<Report> {
  const loaded: LoadedRoles = 'roles' in roleMap ? roleMap : { roles: roleMap, file: 'role map', locate: () => 'role map' };
  const { roles } = loaded;
  loadArquero().catch(() => undefined); // compiled while the delivery is opened (awaited by buildProfile)
  const source = await openInput(input, roles, options);
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
    const profile = await buildProfile(source, roles, { onScanned: prefetch });
    if (profile.rows === 0) throw noRecords(path, profile.rejected);
    if (options.strict && profile.rejected.length) {
      const first = profile.rejected[0];
      throw new InputError(
        `${path}: ${profile.rejected.length} line(s) could not be read (first: line ${first.line}, ${first.reason}); ` +
          'with --strict any unreadable line is an input error',
      );
    }
    const outcomes = outcomeStatistics(profile, roles);
    addPrecision(outcomes, profile, roles, catalogue);
    // the plots' data needs no finding: it is computed while the rules' look-ups run, and both
    // are let finish before an error is passed on (none may be left querying a closed source)
    const [ran, plotted] = await Promise.allSettled([
      runRules(catalogue, { profile, roles, outcomes, lookup }, { includeValues: options.includeValues ?? true }),
      (async () => (options.plotData === false ? undefined : buildPlotData(profile, roles, outcomes, plotThresholds(catalogue, roles))))(),
    ]);
    if (ran.status === 'rejected') throw ran.reason;
    if (plotted.status === 'rejected') throw plotted.reason;
    const [findings, plots] = [ran.value, plotted.value];
    const groups = groupSummary(profile);
    const audited = roles.weights && weightsAudit(profile, roles);
    const weights = options.includeValues === false ? withoutPlanValues(outcomes, audited) : audited;
    return {
      schema: REPORT_SCHEMA,
      tool: TOOL,
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
      ...grade(findings),
      ...(plots && { plots }),
      rulesRun: rulesRun(catalogue, roles),
    };
  } catch (e) {
    throw readError(e, path);
  } finally {
    // look-ups started early are let finish (an error is the rules' to report, if they ask)
    await Promise.all(early);
    await source.close();
  }
}

/** Whether an enabled rule of the catalogue will ask for the unit-ID check. */
function wantsUnitIds(catalogue: readonly AnyRule[], roles: Roles): boolean {
  return catalogue.some((rule) => rule.meta.prefetch?.includes('unit-ids') && roles.rules[rule.meta.id] !== 'off');
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
