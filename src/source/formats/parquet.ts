import { InputError, quoteName } from '../../errors.js';
import type { DuckLayout } from '../engines/duckdb/layout.js';
import { typedSelect, typedStorage } from '../engines/duckdb/typed-select.js';
import { literal } from '../sql.js';
import type { ReadContext } from './registry.js';

/**
 * Parquet and JSON/NDJSON are read by DuckDB's own readers (built into the binding): typed
 * columns, numbers as DOUBLE, everything else as text; text columns that hold only numbers are
 * settled by the profile (see Source.probe).
 */
async function typedFileLayout(
  { engine, display, roles, missing }: ReadContext,
  reader: string,
  format: 'parquet' | 'json' | 'ndjson',
): Promise<DuckLayout> {
  const columns = refuseNulNames(
    await engine.all<{ column_name: string; column_type: string }>(`DESCRIBE SELECT * FROM ${reader}`),
    display,
  ).map((d) => ({ name: d.column_name, type: d.column_type }));
  const storage = typedStorage(columns, roles);
  return {
    path: display,
    format,
    header: columns.map((c) => c.name),
    storage,
    numbering: 'window',
    typedReader: false,
    relation: (s) => `(SELECT ${typedSelect(columns, s, missing)} FROM ${reader})`,
    rejects: async () => [],
  };
}

export function parquetLayout(ctx: ReadContext): Promise<DuckLayout> {
  return typedFileLayout(ctx, `read_parquet(${literal(ctx.file)})`, 'parquet');
}

/** A JSON column DuckDB cannot give one scalar type: mixed values (`7` and `"7"`), objects, arrays. */
const NOT_SCALAR = /^(JSON|STRUCT|MAP|UNION)\b|\[\d*\]$/;

/**
 * JSON: an array of objects (or one object per line for NDJSON), gzip allowed. A column that
 * mixes numbers and strings (or holds objects or arrays) is typed JSON by the reader, whose text
 * keeps the quotes of a string (`"7"` beside `7`): such columns are read as VARCHAR, which gives
 * a string's content and a number's text, as a CSV of the same records holds them.
 */
export async function jsonLayout(ctx: ReadContext, format: 'json' | 'ndjson'): Promise<DuckLayout> {
  const f = format === 'ndjson' ? 'newline_delimited' : 'auto';
  const args = `${literal(ctx.file)}, format = '${f}', records = true${ctx.gzip ? ", compression = 'gzip'" : ''}`;
  const described = refuseNulNames(
    await ctx.engine.all<{ column_name: string; column_type: string }>(`DESCRIBE SELECT * FROM read_json(${args})`),
    ctx.display,
  );
  if (!described.some((d) => NOT_SCALAR.test(d.column_type))) return typedFileLayout(ctx, `read_json(${args})`, format);
  const columns = described.map((d) => `${literal(d.column_name)}: ${literal(NOT_SCALAR.test(d.column_type) ? 'VARCHAR' : d.column_type)}`);
  return typedFileLayout(ctx, `read_json(${args}, columns = {${columns.join(', ')}})`, format);
}

/** A NUL byte in a column name (a JSON key "u\u0000x") cannot be written in the SQL that names the column. */
function refuseNulNames<T extends { column_name: string }>(described: T[], display: string): T[] {
  const bad = described.find((d) => d.column_name.includes('\0'));
  if (bad) {
    throw new InputError(
      `${display}: the column name ${quoteName(bad.column_name)} holds a NUL byte; rename the column and send the file again`,
    );
  }
  return described;
}
