import { Float64, Table, tableToIPC, Utf8, vectorFromArray } from 'apache-arrow';
import { InputError } from '../../../errors.js';
import type { StagedColumn, StagedValue } from '../../formats/staged.js';
import type { WasmConnection } from './types.js';

/**
 * JSON and NDJSON in the page: DuckDB-WASM has no JSON reader of its own (the json extension
 * would be fetched from elsewhere), so the records are parsed here and staged in a table, as
 * the command line stages Arrow and Excel (formats/staged.ts). Columns are typed as DuckDB's
 * reader types them: numbers where every value is a number, else text (a number's text, a
 * string's content, an object's JSON).
 */
export async function stageJson(con: WasmConnection, name: string, text: string, format: 'json' | 'ndjson'): Promise<StagedColumn[]> {
  const records = parseRecords(name, text, format);
  const names: string[] = [];
  const seen = new Set<string>();
  for (const r of records) {
    for (const k of Object.keys(r)) {
      if (!seen.has(k)) {
        seen.add(k);
        names.push(k);
      }
    }
  }
  if (!names.length) throw new InputError(`${name}: no columns found`);
  const columns: StagedColumn[] = names.map((n) => ({
    name: n,
    type: records.every((r) => r[n] === null || r[n] === undefined || typeof r[n] === 'number') ? 'DOUBLE' : 'VARCHAR',
  }));
  await insertStaged(
    con,
    columns,
    columns.map((c) => records.map((r) => cell(r[c.name], c.type))),
    true,
  );
  return columns;
}

/** Append staged values (one array per column) to nr_staged as Arrow, creating it first if asked. */
export async function insertStaged(con: WasmConnection, columns: StagedColumn[], values: StagedValue[][], create: boolean): Promise<void> {
  const vectors = Object.fromEntries(
    columns.map((c, i) => [
      c.name,
      c.type === 'DOUBLE' ? vectorFromArray(values[i], new Float64()) : vectorFromArray(values[i], new Utf8()),
    ]),
  );
  await con.insertArrowFromIPCStream(tableToIPC(new Table(vectors), 'stream'), { name: 'nr_staged', create });
}

function cell(v: unknown, type: StagedColumn['type']): StagedValue {
  if (v === null || v === undefined) return null;
  if (type === 'DOUBLE') return v as number;
  if (typeof v === 'string') return v;
  return typeof v === 'object' ? JSON.stringify(v) : String(v);
}

function parseRecords(name: string, text: string, format: 'json' | 'ndjson'): Record<string, unknown>[] {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  let values: unknown[];
  try {
    if (format === 'ndjson') {
      values = body.split(/\r?\n/).flatMap((line) => (line.trim() ? [JSON.parse(line)] : []));
    } else {
      const doc = JSON.parse(body);
      values = Array.isArray(doc) ? doc : [doc];
    }
  } catch (e) {
    throw new InputError(`${name}: cannot read as ${format.toUpperCase()} (${(e as Error).message})`);
  }
  if (values.some((v) => v === null || typeof v !== 'object' || Array.isArray(v))) {
    throw new InputError(`${name}: cannot read as ${format.toUpperCase()} (expected one object per record)`);
  }
  return values as Record<string, unknown>[];
}
