import type { Field } from 'apache-arrow';
import { DataType } from 'apache-arrow';
import type { StagedColumn, StagedValue } from './staged.js';

/** Arrow integers and floats are staged as DOUBLE, everything else as text. */
export function stagedType(f: Field): StagedColumn['type'] {
  return DataType.isInt(f.type) || DataType.isFloat(f.type) ? 'DOUBLE' : 'VARCHAR';
}

export function isTemporal(f: Field): boolean {
  return DataType.isDate(f.type) || DataType.isTimestamp(f.type);
}

/** One Arrow value as staged (shared by the command line's reader and the page's). */
export function toValue(v: unknown, type: StagedColumn['type'], temporal: boolean): StagedValue {
  if (v === null || v === undefined) return null;
  if (type === 'DOUBLE') return typeof v === 'bigint' ? Number(v) : (v as number);
  if (typeof v === 'string') return v;
  // dates and timestamps come as epoch milliseconds (or Date): written as ISO text, as a CSV holds them
  if (v instanceof Date || (temporal && (typeof v === 'number' || typeof v === 'bigint'))) {
    const iso = new Date(v instanceof Date ? v.getTime() : Number(v)).toISOString();
    return iso.endsWith('T00:00:00.000Z') ? iso.slice(0, 10) : iso;
  }
  return String(v);
}
