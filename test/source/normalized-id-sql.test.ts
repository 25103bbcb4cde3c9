import { describe, expect, it } from 'vitest';
import { duckdb } from '../../src/source/dialect.js';
import { createEngine } from '../../src/source/engines/duckdb/engine.js';
import { normalizedIdQuery, normalizeId } from '../../src/source/lookups/lookup.js';
import { literal } from '../../src/source/sql.js';

// The unit-ID check keys IDs in SQL (kd, ks); id-variants keys group IDs in JS (normalizeId).
// Both must put the same IDs together, including where the SQL skips trimming for speed.
const IDS = [
  '12',
  '12.0',
  '012',
  ' 12 ',
  '+12',
  '1.2e1',
  '12.',
  '.5',
  '0.5',
  '123456789012345',
  ' 123456789012345 ',
  '1234567890123456',
  '       123456789',
  '123456789',
  'W-014',
  ' W-014 ',
  'w-014',
  '007a',
  '7A',
  'S01',
  'S1',
  '000',
  '0',
  'abc',
  'ABC ',
  'é1',
  'É1',
];

describe('normalizedIdQuery', () => {
  it('groups the IDs exactly as normalizeId does', async () => {
    const engine = await createEngine({ memoryLimit: '64MB', threads: 1 });
    try {
      const from = `(SELECT * FROM (VALUES ${IDS.map((id) => `(${literal(id)})`).join(', ')}) AS v(id))`;
      const rows = await engine.all<{ id: string; kd: number | null; ks: string | null }>(
        `SELECT id, kd, ks FROM (${normalizedIdQuery(from, 'id', 'id', duckdb)}) AS keyed`,
      );
      const sqlKey = new Map(rows.map((r) => [r.id, r.kd === null ? `s:${r.ks}` : `d:${r.kd}`]));
      // same partition: two IDs share a SQL key exactly when they share a JS key
      for (const a of IDS) {
        for (const b of IDS) {
          expect(sqlKey.get(a) === sqlKey.get(b), `${JSON.stringify(a)} ~ ${JSON.stringify(b)}`).toBe(normalizeId(a) === normalizeId(b));
        }
      }
    } finally {
      engine.close();
    }
  });
});
