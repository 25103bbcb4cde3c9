import { statSync } from 'node:fs';
import { DuckDBInstance } from '@duckdb/node-api';
import type { DuckDBConnection } from '@duckdb/node-api';
import { InputError } from '../errors.js';
import { cleaned, ident, literal } from './sql.js';

/** A line of the delivery that could not be read as a record. */
export interface RejectedLine {
  line: number;
  reason: string;
}

/** An opened delivery: a DuckDB connection with the views the profile and rules read. */
export interface Source {
  path: string;
  header: string[];
  con: DuckDBConnection;
  /** the delivery as text columns, missing tokens already NULL */
  view: 'nr_clean';
  /** the same with `__rec`, the 1-based record number (header and rejected lines not counted) */
  numbered: 'nr_numbered';
  /** run a query and return plain JS rows */
  all<T = Record<string, unknown>>(sql: string): Promise<T[]>;
  /** columns DuckDB's sniffer reads as numbers (from a sample; a hint, not a verdict) */
  sniffedNumeric: Set<string>;
  /** rejected lines of the latest full read */
  rejects(): Promise<RejectedLine[]>;
  close(): void;
}

export interface OpenOptions {
  missing: readonly string[];
  /** DuckDB memory limit, e.g. "200MB"; DuckDB spills to disk beyond it */
  memoryLimit?: string;
  threads?: number;
}

/** Open a CSV/TSV delivery (dialect sniffed by DuckDB) without modifying or copying it. */
export async function openDelivery(path: string, options: OpenOptions): Promise<Source> {
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

  const instance = await DuckDBInstance.create(':memory:', {
    threads: String(options.threads ?? 2),
    memory_limit: options.memoryLimit ?? '200MB',
  });
  const con = await instance.connect();
  const all = async <T,>(sql: string) => (await con.runAndReadAll(sql)).getRowObjectsJS() as T[];
  const close = () => {
    con.closeSync();
    instance.closeSync();
  };
  try {
    // all_varchar: we decide types and missing codes ourselves, so no value is lost to a cast
    await con.run(
      `CREATE VIEW nr_raw AS SELECT * FROM read_csv(${literal(path)}, all_varchar = true, header = true, ` +
        `store_rejects = true, rejects_table = 'nr_rejects', rejects_scan = 'nr_scans')`,
    );
    const described = await all<{ column_name: string }>('DESCRIBE SELECT * FROM nr_raw');
    const header = described.map((d) => d.column_name);
    const cols = header.map((h) => `${cleaned(h, options.missing)} AS ${ident(h)}`).join(', ');
    await con.run(`CREATE VIEW nr_clean AS SELECT ${cols} FROM nr_raw`);
    await con.run('CREATE VIEW nr_numbered AS SELECT row_number() OVER () AS __rec, * FROM nr_clean');
    const sniffedNumeric = await sniffNumeric(all, path, options.missing);
    const rejects = async () => {
      const rows = await all<{ line: bigint; error_message: string }>(
        'SELECT line, error_message FROM nr_rejects WHERE scan_id = (SELECT max(scan_id) FROM nr_rejects) ORDER BY line',
      ).catch(() => []); // no table: nothing was rejected
      return rows.map((r) => ({ line: Number(r.line), reason: r.error_message }));
    };
    return { path, header, con, view: 'nr_clean', numbered: 'nr_numbered', all, rejects, sniffedNumeric, close };
  } catch (e) {
    close();
    throw new InputError(`${path}: cannot read as CSV (${firstLine((e as Error).message)})`);
  }
}

const NUMERIC_TYPES = /^(TINYINT|SMALLINT|INTEGER|BIGINT|HUGEINT|UTINYINT|USMALLINT|UINTEGER|UBIGINT|FLOAT|DOUBLE|DECIMAL)/;

async function sniffNumeric(
  all: <T>(sql: string) => Promise<T[]>,
  path: string,
  missing: readonly string[],
): Promise<Set<string>> {
  const nullstr = `[${missing.map(literal).join(', ')}]`;
  const typed = await all<{ column_name: string; column_type: string }>(
    `DESCRIBE SELECT * FROM read_csv(${literal(path)}, header = true, nullstr = ${nullstr}, ignore_errors = true)`,
  ).catch(() => []);
  return new Set(typed.filter((t) => NUMERIC_TYPES.test(t.column_type)).map((t) => t.column_name));
}

function firstLine(s: string): string {
  return s.split('\n')[0];
}
