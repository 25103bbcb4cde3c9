import { statSync } from 'node:fs';
import { DuckDBInstance } from '@duckdb/node-api';
import type { DuckDBConnection } from '@duckdb/node-api';
import { InputError } from '../errors.js';
import type { Roles } from '../roles/types.js';
import { readCsv, typedColumns } from './sql.js';
import type { Storage } from './sql.js';

/** A line of the delivery that could not be read as a record. */
export interface RejectedLine {
  line: number;
  reason: string;
  /** the column a value failed to convert in (CAST errors only) */
  column?: string;
  kind: string;
}

/** An opened delivery: a DuckDB connection with the views the profile and rules read. */
export interface Source {
  path: string;
  header: string[];
  con: DuckDBConnection;
  /** how each column is read: text, or DOUBLE where every value so far is a number */
  storage: Map<string, Storage>;
  /** the delivery with missing tokens read as NULL */
  view: 'nr_delivery';
  /** the same with `__rec`, the 1-based record number (header and rejected lines not counted) */
  numbered: 'nr_numbered';
  /** run a query and return plain JS rows */
  all<T = Record<string, unknown>>(sql: string): Promise<T[]>;
  /** rejected lines of the latest full read */
  rejects(): Promise<RejectedLine[]>;
  /** read these columns as text from now on (a value in them was not a number) */
  readAsText(columns: readonly string[]): Promise<void>;
  close(): void;
}

export interface OpenOptions {
  missing: readonly string[];
  /** DuckDB memory limit, e.g. "512MB"; DuckDB spills to disk beyond it */
  memoryLimit?: string;
  threads?: number;
}

/** Open a CSV/TSV delivery (dialect sniffed by DuckDB) without modifying or copying it. */
export async function openDelivery(path: string, roles: Roles, options: OpenOptions): Promise<Source> {
  checkFile(path);
  const instance = await DuckDBInstance.create(':memory:', {
    threads: String(options.threads ?? 2),
    memory_limit: options.memoryLimit ?? '512MB',
  });
  const con = await instance.connect();
  const all = async <T,>(sql: string) => (await con.runAndReadAll(sql)).getRowObjectsJS() as T[];
  const close = () => {
    con.closeSync();
    instance.closeSync();
  };
  // a blank field is always missing, whatever else the role map lists
  const missing = [...new Set(['', ...options.missing])];
  try {
    // one sniff gives both the header and DuckDB's type guesses (from a sample: hints only)
    const sniffed = await all<{ column_name: string; column_type: string }>(
      `DESCRIBE SELECT * FROM ${readCsv(path, missing, 'sniff')}`,
    );
    const header = sniffed.map((d) => d.column_name);
    const storage = typedColumns(header, roles, sniffed);
    const define = async () => {
      await con.run(`CREATE OR REPLACE VIEW nr_delivery AS SELECT * FROM ${readCsv(path, missing, storage)}`);
      await con.run('CREATE OR REPLACE VIEW nr_numbered AS SELECT row_number() OVER () AS __rec, * FROM nr_delivery');
    };
    await define();
    const rejects = async () => {
      const rows = await all<{ line: bigint; error_message: string; error_type: string; column_name: string | null }>(
        'SELECT line, error_message, error_type, column_name FROM nr_rejects ' +
          'WHERE scan_id = (SELECT max(scan_id) FROM nr_rejects) ORDER BY line',
      ).catch(() => []); // no table: nothing was rejected
      return rows.map((r) => ({
        line: Number(r.line),
        reason: r.error_message.split('\n')[0],
        kind: r.error_type,
        ...(r.error_type === 'CAST' && r.column_name ? { column: r.column_name } : {}),
      }));
    };
    const readAsText = async (columns: readonly string[]) => {
      for (const c of columns) storage.set(c, 'text');
      await define();
    };
    return { path, header, con, storage, view: 'nr_delivery', numbered: 'nr_numbered', all, rejects, readAsText, close };
  } catch (e) {
    close();
    if (e instanceof InputError) throw e;
    throw new InputError(`${path}: cannot read as CSV (${(e as Error).message.split('\n')[0]})`);
  }
}

function checkFile(path: string): void {
  let size: number;
  try {
    const st = statSync(path);
    if (!st.isFile()) throw new InputError(`${path}: not a file`);
    size = st.size;
  } catch (e) {
    if (e instanceof InputError) throw e;
    throw new InputError(`${path}: cannot read the delivery (${(e as NodeJS.ErrnoException).code ?? e})`);
  }
  if (size === 0) throw new InputError(`${path}: the file is empty (no header, no records)`);
}
