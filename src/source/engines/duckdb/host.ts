import type { Session } from '../../types.js';
import type { MemoryNeeds } from './memory.js';

/**
 * A DuckDB that the shared views (views.ts) and the format readers run on: the native binding
 * (native-host.ts) or DuckDB-WASM in the page (engines/wasm). The SQL is the same; how a query
 * reaches the database, how results come back and how memory is fitted are the host's.
 */
export interface DuckHost {
  /** run a query on the connection that holds the views (its rejects log is its own) */
  all<T = Record<string, unknown>>(sql: string): Promise<T[]>;
  /** run a statement on that connection */
  run(sql: string): Promise<void>;
  /** a full read on that connection, by column (see Source.columns) */
  columns(sql: string, onScanned?: () => void): Promise<Record<string, unknown[]>>;
  /** a look-up's query, on a connection of the look-ups' */
  lookupAll<T = Record<string, unknown>>(sql: string): Promise<T[]>;
  /** one look-up connection lent for a session of queries */
  session<T>(fn: (session: Session) => Promise<T>): Promise<T>;
  /** start at the memory limit the delivery needs (a host without one does nothing) */
  fitMemory(needs: Omit<MemoryNeeds, 'threads' | 'scans'>): Promise<void>;
  /** paths deleted (or buffers dropped) on close */
  cleanup: string[];
  close(): void | Promise<void>;
}
