import type { DataType } from 'apache-arrow';
import { Bool, DateDay, Float32, Float64, Int32, Int64, Table, tableToIPC, Uint64, Utf8, vectorFromArray } from 'apache-arrow';
import type { FileMetaData, SchemaElement } from 'hyparquet';
import { parquetMetadata, parquetRead, parquetSchema } from 'hyparquet';
import { compressors } from 'hyparquet-compressors';
import { InputError } from '../../../errors.js';
import { ident } from '../../sql.js';
import { tableRows } from './arrow-values.js';
import type { WasmConnection } from './types.js';

/** A staged column: its Arrow type, how a decoded value becomes one, and what DuckDB is to call it. */
interface Staging {
  name: string;
  arrow: DataType;
  value: (v: unknown) => unknown;
  /** DuckDB's type for the column where the staged Arrow type is not it (timestamps staged as microseconds) */
  after?: string;
}

const same = (v: unknown) => v;
const big = (v: unknown) => (typeof v === 'bigint' ? v : BigInt(v as number));
const text = (v: unknown) => (typeof v === 'string' ? v : JSON.stringify(v, (_, x) => (typeof x === 'bigint' ? x.toString() : x)));

/**
 * Timestamps come as microseconds (hyparquet's Date would keep milliseconds only) and are made
 * DuckDB timestamps once staged; dates as epoch milliseconds, as Arrow's DateDay takes them.
 */
const PARSERS = {
  timestampFromMilliseconds: (ms: bigint) => ms * 1000n,
  timestampFromMicroseconds: (us: bigint) => us,
  timestampFromNanoseconds: (ns: bigint) => ns / 1000n,
  dateFromDays: (days: number) => days * 86_400_000,
};

/**
 * How DuckDB's Parquet reader types a top-level column, as Arrow types DuckDB-WASM imports as
 * the same DuckDB types: integers as integers (BIGINT text has no ".0", which matters for IDs),
 * floats as floats, dates and timestamps as such, text as VARCHAR. DECIMAL is staged as DOUBLE
 * (read as the same number; as text a DECIMAL keeps its trailing zeros); nested columns as JSON
 * text.
 */
function staging(name: string, e: SchemaElement, nested: boolean): Staging {
  const logical = e.logical_type;
  if (nested || e.repetition_type === 'REPEATED') return { name, arrow: new Utf8(), value: text };
  if (e.converted_type === 'DECIMAL' || logical?.type === 'DECIMAL') return { name, arrow: new Float64(), value: Number };
  if (e.converted_type === 'DATE' || logical?.type === 'DATE') return { name, arrow: new DateDay(), value: same };
  const stamp = logical?.type === 'TIMESTAMP' || e.converted_type === 'TIMESTAMP_MILLIS' || e.converted_type === 'TIMESTAMP_MICROS';
  if (stamp || e.type === 'INT96') {
    const utc = logical?.type === 'TIMESTAMP' ? logical.isAdjustedToUTC : e.type !== 'INT96';
    return { name, arrow: new Int64(), value: big, after: utc ? 'TIMESTAMPTZ' : 'TIMESTAMP' };
  }
  const unsigned = (logical?.type === 'INTEGER' && !logical.isSigned) || /^UINT_/.test(e.converted_type ?? '');
  switch (e.type) {
    case 'BOOLEAN':
      return { name, arrow: new Bool(), value: same };
    case 'INT32':
      return unsigned ? { name, arrow: new Int64(), value: big } : { name, arrow: new Int32(), value: same };
    case 'INT64':
      return { name, arrow: unsigned ? new Uint64() : new Int64(), value: big };
    case 'FLOAT':
      return { name, arrow: new Float32(), value: same };
    case 'DOUBLE':
      return { name, arrow: new Float64(), value: same };
    default:
      return logical?.type === 'FLOAT16' ? { name, arrow: new Float32(), value: same } : { name, arrow: new Utf8(), value: text };
  }
}

function metadataOf(display: string, file: ArrayBuffer): FileMetaData {
  try {
    return parquetMetadata(file, { parsers: PARSERS });
  } catch (e) {
    throw new InputError(`${display}: cannot read as Parquet (${(e as Error).message.split('\n')[0]})`);
  }
}

/**
 * Parquet in the page: DuckDB-WASM reads Parquet only through an extension it would fetch from
 * elsewhere, so the file is decoded here (hyparquet, with the codecs of hyparquet-compressors)
 * one row group at a time and appended to the table `nr_staged` with the types DuckDB's own
 * reader gives the columns (see staging). Returns the columns with DuckDB's types.
 */
export async function stageParquet(con: WasmConnection, display: string, bytes: Uint8Array): Promise<{ name: string; type: string }[]> {
  const file = bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
  const metadata = metadataOf(display, file);
  const columns = parquetSchema(metadata).children.map((c) => staging(c.element.name, c.element, c.children.length > 0));
  if (!columns.length) throw new InputError(`${display}: no columns found`);
  let rowStart = 0;
  const groups = metadata.row_groups.length ? metadata.row_groups.map((g) => Number(g.num_rows)) : [0];
  for (const [i, size] of groups.entries()) {
    const rows = size ? await readRows(display, file, metadata, rowStart, rowStart + size) : [];
    rowStart += size;
    const vectors = Object.fromEntries(
      columns.map((c, j) => [c.name, vectorFromArray(rows.map((r) => (r[j] == null ? null : c.value(r[j]))) as unknown[], c.arrow)]),
    );
    await con.insertArrowFromIPCStream(tableToIPC(new Table(vectors), 'stream'), { name: 'nr_staged', create: i === 0 });
  }
  for (const c of columns) {
    if (c.after)
      await con.query(`ALTER TABLE nr_staged ALTER ${ident(c.name)} SET DATA TYPE ${c.after} USING make_timestamp(${ident(c.name)})`);
  }
  const described = tableRows<{ column_name: string; column_type: string }>(await con.query('DESCRIBE nr_staged'));
  return described.map((d) => ({ name: d.column_name, type: d.column_type }));
}

async function readRows(
  display: string,
  file: ArrayBuffer,
  metadata: FileMetaData,
  rowStart: number,
  rowEnd: number,
): Promise<unknown[][]> {
  try {
    let rows: unknown[][] = [];
    await parquetRead({ file, metadata, compressors, parsers: PARSERS, rowStart, rowEnd, onComplete: (r) => (rows = r) });
    return rows;
  } catch (e) {
    throw new InputError(`${display}: cannot read as Parquet (${(e as Error).message.split('\n')[0]})`);
  }
}
