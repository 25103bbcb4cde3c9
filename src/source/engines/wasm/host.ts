import type { Session } from '../../types.js';
import type { DuckHost } from '../duckdb/host.js';
import { tableColumns, tableRows } from './arrow-values.js';
import type { WasmConnection, WasmDatabase } from './types.js';

/** Look-up connections, as in the native engine (engines/duckdb/engine.ts). */
const LOOKUP_CONNECTIONS = 2;

/**
 * DuckDB-WASM as the shared views' host. Each connection runs one query at a time (a queue per
 * connection); the look-ups borrow one of theirs. The worker runs one query at a time whatever
 * the connection, on one thread: no memory policy (the page's memory is the tab's), no spill.
 */
export async function wasmHost(db: WasmDatabase, files: string[]): Promise<DuckHost> {
  const views = serial(await db.connect());
  const idle = await Promise.all(Array.from({ length: LOOKUP_CONNECTIONS }, async () => serial(await db.connect())));
  const all = [views, ...idle];
  const waiting: ((c: Serial) => void)[] = [];
  const borrow = async <T>(fn: (c: Serial) => Promise<T>): Promise<T> => {
    const c = idle.pop() ?? (await new Promise<Serial>((resolve) => waiting.push(resolve)));
    try {
      return await fn(c);
    } finally {
      const next = waiting.shift();
      if (next) next(c);
      else idle.push(c);
    }
  };
  const sessionOf = (c: Serial): Session => ({ all: (sql) => c.rows(sql), run: async (sql) => void (await c.query(sql)) });
  let closed = false;
  return {
    all: (sql) => views.rows(sql),
    run: async (sql) => void (await views.query(sql)),
    columns: async (sql, onScanned) => {
      const table = await views.query(sql);
      onScanned?.();
      return tableColumns(table);
    },
    lookupAll: (sql) => borrow((c) => c.rows(sql)),
    session: (fn) => borrow((c) => fn(sessionOf(c))),
    fitMemory: async () => undefined,
    cleanup: files,
    async close() {
      if (closed) return;
      closed = true;
      // the database outlives the audit (the page audits the next file in it): leave it empty
      for (const sql of ['DROP VIEW IF EXISTS nr_numbered', 'DROP VIEW IF EXISTS nr_delivery', 'DROP TABLE IF EXISTS nr_staged']) {
        await views.query(sql).catch(() => undefined);
      }
      await Promise.all(all.map((c) => c.close()));
      await Promise.all(files.map((f) => db.dropFile(f)));
    },
  };
}

interface Serial {
  query: WasmConnection['query'];
  rows<T>(sql: string): Promise<T[]>;
  close(): Promise<void>;
}

/** A connection whose queries run one after the other, in the order asked. */
function serial(con: WasmConnection): Serial {
  let last: Promise<unknown> = Promise.resolve();
  const query = (sql: string) => {
    const next = last.then(
      () => con.query(sql),
      () => con.query(sql),
    );
    last = next.catch(() => undefined);
    return next;
  };
  return {
    query,
    rows: async <T>(sql: string) => tableRows<T>(await query(sql)),
    close: () => last.then(() => con.close()),
  };
}
