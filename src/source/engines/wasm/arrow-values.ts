import type { ArrowTable, ArrowVector } from './types.js';

/** Arrow's type ids (apache-arrow's Type enum) that the conversion tells apart. */
const FLOAT = 3;

/**
 * An Arrow value as the native binding's JS conversion gives it: numbers, bigints for 64-bit
 * integers, strings, booleans, lists as arrays and structs as plain objects. The shared code
 * reads results through Number() and field names, as from the native engine.
 */
export function plainValue(v: unknown): unknown {
  if (v === null || typeof v !== 'object') return v;
  if (v instanceof Date) return v;
  if (ArrayBuffer.isView(v)) return Array.from(v as unknown as ArrayLike<unknown>, plainValue);
  const o = v as { get?: unknown; length?: unknown; toJSON?: () => Record<string, unknown> };
  if (typeof o.get === 'function' && typeof o.length === 'number' && 'type' in o) {
    const vector = v as ArrowVector;
    return Array.from({ length: vector.length }, (_, i) => plainValue(vector.get(i)));
  }
  if (typeof o.toJSON === 'function') {
    return Object.fromEntries(Object.entries(o.toJSON()).map(([k, x]) => [k, plainValue(x)]));
  }
  return v;
}

/** A result's rows as plain objects. */
export function tableRows<T>(table: ArrowTable): T[] {
  const names = table.schema.fields.map((f) => f.name);
  const columns = names.map((_, i) => table.getChildAt(i));
  const rows: T[] = [];
  for (let r = 0; r < table.numRows; r++) {
    const row: Record<string, unknown> = {};
    names.forEach((name, i) => {
      row[name] = plainValue(columns[i]?.get(r) ?? null);
    });
    rows.push(row as T);
  }
  return rows;
}

/**
 * A result by column, as the native engine's readColumns gives it: doubles without NULLs as a
 * Float64Array, every other column as an array of plain values (NULL as null).
 */
export function tableColumns(table: ArrowTable): Record<string, unknown[]> {
  const out: Record<string, unknown[]> = {};
  table.schema.fields.forEach((f, i) => {
    const vector = table.getChildAt(i);
    if (!vector) out[f.name] = [];
    else if (vector.type.typeId === FLOAT && vector.nullCount === 0) {
      out[f.name] = Float64Array.from(vector.toArray() as ArrayLike<number>) as unknown as unknown[];
    } else out[f.name] = Array.from({ length: vector.length }, (_, r) => plainValue(vector.get(r)));
  });
  return out;
}
