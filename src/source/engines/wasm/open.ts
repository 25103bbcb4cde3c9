import { InputError } from '../../../errors.js';
import type { Roles } from '../../../roles/types.js';
import { csvLayout } from '../../formats/csv.js';
import { stagedLayout } from '../../formats/staged.js';
import type { OpenOptions, Source } from '../../types.js';
import type { DuckLayout } from '../duckdb/layout.js';
import { duckSource } from '../duckdb/views.js';
import { stageArrow } from './arrow.js';
import type { PageBinaryFormat } from './detect.js';
import { binaryPicked, detectPicked } from './detect.js';
import { wasmHost } from './host.js';
import { stageJson } from './json.js';
import { stageParquet } from './parquet.js';
import type { PickedFile } from './picked.js';
import { gunzip, pageTextFiles, prepare } from './picked.js';
import type { WasmDatabase } from './types.js';

/** The name the picked file is registered under in DuckDB-WASM's file system. */
const DELIVERY = 'nr-delivery';

/**
 * Open a picked delivery in DuckDB-WASM behind the same Source as the command line's engines:
 * the same CSV reader's SQL (formats/csv.ts: sniff, typed read, rejects, decimal commas) and the
 * same views (engines/duckdb/views.ts) on a host that sends the SQL to the worker. JSON and
 * NDJSON are parsed in the page and staged (json.ts). The file never leaves the page.
 */
export async function openPicked(
  db: WasmDatabase,
  picked: PickedFile,
  roles: Roles,
  options: Pick<OpenOptions, 'missing' | 'decimalComma'>,
): Promise<Source> {
  const display = picked.name;
  if (picked.bytes.length === 0) throw new InputError(`${display}: the file is empty (no header, no records)`);
  const missing = [...new Set(['', ...options.missing])];
  const binary = binaryPicked(display, picked.bytes);
  if (binary) return openBinary(db, picked, binary, roles, missing);
  const file = await prepare(picked).catch((e: unknown) => {
    throw e instanceof InputError ? new InputError(`${display}: ${e.message}`) : e;
  });
  const detected = detectPicked(display, file.head);
  const registered = `${DELIVERY}.${detected.format}${file.gzip ? '.gz' : ''}`;
  const files: string[] = [];
  const host = await wasmHost(db, files);
  try {
    let layout: DuckLayout;
    if (detected.format === 'json' || detected.format === 'ndjson') {
      const text = new TextDecoder().decode(file.gzip ? (await gunzip(file.bytes)).text : file.bytes);
      const staging = await db.connect();
      try {
        const columns = await stageJson(staging, display, text, detected.format);
        layout = stagedLayout(display, detected.format, columns, roles, missing, []);
      } finally {
        await staging.close();
      }
    } else {
      await db.registerFileBuffer(registered, file.bytes);
      files.push(registered);
      const ctx = {
        engine: host,
        files: pageTextFiles(file),
        file: registered,
        display,
        roles,
        missing,
        gzip: file.gzip,
        ...(detected.delimiter !== undefined && { delimiter: detected.delimiter }),
        options: { missing, ...(options.decimalComma && { decimalComma: true }) },
      };
      layout = await csvLayout(ctx, detected.format, detected.format === 'tsv' ? '\t' : detected.delimiter);
    }
    if (!layout.header.length) throw new InputError(`${display}: no columns found`);
    return await duckSource(host, layout, roles, missing);
  } catch (e) {
    await host.close();
    if (e instanceof InputError) throw e;
    throw new InputError(
      `${display}: cannot read as ${detected.format.toUpperCase()} (${String((e as Error)?.message ?? e).split('\n')[0]})`,
    );
  }
}

/** Parquet and Arrow IPC, decoded in the page and staged (parquet.ts, arrow.ts), behind the same views. */
async function openBinary(
  db: WasmDatabase,
  picked: PickedFile,
  format: PageBinaryFormat,
  roles: Roles,
  missing: string[],
): Promise<Source> {
  const host = await wasmHost(db, []);
  try {
    const staging = await db.connect();
    let columns: { name: string; type: string }[];
    try {
      columns = await (format === 'parquet' ? stageParquet : stageArrow)(staging, picked.name, picked.bytes);
    } finally {
      await staging.close();
    }
    return await duckSource(host, stagedLayout(picked.name, format, columns, roles, missing, []), roles, missing);
  } catch (e) {
    await host.close();
    if (e instanceof InputError) throw e;
    const kind = format === 'parquet' ? 'Parquet' : 'Arrow IPC';
    throw new InputError(`${picked.name}: cannot read as ${kind} (${String((e as Error)?.message ?? e).split('\n')[0]})`);
  }
}
