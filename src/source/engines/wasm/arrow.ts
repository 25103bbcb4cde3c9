import type { RecordBatchFileReader, RecordBatchStreamReader } from 'apache-arrow';
import { RecordBatchReader } from 'apache-arrow';
import { InputError } from '../../../errors.js';
import { isTemporal, stagedType, toValue } from '../../formats/arrow-cells.js';
import { registerArrowCodecs } from '../../formats/arrow-codecs.js';
import type { StagedColumn, StagedValue } from '../../formats/staged.js';
import { insertStaged } from './json.js';
import type { WasmConnection } from './types.js';

/**
 * Arrow IPC (file or stream, LZ4 or zstd bodies) in the page: read with apache-arrow as the
 * command line reads it (formats/arrow.ts, the same staged types and values), one record batch
 * at a time appended to nr_staged.
 */
export async function stageArrow(con: WasmConnection, display: string, bytes: Uint8Array): Promise<StagedColumn[]> {
  registerArrowCodecs();
  let reader: RecordBatchFileReader | RecordBatchStreamReader;
  try {
    reader = RecordBatchReader.from(bytes) as RecordBatchFileReader | RecordBatchStreamReader;
    reader.open();
  } catch (e) {
    throw new InputError(`${display}: cannot read as Arrow IPC (${(e as Error).message.split('\n')[0]})`);
  }
  const columns: StagedColumn[] = reader.schema.fields.map((f) => ({ name: f.name, type: stagedType(f) }));
  if (!columns.length) throw new InputError(`${display}: no columns found`);
  const temporal = reader.schema.fields.map(isTemporal);
  let created = false;
  for (const batch of reader) {
    const values: StagedValue[][] = columns.map((c, i) => {
      const vector = batch.getChildAt(i);
      return Array.from({ length: batch.numRows }, (_, r) => toValue(vector?.get(r), c.type, temporal[i]));
    });
    await insertStaged(con, columns, values, !created);
    created = true;
  }
  if (!created)
    await insertStaged(
      con,
      columns,
      columns.map(() => []),
      true,
    );
  return columns;
}
