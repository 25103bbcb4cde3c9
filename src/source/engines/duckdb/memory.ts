import type { GroupSample } from '../../plan/sample-hints.js';
import { SAMPLE_ROWS } from '../../plan/sample-hints.js';
import type { SourceFormat } from '../../types.js';
import type { DuckEngine } from './engine.js';

const MiB = 2 ** 20;

/** The most the policy or the retry may raise DuckDB's memory limit to. */
export const MEMORY_CAP = 4 * 2 ** 30;
/**
 * How much the limit grows on each retry: every failed attempt costs part of a scan, so the
 * growth is steep (measurements: docs/performance.md).
 */
const GROWTH = 4;

/**
 * What DuckDB holds besides the readers and the profile's aggregate: the catalogue, the log of
 * rejected lines, the look-ups' small results.
 */
const BASE_BYTES = 8 * MiB;
/**
 * DuckDB's JSON reader holds buffers of twice `maximum_object_size`, which it never lets fall
 * below 16 MiB (a smaller value is ignored), so each buffer is 32 MiB however small the file.
 */
const JSON_BUFFER = 32 * MiB;
/** The CSV reader's buffer (`buffer_size` in read-csv.ts). */
const CSV_BUFFER = 4 * MiB;
/**
 * A group's share of the profiling aggregate, per DuckDB thread (each thread aggregates the
 * records it reads into a hash table of its own, so a group met by both is held twice): a
 * fixed part for the hash table's entry and key, and one per aggregate state.
 */
const GROUP_ENTRY_BYTES = 32;
const AGGREGATE_STATE_BYTES = 12;
/**
 * Beyond about this many groups DuckDB's aggregate partitions what it holds and spills the
 * partitions, so its need stops growing with the groups as fast.
 */
const SPILLING_GROUPS = 240_000;

/** The sizes an audit's memory need follows from, known once the first records have been read. */
export interface MemoryNeeds {
  format: SourceFormat;
  /** DuckDB threads */
  threads: number;
  /** scans of the delivery that may run at once (the profile's connection and the look-ups') */
  scans: number;
  /** the number of groups (estimated: see estimateGroups) */
  groups: number;
  /** aggregates the profile computes per group */
  aggregates: number;
}

/**
 * The reader buffers one scan of a delivery in `format` holds. NDJSON is read by every thread,
 * each with a buffer and a buffer to rebuild a record cut by the buffer's end; a JSON array by
 * one thread. A CSV scan holds about two buffers per thread; Parquet and the staged formats
 * (Arrow, Excel: a DuckDB table) read a row group at a time.
 */
export function scanBytes(format: SourceFormat, threads: number): number {
  if (format === 'ndjson') return threads * JSON_BUFFER + 4 * MiB;
  if (format === 'json') return JSON_BUFFER + 4 * MiB;
  if (format === 'csv' || format === 'tsv') return (threads + 2) * CSV_BUFFER;
  return 4 * MiB;
}

/** The profiling aggregate's memory for `groups` groups of `aggregates` aggregates each. */
export function aggregateBytes(groups: number, aggregates: number, threads: number): number {
  const perGroup = threads * (GROUP_ENTRY_BYTES + AGGREGATE_STATE_BYTES * aggregates);
  return Math.min(groups, SPILLING_GROUPS) * perGroup;
}

/** The memory an audit needs at once: every scan's readers, and the profile's aggregate beside them. */
export function neededBytes(needs: MemoryNeeds): number {
  return BASE_BYTES + needs.scans * scanBytes(needs.format, needs.threads) + aggregateBytes(needs.groups, needs.aggregates, needs.threads);
}

/**
 * The limit an audit starts with: the user's, or what the delivery needs when that is more
 * (never above MEMORY_CAP; a user's limit above it is kept). A limit below the need would fail
 * (the readers' buffers and an aggregate that does not spill are not optional) or cost a
 * failed pass before the retry.
 */
export function startLimit(userBytes: number, needs: MemoryNeeds): number {
  return Math.max(userBytes, Math.min(neededBytes(needs), MEMORY_CAP));
}

/**
 * The number of groups in the delivery, from those in its first records. When the sample is
 * the whole delivery it is exact. Otherwise Chao's estimate (the groups seen, plus f1²/2f2 for
 * the groups seen once, f1, and twice, f2; bias-corrected form) is a lower bound of the groups
 * there are, and group sizes in a delivery are uneven, so it is doubled; a delivery sorted by
 * group shows few groups in its first records whatever it holds, and is left to the retry.
 */
export function estimateGroups(sample: GroupSample): number {
  if (sample.records < SAMPLE_ROWS) return sample.groups;
  const { groups, seenOnce: f1, seenTwice: f2 } = sample;
  return 2 * Math.round(groups + (f1 * (f1 - 1)) / (2 * (f2 + 1)));
}

// a change of limit being made: queries wait for it, so that none runs at the old limit after
// reading the new one (and so raises it a second time)
const pending = new WeakMap<DuckEngine, Promise<void>>();

async function setLimit(engine: DuckEngine, bytes: number): Promise<void> {
  const set = engine.setMemoryLimit(bytes);
  pending.set(engine, set);
  await set;
}

/** Start the engine at the limit the delivery needs (see startLimit); a limit already higher is kept. */
export async function fitMemory(engine: DuckEngine, needs: MemoryNeeds): Promise<void> {
  const limit = engine.memoryBytes;
  if (limit === null) return;
  const fitted = startLimit(limit, needs);
  if (fitted > limit) await setLimit(engine, fitted);
}

/**
 * Run a query under the memory limit; when DuckDB runs out of memory anyway (a delivery whose
 * first records hid how many groups it has; the hash table of ten million unit IDs), raise the
 * limit fourfold (up to MEMORY_CAP) and run it again. Queries that fail at once raise it once:
 * one that finds the limit already raised since it started simply runs again.
 */
export async function withMemory<T>(engine: DuckEngine, query: () => Promise<T>): Promise<T> {
  while (true) {
    await pending.get(engine);
    const before = engine.memoryBytes;
    try {
      return await query();
    } catch (e) {
      if (!isOutOfMemory(e)) throw e;
      if (engine.memoryBytes !== before) continue;
      if (!(await raiseMemory(engine))) throw e;
    }
  }
}

function isOutOfMemory(e: unknown): boolean {
  return /Out of Memory/i.test(String((e as Error)?.message ?? e));
}

/** Raise the engine's memory limit fourfold, or to the cap; false when there is no limit or it is at the cap. */
export async function raiseMemory(engine: DuckEngine): Promise<boolean> {
  const limit = engine.memoryBytes;
  if (limit === null || limit >= MEMORY_CAP) return false;
  await setLimit(engine, Math.min(limit * GROWTH, MEMORY_CAP));
  return true;
}
