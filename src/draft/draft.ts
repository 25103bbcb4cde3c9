import { catalogue } from '../../rules/index.js';
import { openInput } from '../audit.js';
import { InputError } from '../errors.js';
import { buildProfile, loadArquero } from '../profile/build.js';
import { groupSizes } from '../profile/group-stats.js';
import type { Profile } from '../profile/types.js';
import { parseRoles } from '../roles/load.js';
import { DEFAULT_MISSING } from '../roles/schema.js';
import type { Roles } from '../roles/types.js';
import { createLookup } from '../source/lookups/lookup.js';
import type { DeliveryInput, Encoding, InputFormat, Source } from '../source/open.js';
import type { Census } from '../source/plan/census.js';
import { columnCensus, distinctCount, screenCandidates } from '../source/plan/census.js';
import { groupCandidates, MAX_CANDIDATES, unitCandidate } from './candidates.js';
import { classify } from './classify.js';
import { missingCandidates } from './missing-codes.js';
import { count } from './numbers.js';
import type { Choice, DraftPlan } from './plan.js';
import { apartFromWeights, planKeys } from './plan-keys.js';
import type { CandidateEvidence } from './rank.js';
import { candidateEvidence, rankCandidates } from './rank.js';
import { writeDraft } from './write.js';

export interface DraftOptions {
  /** take this column as the group ID instead of the best candidate */
  group?: string;
  /** how many group candidates are screened (default 5) */
  candidates?: number;
  memoryLimit?: string;
  threads?: number;
  inputFormat?: InputFormat;
  encoding?: Encoding;
  sheet?: string;
  displayPath?: string;
}

export interface Draft {
  /** the commented YAML role map */
  text: string;
  plan: DraftPlan;
  /** the role map the text holds, as loadRoles reads it */
  roles: Roles;
}

/**
 * Propose a role map for a delivery from its data alone: one aggregate over every column picks
 * the group candidates (at most `candidates`), a second groups by each of them at once to count
 * which other columns its groups hold constant, and the one profiling pass by the best sorts the
 * columns into levels.
 */
export async function draftRoles(input: DeliveryInput, options: DraftOptions = {}): Promise<Draft> {
  loadArquero().catch(() => undefined);
  // no column is the group yet: the source reads every column by its content
  const opening: Roles = { group: '', outcomes: [], level1: [], level2: [], missing: [...DEFAULT_MISSING], types: {}, rules: {} };
  const source = await openInput(input, opening, options);
  try {
    return await draftFrom(source, options);
  } finally {
    await source.close();
  }
}

/** Up to this many records the census counts distinct values exactly; beyond, a sketch does (a pass of its own each time). */
const EXACT_ROWS = 200_000;

async function draftFrom(source: Source, options: DraftOptions): Promise<Draft> {
  const path = source.path;
  if (options.group !== undefined && !source.header.includes(options.group)) {
    throw new InputError(`${path}: no column "${options.group}" for --group (columns: ${source.header.join(', ')})`);
  }
  let census = await columnCensus(source, false);
  if (census.rows === 0) throw new InputError(`${path}: the delivery has no records`);
  if (!census.exact && census.rows <= EXACT_ROWS) census = await columnCensus(source, true);
  const unitCensus = unitCandidate(census);
  const unitColumn = unitCensus && unitCensus.name !== options.group ? unitCensus.name : undefined;
  const names = groupCandidates(census, unitColumn ? [unitColumn] : [], options.candidates ?? MAX_CANDIDATES).map((c) => c.name);
  if (options.group !== undefined && !names.includes(options.group)) names.unshift(options.group);
  if (!names.length) throw new InputError(`${path}: no column repeats its values as a group ID would (give one with --group)`);

  // the unit's exact count of values: the census's when it counted exactly, else a count on a
  // session of its own beside the next passes (let finish before the source closes)
  const counted = census.columns.find((c) => c.name === unitColumn)?.distinct ?? 0;
  const unitDistinct = unitColumn === undefined ? undefined : census.exact ? Promise.resolve(counted) : distinctCount(source, unitColumn);
  unitDistinct?.catch(() => undefined);
  try {
    return await draftBy(source, options, { census, names, unitColumn, unitDistinct });
  } finally {
    await unitDistinct?.catch(() => undefined);
  }
}

/** The census's choices, for the passes that follow. */
interface Picked {
  census: Census;
  /** the group candidates */
  names: string[];
  unitColumn?: string;
  unitDistinct?: Promise<number>;
}

