import type { DuckDBConnection } from '@duckdb/node-api';

/** Connections lent to one query at a time; callers beyond the pool's size wait their turn. */
export interface ConnectionPool {
  use<T>(fn: (con: DuckDBConnection) => Promise<T>): Promise<T>;
  close(): void;
}

/**
 * A few connections for the rules' look-ups, so that two of them (say the unit-ID check and
 * the records of the one-record groups) run at once: each scan leaves part of the two cores
 * idle (a numbered scan is partly serial), and on 1 million rows the pair took 0.52-0.66 s
 * at once against 0.79 s one after the other. `size` bounds the scans (and their memory) in
 * flight.
 *
 * @param open makes a new connection
 * @param size connections at most
 */
export function connectionPool(open: () => Promise<DuckDBConnection>, size: number): ConnectionPool {
  const opened: DuckDBConnection[] = [];
  const idle: DuckDBConnection[] = [];
  const waiting: ((con: DuckDBConnection) => void)[] = [];
  let reserved = 0;
  const acquire = async (): Promise<DuckDBConnection> => {
    const free = idle.pop();
    if (free) return free;
    if (reserved < size) {
      reserved++;
      const con = await open();
      opened.push(con);
      return con;
    }
    return new Promise((resolve) => waiting.push(resolve));
  };
  const release = (con: DuckDBConnection) => {
    const next = waiting.shift();
    if (next) next(con);
    else idle.push(con);
  };
  return {
    async use(fn) {
      const con = await acquire();
      try {
        return await fn(con);
      } finally {
        release(con);
      }
    },
    close() {
      for (const con of opened) con.closeSync();
    },
  };
}
