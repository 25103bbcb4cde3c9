import { describe, expect, it } from 'vitest';
import { duckdb } from '../../../src/source/dialect.js';
import { createEngine } from '../../../src/source/engines/duckdb/engine.js';
import { sketchKey, sketchQuery } from '../../../src/source/plan/sketch-query.js';

// DuckDB counts with a binned histogram, PostgreSQL with one conditional count per edge: both must
// give the same counts at or below each edge, values on an edge, above the last, NaN, text and blanks included.
const ROWS: [string, string, number | null][] = [
  ['a', '1', 1],
  ['a', '2.5', 2.5],
  ['a', '3', 3],
  ['a', 'x', Number.NaN],
  ['b', '', null],
  ['b', '-7', -7],
  ['b', '99', 99],
  [' ', '2', 2],
];
const EDGES = [1, 2, 2.5, 3];

describe('sketchQuery', () => {
  it('counts alike in both forms, over the delivery and per group', async () => {
    const engine = await createEngine({ memoryLimit: '64MB', threads: 1 });
    try {
      const values = ROWS.map(([g, t, x]) => `('${g}', '${t}', ${x === null ? 'NULL' : `'${x}'::DOUBLE`})`).join(', ');
      const view = `(SELECT * FROM (VALUES ${values}) AS v(g, t, x))`;
      const plans = [
        { name: 't', storage: 'text' as const, edges: EDGES },
        { name: 'x', storage: 'double' as const, edges: EDGES },
        { name: 'x', storage: 'double' as const, edges: [0] },
      ];
      const conditional = { ...duckdb, name: 'postgres' as const };
      for (const group of [undefined, 'g']) {
        const order = (rows: Record<string, unknown>[]) => rows.sort((p, q) => String(p.group).localeCompare(String(q.group)));
        const binned = order(await engine.all(sketchQuery(view, plans, duckdb, group)));
        const counted = order(await engine.all(sketchQuery(view, plans, conditional, group)));
        expect(binned).toEqual(counted);
        if (group === undefined) {
          // by hand: 1, 2.5, 3, -7, 99, 2 read as numbers in both columns (NaN and the blank do not)
          expect(EDGES.map((_, k) => binned[0][sketchKey(0, k)])).toEqual([2, 3, 4, 5]);
          expect([binned[0][sketchKey(1, 'n')], binned[0][sketchKey(2, 0)]]).toEqual([6, 1]);
        } else expect(binned.map((r) => r.group)).toEqual([' ', 'a', 'b']);
      }
    } finally {
      engine.close();
    }
  });
});
