import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createRequire } from 'node:module';
import type * as DuckDB from '@duckdb/node-api';
import type { DuckDBConnection } from '@duckdb/node-api';
import { connectionPool } from './pool.js';
import type { ConnectionPool } from './pool.js';
import type { Roles } from '../roles/types.js';
import { duckdb } from './dialect.js';
import { NUMERIC_TYPES, blankAsNull, ident, literal } from './sql.js';
import type { Storage } from './sql.js';
import type { RejectedLine, Source, SourceFormat } from './types.js';

// required, not imported: importing this CommonJS package from an ES module makes Node scan its
// sixty files for their export names first, about 70 ms of every run
const { DuckDBDoubleVector, DuckDBInstance, DuckDBVarCharVector, JSDuckDBValueConverter } = createRequire(import.meta.url)('@duckdb/node-api') as typeof DuckDB;

/** An embedded DuckDB with its own spill directory (deleted on close). */
export interface DuckEngine {
  /** the connection that holds the views and runs the profile (its rejects log is its own) */
  con: DuckDBConnection;
  all<T = Record<string, unknown>>(sql: string): Promise<T[]>;
  /** connections for the rules' look-ups */
  lookups: ConnectionPool;
  /** close the connection and the instance, delete the spill directory and `extra` temp paths */
  close(): void;
  /** paths deleted on close (a spooled stdin, …) */
  cleanup: string[];
  /** the memory limit in bytes (null when not understood) */
  memoryBytes: number | null;
}

/** Look-ups that may scan the delivery at the same time (see connectionPool). */
const LOOKUP_CONNECTIONS = 2;

