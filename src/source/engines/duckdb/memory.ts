import { SAMPLE_ROWS } from '../../plan/sample-hints.js';
import type { DuckEngine } from './engine.js';

/** The most the profile may raise DuckDB's memory limit to when a wide aggregate over many groups does not fit. */
const MEMORY_CAP = 4 * 2 ** 30;
/**
 * How much the limit grows on each retry: every failed attempt costs part of a scan, so the
 * growth is steep. At 1M rows, 94,590 groups took 3.55 s and 486,853 groups 10.75 s, against
 * 3.96 s and 11.75 s when the limit was doubled (one attempt more each).
 */
const GROWTH = 4;

/**
 * Whether the first records show very many groups: at least half of a full sample in groups of
 * their own (10,240 group IDs in the 20,480 records). The profile of such a delivery (tens of thousands of
 * groups and more; at the default limit about 95,000 ran out of memory) then starts at four times
 * the memory limit rather than failing once first (0.5-1 s lost at 1M rows). A delivery sorted by
 * group shows few groups here and keeps the retry.
 */
export function manyGroups(sampledGroups: number): boolean {
  return sampledGroups >= SAMPLE_ROWS / 2;
}

/**
 * Run one large aggregate under the memory limit. Some need more than the limit even though
 * DuckDB spills (a wide aggregate over a million groups; the hash table of ten million unit
 * IDs): the limit is then raised fourfold (up to 4 GiB) and the query run again, so a low limit costs
 * memory only where the delivery's size demands it.
 */
export async function withMemory<T>(engine: DuckEngine, query: () => Promise<T>): Promise<T> {
  while (true) {
    try {
      return await query();
    } catch (e) {
      if (!/Out of Memory/i.test((e as Error).message) || !(await raiseMemory(engine))) throw e;
    }
  }
}

/** Raise the engine's memory limit fourfold; false when there is no limit or that would pass the cap. */
export async function raiseMemory(engine: DuckEngine): Promise<boolean> {
  const limit = engine.memoryBytes;
  if (limit === null || limit * GROWTH > MEMORY_CAP) return false;
  engine.memoryBytes = limit * GROWTH;
  await engine.con.run(`SET memory_limit = '${Math.round(engine.memoryBytes / 2 ** 20)}MiB'`);
  return true;
}
