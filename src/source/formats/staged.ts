import type { DuckDBAppender } from '@duckdb/node-api';
import type { Roles } from '../../roles/types.js';
import type { DuckEngine } from '../engines/duckdb/engine.js';
import type { DuckLayout } from '../engines/duckdb/layout.js';
import { typedSelect, typedStorage } from '../engines/duckdb/typed-select.js';
import { ident } from '../sql.js';
import type { RejectedLine, SourceFormat } from '../types.js';
import { refuseNulNames } from './column-names.js';

export type StagedType = 'DOUBLE' | 'VARCHAR';
export interface StagedColumn {
  name: string;
  type: StagedType;
}
export type StagedValue = number | string | null;

/**
 * Formats DuckDB has no reader for here (Arrow IPC, Excel) are read by a kept JS library one
 * batch of rows at a time and appended to a DuckDB table, which spills to disk beyond the memory
 * limit: the rows are never all held in JS. The table's rowid is the record number.
 */
export class Stager {
  private appender: DuckDBAppender | null = null;
  rows = 0;
  constructor(
    private readonly engine: DuckEngine,
    readonly columns: StagedColumn[],
    private readonly display: string,
  ) {}

  async open(): Promise<void> {
    refuseNulNames(
      this.columns.map((c) => c.name),
      this.display,
    );
    const defs = this.columns.map((c) => `${ident(c.name)} ${c.type}`).join(', ');
    await this.engine.con.run(`CREATE TABLE nr_staged (${defs})`);
    this.appender = await this.engine.con.createAppender('nr_staged');
  }

  /** append one record (values in column order; a value of the wrong kind is appended as text or NULL) */
  append(values: readonly StagedValue[]): void {
    const a = this.appender;
    if (!a) throw new Error('staged table: append before begin');
    this.columns.forEach((c, i) => {
      const v = values[i];
      if (v === null || v === undefined) a.appendNull();
      else if (c.type === 'DOUBLE') {
        if (typeof v === 'number') a.appendDouble(v);
        else a.appendNull();
      } else a.appendVarchar(typeof v === 'string' ? v : String(v));
    });
    a.endRow();
    this.rows++;
  }

  close(): void {
    if (!this.appender) return;
    this.appender.flushSync();
    this.appender.closeSync();
    this.appender = null;
  }
}

/** The layout over the staged table; `rejected` are the records the library could not read. */
export function stagedLayout(
  display: string,
  format: SourceFormat,
  columns: readonly { name: string; type: string }[],
  roles: Roles,
  missing: readonly string[],
  rejected: RejectedLine[],
): DuckLayout {
  const typed = columns.map((c) => ({ name: c.name, type: c.type }));
  return {
    path: display,
    format,
    header: columns.map((c) => c.name),
    storage: typedStorage(typed, roles),
    numbering: 'rowid',
    typedReader: false,
    relation: (s) => `(SELECT rowid + 1 AS __rec, ${typedSelect(typed, s, missing)} FROM nr_staged)`,
    rejects: async () => rejected,
  };
}
