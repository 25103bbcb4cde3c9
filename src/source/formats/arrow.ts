import { open } from 'node:fs/promises';
import { RecordBatchReader } from 'apache-arrow';
import { InputError } from '../../errors.js';
import type { DuckLayout } from '../engines/duckdb/layout.js';
import { isTemporal, stagedType, toValue } from './arrow-cells.js';
import { registerArrowCodecs } from './arrow-codecs.js';
import type { ReadContext } from './registry.js';
import type { StagedColumn, StagedValue } from './staged.js';
import { Stager, stagedLayout } from './staged.js';

/**
 * Arrow IPC (file or stream format): DuckDB has no Arrow reader built in here, so record
 * batches are read one at a time with apache-arrow and appended to a staged DuckDB table.
 * Compressed bodies (LZ4 frame, zstd) are decoded by the codecs of arrow-codecs.ts.
 */
export async function arrowLayout({ engine, file, display, roles, missing }: ReadContext): Promise<DuckLayout> {
  registerArrowCodecs();
  const handle = await open(file, 'r');
  try {
    let reader: Awaited<ReturnType<typeof RecordBatchReader.from>>;
    try {
      reader = await RecordBatchReader.from(handle);
      await reader.open();
    } catch (e) {
      throw new InputError(`${display}: cannot read as Arrow IPC (${(e as Error).message.split('\n')[0]})`);
    }
    const columns: StagedColumn[] = reader.schema.fields.map((f) => ({ name: f.name, type: stagedType(f) }));
    const temporal = reader.schema.fields.map(isTemporal);
    const stager = new Stager(engine, columns, display);
    await stager.open();
    try {
      for await (const batch of reader) {
        const vectors = columns.map((_, i) => batch.getChildAt(i));
        const row: StagedValue[] = new Array(columns.length);
        for (let r = 0; r < batch.numRows; r++) {
          for (let i = 0; i < columns.length; i++) row[i] = toValue(vectors[i]?.get(r), columns[i].type, temporal[i]);
          stager.append(row);
        }
      }
    } finally {
      stager.close();
    }
    return stagedLayout(display, 'arrow', columns, roles, missing, []);
  } finally {
    await handle.close();
  }
}