async function draftBy(source: Source, options: DraftOptions, { census, names, unitColumn, unitDistinct }: Picked): Promise<Draft> {
  const path = source.path;
  // every candidate screened in one pass; only the chosen one gets the profiling pass
  const others = source.header.filter((c) => c !== unitColumn);
  const evidence = (await screenCandidates(source, names, others)).map((screen) => candidateEvidence(screen, source.header));
  const ranked = rankCandidates(evidence);
  const chosen = options.group !== undefined ? evidence.find((e) => e.column === options.group) : ranked[0];
  if (!chosen) throw new InputError(`${path}: no candidate group column has a group of two records or more (give one with --group)`);

  // IDs are compared as written ("007" is not 7)
  if (source.storage.get(chosen.column) === 'double') await source.readAsText([chosen.column]);
  const profile = await buildProfile(source, profilingRoles(source.header, chosen.column, unitColumn));
  if (!groupSizes(profile.groups).some((n) => n >= 2)) {
    throw new InputError(`${path}: every group of "${chosen.column}" holds one record: it cannot be the group ID`);
  }
  const unit = unitColumn && unitDistinct ? unitChoice(unitColumn, await unitDistinct, census) : undefined;
  const roles = profilingRoles(source.header, chosen.column, unit?.column);
  const classified = classify({ census, chosen, profile, candidates: evidence, unit });
  const keys = planKeys(census, profile, classified);
  const levels = { ...apartFromWeights(classified, keys), ...keys };
  const plan: DraftPlan = {
    input: path,
    rows: census.rows,
    group: { column: chosen.column, evidence: chosenEvidence(profile, chosen, options.group !== undefined) },
    otherGroups: ranked.filter((e) => e !== chosen).map((e) => ({ column: e.column, evidence: screenEvidence(e) })),
    ...(unit && { unit }),
    ...levels,
    missing: { defaults: [...DEFAULT_MISSING], candidates: await missingCandidates(profile, roles, createLookup(source, chosen.column)) },
  };
  const text = writeDraft(plan);
  // the draft must load as any role map does: a failure here is a bug, not bad input
  return { text, plan, roles: loadDraft(text) };
}

/** The drafted text as loadRoles reads it: it must load as any role map does, so a failure is a bug, not bad input. */
function loadDraft(text: string): Roles {
  try {
    return parseRoles(text, 'draft', catalogue).roles;
  } catch (e) {
    throw new Error(`the drafted role map does not load: ${(e as Error).message}`);
  }
}

/** Profile by `group` with every other column a level-1 variable, so that mostly-numeric text columns get numbers too. */
function profilingRoles(header: readonly string[], group: string, unit: string | undefined): Roles {
  return {
    group,
    ...(unit && { unit }),
    outcomes: [],
    level1: header.filter((c) => c !== group && c !== unit),
    level2: [],
    missing: [...DEFAULT_MISSING],
    types: {},
    rules: {},
  };
}

/** Near-unique: at most one record in a hundred shares its ID with another (the audit then names the repeats). */
function unitChoice(column: string, distinct: number, census: Census): Choice | undefined {
  const c = census.columns.find((x) => x.name === column);
  if (!c || distinct < 0.99 * c.nonMissing) return undefined;
  const repeated = c.nonMissing - distinct;
  const absent = census.rows - c.nonMissing;
  const notes = [repeated ? `${count(repeated)} repeated` : '', absent ? `${count(absent)} missing` : ''].filter(Boolean);
  return {
    column,
    evidence: `${count(distinct)} distinct values on ${count(census.rows)} records${notes.length ? ` (${notes.join(', ')})` : ''}`,
  };
}

function chosenEvidence(profile: Profile, e: CandidateEvidence, given: boolean): string {
  const sizes = groupSizes(profile.groups);
  const multi = sizes.filter((n) => n >= 2).length;
  const held = `holds ${e.constantColumns.length} of ${e.otherColumns} other columns constant within its groups`;
  return `${given ? 'given with --group; ' : ''}${count(sizes.length)} groups (${count(multi)} of two records or more); ${held}`;
}

function screenEvidence(e: CandidateEvidence): string {
  const held = `holds ${e.constantColumns.length} of ${e.otherColumns} other columns constant within its groups`;
  return `${count(e.groups)} groups (${count(e.multiGroups)} of two records or more); ${held}`;
}