/** "200MB", "1.5GiB", "512 kb" → bytes (null when not a size). */
export function parseSize(size: string): number | null {
  const m = /^\s*([\d.]+)\s*(b|kb|kib|mb|mib|gb|gib|tb|tib)?\s*$/i.exec(size);
  if (!m) return null;
  const unit = (m[2] ?? 'b').toLowerCase();
  const scale: Record<string, number> = { b: 1, kb: 1e3, kib: 2 ** 10, mb: 1e6, mib: 2 ** 20, gb: 1e9, gib: 2 ** 30, tb: 1e12, tib: 2 ** 40 };
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
  let instance: DuckDB.DuckDBInstance;
  try {
    instance = await DuckDBInstance.create(':memory:', {
      threads: String(options.threads ?? 2),
      memory_limit: options.memoryLimit ?? '512MB',
      temp_directory: spill,
      // hand freed memory back to the system (in the background) after each task that peaked
      // above 4 MB, rather than keeping it for reuse: the audit of 10 million rows peaked at
      // 260-267 MB in five runs, against 262-306 MB with the 16 MB threshold alone
      allocator_flush_threshold: '4MB',
      allocator_background_threads: 'true',
    });
  } catch (e) {
    rmSync(spill, { recursive: true, force: true });
    throw e;
  }
  const con = await instance.connect();
  const lookupConnections = await Promise.all(Array.from({ length: LOOKUP_CONNECTIONS }, () => instance.connect()));
  const cleanup: string[] = [spill];
  track(spill);
  let closed = false;
  const engine: DuckEngine = {
    con,
    cleanup,
    memoryBytes: parseSize(options.memoryLimit ?? '512MB'),
    all: (sql) => readAll(con, sql),
    lookups: connectionPool(lookupConnections),
    close() {
      if (closed) return;
      closed = true;
      try {
        engine.lookups.close();
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

/** How a DuckDB-read delivery is laid out before the shared views are put on it. */
export interface DuckLayout {
  path: string;
  format: SourceFormat;
  header: string[];
  storage: Map<string, Storage>;
  /**
   * The relation with missing tokens already NULL and each column read per `storage`.
   * `rowid`: the relation has a `__rec` column (a staged table's rowid + 1); else numbered by a window.
   */
  relation(storage: Map<string, Storage>): string;
  numbering: 'window' | 'rowid';
  /** a relation to sample the first rows from, when not nr_delivery */
  sample?(): string;
  /** a typed reader (CSV) converts while reading and rejects lines; other sources are probed */
  typedReader: boolean;
  rejects(): Promise<RejectedLine[]>;
  /** before the views are redefined with columns read as text (CSV: start the rejects log afresh) */
  beforeRetype?(): Promise<void>;
}

/** Rows sampled to tell text columns that hold numbers from those that hold none. */
export const SAMPLE_ROWS = 20480;

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

/** The Source over a layout: the views nr_delivery and nr_numbered, the sample hints, the look-up API. */
export async function duckSource(engine: DuckEngine, layout: DuckLayout, roles: Roles, missing: readonly string[]): Promise<Source> {
  const { con, all } = engine;
  const { header, storage } = layout;
  const group = header.includes(roles.group)
    ? ` REPLACE (${blankAsNull(roles.group, missing)} AS ${ident(roles.group)})`
    : '';
  // DuckDB 1.5's CSV reader fails (and invalidates the database) when a line with invalid UTF-8
  // is met by a scan that reads only some of the columns; once such a line is known, the views
  // read every column (a filter that uses them all and is always true)
  const everyColumn = `hash(${header.map(ident).join(', ')}) IS NOT NULL`;
  let guarded = false;
  let viewVersion = 0;
  const define = async () => {
    viewVersion++;
    const rel = layout.relation(storage) + (guarded ? ` WHERE ${everyColumn}` : '');
    if (layout.numbering === 'rowid') {
      await con.run(`CREATE OR REPLACE VIEW nr_numbered AS SELECT *${group} FROM ${rel}`);
      await con.run('CREATE OR REPLACE VIEW nr_delivery AS SELECT * EXCLUDE (__rec) FROM nr_numbered');
    } else {
      // a blank-looking group ID (only spaces, or a missing token with spaces around it) is
      // missing; other IDs keep their spaces ("W-014 " is a variant to report, not W-014)
      await con.run(`CREATE OR REPLACE VIEW nr_delivery AS SELECT *${group} FROM ${rel}`);
      await con.run('CREATE OR REPLACE VIEW nr_numbered AS SELECT row_number() OVER () AS __rec, * FROM nr_delivery');
    }
  };
  await define();

  const ids = new Set([roles.group, roles.unit, roles.parent]);
  const { probe, textOnly, sampledGroups } = await sampleHints(all, layout.sample ? `(SELECT * FROM ${layout.sample()} WHERE ${everyColumn})` : 'nr_delivery', header, storage, roles, ids, !layout.typedReader, duckdb.numeric);
  if (manyGroups(sampledGroups)) await raiseMemory(engine);

  return {
    path: layout.path,
    format: layout.format,
    dialect: duckdb,
    header,
    storage,
    probe,
    textOnly,
    view: 'nr_delivery',
    numbered: 'nr_numbered',
    get viewVersion() {
      return viewVersion;
    },
    all: (sql) => engine.lookups.use((c) => readAll(c, sql)),
    columns: (sql, options) => readColumns(engine, sql, options?.onScanned),
    session: (fn) =>
      engine.lookups.use((c) =>
        fn({
          all: (sql) => readAll(c, sql),
          async run(sql, options) {
            const run = async () => void (await c.run(sql));
            await (options?.grow ? withMemory(engine, run) : run());
          },
        }),
      ),
    async rejects() {
      const rejected = await layout.rejects();
      if (!guarded && layout.typedReader && rejected.some((r) => r.kind === 'INVALID ENCODING')) {
        guarded = true;
        await define();
      }
      return rejected;
    },
    async readAsText(columns) {
      for (const c of columns) {
        storage.set(c, 'text');
        probe.delete(c);
      }
      await layout.beforeRetype?.();
      await define();
    },
    async readAsDouble(columns) {
      for (const c of columns) {
        storage.set(c, 'double');
        probe.delete(c);
      }
      await define();
    },
    close: () => engine.close(),
  };
}

async function readAll<T>(con: DuckDBConnection, sql: string): Promise<T[]> {
  return (await con.runAndReadAll(sql)).getRowObjectsJS() as T[];
}

/**
 * Read the first rows once: a text column whose sampled values are all numbers is probed (the
 * profile decides whether it is numeric throughout); one whose sampled values hold no number
 * (and whose type the role map leaves open) gets no numeric reading — converting every value of
 * a text column such as "18-29" only to fail is the dearest thing a pass can do.
 */
export async function sampleHints(
  all: <T>(sql: string) => Promise<T[]>,
  view: string,
  header: readonly string[],
  storage: Map<string, Storage>,
  roles: Roles,
  ids: Set<string | undefined>,
  probing: boolean,
  numeric: (expr: string) => string,
): Promise<{ probe: Set<string>; textOnly: Set<string>; sampledGroups: number }> {
  const probe = new Set<string>();
  const textOnly = new Set<string>();
  const candidates = header.filter((c) => storage.get(c) === 'text' && !ids.has(c) && roles.types[c] !== 'categorical');
  const aggs = [
    `count(DISTINCT ${ident(roles.group)}) AS sampled_groups`,
    ...candidates.map((c, i) => `count(${ident(c)}) AS n${i}, count(${numeric(ident(c))}) AS k${i}`),
  ];
  const [row] = await all<Record<string, unknown>>(
    `SELECT ${aggs.join(', ')} FROM (SELECT * FROM ${view} LIMIT ${SAMPLE_ROWS}) AS nr_sample`,
  );
  candidates.forEach((c, i) => {
    const n = Number(row[`n${i}`]);
    const k = Number(row[`k${i}`]);
    if (probing && n > 0 && k === n) probe.add(c);
    else if (n > 0 && k === 0 && roles.types[c] === undefined) textOnly.add(c);
  });
  return { probe, textOnly, sampledGroups: Number(row.sampled_groups) };
}

/** Missing tokens that are numbers, compared as numbers in numeric columns ("-999" ↔ -999.0). */
export function numericTokens(missing: readonly string[]): number[] {
  return [...new Set(missing.filter((t) => t.trim() !== '' && Number.isFinite(Number(t))).map(Number))];
}

/**
 * The select list of a typed relation (Parquet, JSON, a staged table): each column as text or
 * DOUBLE per `storage`, missing tokens as NULL (text compared as written, numbers as numbers).
 */
export function typedSelect(
  columns: readonly { name: string; type: string }[],
  storage: Map<string, Storage>,
  missing: readonly string[],
): string {
  const tokens = missing.map(literal).join(', ');
  const nums = numericTokens(missing);
  return columns
    .map(({ name, type }) => {
      const c = ident(name);
      let expr: string;
      if (NUMERIC_TYPES.test(type)) {
        const value = storage.get(name) === 'double' ? `CAST(${c} AS DOUBLE)` : `CAST(${c} AS VARCHAR)`;
        expr = nums.length ? `CASE WHEN ${c} IN (${nums.join(', ')}) THEN NULL ELSE ${value} END` : value;
      } else {
        const t = type === 'VARCHAR' ? c : `CAST(${c} AS VARCHAR)`;
        const nulled = tokens ? `CASE WHEN ${t} IN (${tokens}) THEN NULL ELSE ${t} END` : t;
        expr = storage.get(name) === 'double' ? `TRY_CAST(${nulled} AS DOUBLE)` : nulled;
      }
      return `${expr} AS ${c}`;
    })
    .join(', ');
}

/** Storage of a typed relation's columns: numbers as DOUBLE (IDs always text), the rest text. */
export function typedStorage(columns: readonly { name: string; type: string }[], roles: Roles): Map<string, Storage> {
  const ids = new Set([roles.group, roles.unit, roles.parent]);
  const storage = new Map<string, Storage>();
  for (const { name, type } of columns) {
    const declared = roles.types[name];
    storage.set(name, !ids.has(name) && declared !== 'categorical' && NUMERIC_TYPES.test(type) ? 'double' : 'text');
  }
  return storage;
}

/** The most the profile may raise DuckDB's memory limit to when a wide aggregate over many groups does not fit. */
const MEMORY_CAP = 4 * 2 ** 30;
/**
 * How much the limit grows on each retry: every failed attempt costs part of a scan, so the
 * growth is steep. At 1M rows, 94,590 groups took 3.55 s and 486,853 groups 10.75 s, against
 * 3.96 s and 11.75 s when the limit was doubled (one attempt more each).
 */
const GROWTH = 4;

/**
 * Run a query and read its result by column, one chunk at a time (DuckDB never holds the whole
 * result): a DOUBLE column without NULLs becomes a Float64Array, repeated strings share one
 * copy. A result of a million groups then costs about 8 bytes per number, not a boxed value.
 */
export function readColumns(engine: DuckEngine, sql: string, onScanned?: () => void): Promise<Record<string, unknown[]>> {
  return withMemory(engine, () => streamColumns(engine.con, sql, onScanned));
}

/**
 * Run one large aggregate under the memory limit. Some need more than the limit even though
 * DuckDB spills (a wide aggregate over a million groups; the hash table of ten million unit
 * IDs): the limit is then raised fourfold (up to 4 GiB) and the query run again, so a low limit costs
 * memory only where the delivery's size demands it.
 */
async function withMemory<T>(engine: DuckEngine, query: () => Promise<T>): Promise<T> {
  for (;;) {
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

/** A column of doubles read chunk by chunk into a growing Float64Array; NULLs noted by position. */
class DoubleColumn {
  data = new Float64Array(4096);
  length = 0;
  nulls: number[] = [];
  push(v: number | null): void {
    if (this.length === this.data.length) {
      const grown = new Float64Array(this.data.length * 2);
      grown.set(this.data);
      this.data = grown;
    }
    if (v === null) this.nulls.push(this.length);
    this.data[this.length++] = v ?? 0;
  }
  /** the numbers as a Float64Array, or as an array with the NULLs when there are any */
  done(): unknown[] {
    const values = this.data.subarray(0, this.length);
    if (!this.nulls.length) return values as unknown as unknown[];
    const out: (number | null)[] = Array.from(values);
    for (const i of this.nulls) out[i] = null;
    return out;
  }
}

async function streamColumns(con: DuckDBConnection, sql: string, onScanned?: () => void): Promise<Record<string, unknown[]>> {
  const result = await con.stream(sql);
  const names = result.columnNames();
  const cols: (unknown[] | DoubleColumn | null)[] = names.map(() => null);
  const interned = names.map(() => new Map<string, string>());
  for (let first = true; ; first = false) {
    const chunk = await result.fetchChunk();
    // an aggregate's first chunk comes once its input has been read in full
    if (first) onScanned?.();
    const rows = chunk?.rowCount ?? 0; // a native call: read once per chunk
    if (!chunk || rows === 0) break;
    for (let i = 0; i < names.length; i++) {
      const vector = chunk.getColumnVector(i);
      if (vector instanceof DuckDBDoubleVector) {
        // numbers straight from the vector's buffer, no conversion per value
        let col = cols[i];
        if (col === null) col = cols[i] = new DoubleColumn();
        if (col instanceof DoubleColumn) {
          for (let r = 0; r < rows; r++) col.push(vector.getItem(r));
          continue;
        }
      }
      let col = cols[i];
      if (col === null) col = cols[i] = [];
      if (col instanceof DoubleColumn) col = cols[i] = col.done().slice();
      const pool = interned[i];
      // text straight from the vector (a string or null each); other types through the converter
      const values = vector instanceof DuckDBVarCharVector ? null : chunk.convertColumnValues(i, JSDuckDBValueConverter);
      for (let r = 0; r < rows; r++) {
        const v = values ? values[r] : (vector as DuckDB.DuckDBVarCharVector).getItem(r);
        if (typeof v === 'string' && pool.size < 65536) {
          let same = pool.get(v);
          if (same === undefined) pool.set(v, (same = v));
          col.push(same);
        } else col.push(v);
      }
    }
  }
  const out: Record<string, unknown[]> = {};
  names.forEach((name, i) => {
    const col = cols[i];
    out[name] = col === null ? [] : col instanceof DoubleColumn ? col.done() : col;
  });
  return out;
}
