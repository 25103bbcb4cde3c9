import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { DuckDBConnection } from '@duckdb/node-api';
import { traced } from '../../../util/trace.js';
import type { DuckHost } from './host.js';
import { fitMemory, withMemory } from './memory.js';
import type { DuckDB } from './native.js';
import { native } from './native.js';
import type { ConnectionPool } from './pool.js';
import { connectionPool } from './pool.js';
import { readAll, readColumns } from './stream.js';

/** An embedded DuckDB with its own spill directory (deleted on close). */
export interface DuckEngine extends DuckHost {
  /** the connection that holds the views and runs the profile (its rejects log is its own) */
  con: DuckDBConnection;
  all<T = Record<string, unknown>>(sql: string): Promise<T[]>;
  /** connections for the rules' look-ups */
  lookups: ConnectionPool;
  /** close the connection and the instance, delete the spill directory and `extra` temp paths */
  close(): void;
  /** paths deleted on close (a spooled stdin, …) */
  cleanup: string[];
  /** the memory limit in bytes (null when not understood); changed through memory.ts */
  memoryBytes: number | null;
  /** set DuckDB's memory limit (on a connection of its own: the others may be reading a result) */
  setMemoryLimit(bytes: number): Promise<void>;
  /** DuckDB's threads */
  threads: number;
}

/** Look-ups that may scan the delivery at the same time (see connectionPool). */
export const LOOKUP_CONNECTIONS = 2;

/** "200MB", "1.5GiB", "512 kb" → bytes (null when not a size). */
export function parseSize(size: string): number | null {
  const m = /^\s*([\d.]+)\s*(b|kb|kib|mb|mib|gb|gib|tb|tib)?\s*$/i.exec(size);
  if (!m) return null;
  const unit = (m[2] ?? 'b').toLowerCase();
  const scale: Record<string, number> = {
    b: 1,
    kb: 1e3,
    kib: 2 ** 10,
    mb: 1e6,
    mib: 2 ** 20,
    gb: 1e9,
    gib: 2 ** 30,
    tb: 1e12,
    tib: 2 ** 40,
  };
  return Number(m[1]) * scale[unit];
}

// spill directories of engines still open: removed when the process exits, even if a caller
// never closed its source (an error path, a test that failed half-way)
const liveSpills = new Set<string>();
let exitHook = false;
function track(dir: string): void {
  liveSpills.add(dir);
  if (exitHook) return;
  exitHook = true;
  process.once('exit', () => {
    for (const d of liveSpills) rmSync(d, { recursive: true, force: true });
  });
}

export async function createEngine(options: { memoryLimit?: string; threads?: number }): Promise<DuckEngine> {
  // DuckDB spills beyond memory_limit; by default an in-memory database spills to ".tmp" in
  // the working directory, so give it a directory of its own
  const spill = mkdtempSync(join(tmpdir(), 'nestready-spill-'));
  const threads = options.threads ?? 2;
  let instance: DuckDB.DuckDBInstance;
  try {
    instance = await native.DuckDBInstance.create(':memory:', {
      threads: String(threads),
      memory_limit: options.memoryLimit ?? '512MB',
      temp_directory: spill,
      // hand freed memory back to the system (in the background) after each task that peaked
      // above 4 MB, rather than keeping it for reuse: a lower and steadier peak on large
      // deliveries than the 16 MB default (docs/performance.md)
      allocator_flush_threshold: '4MB',
      allocator_background_threads: 'true',
    });
  } catch (e) {
    rmSync(spill, { recursive: true, force: true });
    throw e;
  }
  const con = await instance.connect();
  const lookupConnections = await Promise.all(Array.from({ length: LOOKUP_CONNECTIONS }, () => instance.connect()));
  // a new statement on a connection would end the result it is streaming
  const settings = await instance.connect();
  const cleanup: string[] = [spill];
  track(spill);
  let closed = false;
  const engine: DuckEngine = {
    con,
    cleanup,
    memoryBytes: parseSize(options.memoryLimit ?? '512MB'),
    threads,
    async setMemoryLimit(bytes) {
      engine.memoryBytes = bytes;
      await settings.run(`SET memory_limit = '${Math.ceil(bytes / 2 ** 20)}MiB'`);
    },
    all: (sql) => withMemory(engine, () => readAll(con, sql)),
    run: (sql) => traced(sql, async () => void (await con.run(sql))),
    columns: (sql, onScanned) => readColumns(engine, sql, onScanned),
    lookupAll: (sql) => engine.lookups.use((c) => withMemory(engine, () => readAll(c, sql))),
    session: (fn) =>
      engine.lookups.use((c) =>
        fn({
          all: (sql) => withMemory(engine, () => readAll(c, sql)),
          run: (sql) => withMemory(engine, () => traced(sql, async () => void (await c.run(sql)))),
        }),
      ),
    fitMemory: (needs) => fitMemory(engine, { ...needs, threads, scans: 1 + LOOKUP_CONNECTIONS }),
    lookups: connectionPool(lookupConnections),
    close() {
      if (closed) return;
      closed = true;
      try {
        engine.lookups.close();
        settings.closeSync();
        con.closeSync();
        instance.closeSync();
      } finally {
        for (const p of cleanup) rmSync(p, { recursive: true, force: true });
        liveSpills.delete(spill);
      }
    },
  };
  return engine;
}
