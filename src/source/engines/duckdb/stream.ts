import type { DuckDBConnection } from '@duckdb/node-api';
import { traced } from '../../../util/trace.js';
import type { DuckEngine } from './engine.js';
import { withMemory } from './memory.js';
import type { DuckDB } from './native.js';
import { native } from './native.js';

const { DuckDBDoubleVector, DuckDBVarCharVector, JSDuckDBValueConverter } = native;

export async function readAll<T>(con: DuckDBConnection, sql: string): Promise<T[]> {
  return traced(sql, async () => (await con.runAndReadAll(sql)).getRowObjectsJS() as T[]);
}

/**
 * Run a query and read its result by column, one chunk at a time (DuckDB never holds the whole
 * result): a DOUBLE column without NULLs becomes a Float64Array, repeated strings share one
 * copy. A result of a million groups then costs about 8 bytes per number, not a boxed value.
 */
export function readColumns(engine: DuckEngine, sql: string, onScanned?: () => void): Promise<Record<string, unknown[]>> {
  return withMemory(engine, () => traced(sql, () => streamColumns(engine.con, sql, onScanned)));
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
    for (let i = 0; i < names.length; i++) cols[i] = appendVector(chunk, i, rows, cols[i], interned[i]);
  }
  const out: Record<string, unknown[]> = {};
  names.forEach((name, i) => {
    const col = cols[i];
    out[name] = col === null ? [] : col instanceof DoubleColumn ? col.done() : col;
  });
  return out;
}

/** One chunk's column appended to what was read of it: doubles into a DoubleColumn, the rest as values. */
function appendVector(
  chunk: DuckDB.DuckDBDataChunk,
  i: number,
  rows: number,
  read: unknown[] | DoubleColumn | null,
  pool: Map<string, string>,
): unknown[] | DoubleColumn {
  const vector = chunk.getColumnVector(i);
  if (vector instanceof DuckDBDoubleVector && (read === null || read instanceof DoubleColumn)) {
    // numbers straight from the vector's buffer, no conversion per value
    const col = read ?? new DoubleColumn();
    for (let r = 0; r < rows; r++) col.push(vector.getItem(r));
    return col;
  }
  const col = read === null ? [] : read instanceof DoubleColumn ? read.done().slice() : read;
  // text straight from the vector (a string or null each); other types through the converter
  const values = vector instanceof DuckDBVarCharVector ? null : chunk.convertColumnValues(i, JSDuckDBValueConverter);
  for (let r = 0; r < rows; r++) {
    const v = values ? values[r] : (vector as DuckDB.DuckDBVarCharVector).getItem(r);
    col.push(typeof v === 'string' ? intern(pool, v) : v);
  }
  return col;
}

/** The one copy of a repeated string (group IDs and codes repeat), while the pool is small. */
function intern(pool: Map<string, string>, v: string): string {
  const same = pool.get(v);
  if (same !== undefined) return same;
  if (pool.size < 65536) pool.set(v, v);
  return v;
}
