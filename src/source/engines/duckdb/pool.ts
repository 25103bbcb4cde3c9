import type { DuckDBConnection } from '@duckdb/node-api';

/** Connections lent to one query at a time; callers beyond the pool's size wait their turn. */
export interface ConnectionPool {
  use<T>(fn: (con: DuckDBConnection) => Promise<T>): Promise<T>;
  close(): void;
}

/**
 * A few connections for the rules' look-ups, so that two of them (say the unit-ID check and
 * the numbered records of a level-2 variable that varies) run at once: each scan leaves part of
 * the two cores idle (a numbered scan is partly serial), so such a pair finishes sooner at once
 * than one after the other (docs/performance.md). The pool's size bounds the scans (and
 * their memory) in flight.
 *
 * The connections are opened beforehand, so a free one is lent at once and a look-up reaches
 * the database in the same turn of the event loop as the rule that asks for it, not after the
 * other rules' computing (see runRules).
 *
 * @param connections the open connections to lend
 */
export function connectionPool(connections: readonly DuckDBConnection[]): ConnectionPool {
  const idle = [...connections];
  const waiting: ((con: DuckDBConnection) => void)[] = [];
  const release = (con: DuckDBConnection) => {
    const next = waiting.shift();
    if (next) next(con);
    else idle.push(con);
  };
  return {
    use<T>(fn: (con: DuckDBConnection) => Promise<T>): Promise<T> {
      const run = (con: DuckDBConnection) => {
        // fn called synchronously: its first query starts in this turn of the event loop
        let lent: Promise<T>;
        try {
          lent = fn(con);
        } catch (e) {
          lent = Promise.reject(e);
        }
        return lent.finally(() => release(con));
      };
      const free = idle.pop();
      return free ? run(free) : new Promise<DuckDBConnection>((resolve) => waiting.push(resolve)).then(run);
    },
    close() {
      for (const con of connections) con.closeSync();
    },
  };
}
