import fc from 'fast-check';
import type { HostileKind } from './cells.js';
import { idCell, MARKUP, valueCell } from './cells.js';

/**
 * A delivery before it is written in a format: a header and rows of cell text. The role map's
 * columns are `group`, `unit`, `outcome`, `level1` by index; column names may be hostile.
 */
export interface Table {
  header: string[];
  rows: string[][];
  columns: { group: number; unit: number; outcome: number; level1: number };
}

const HOSTILE_NAMES = ['y\nz', 'say "hi"', MARKUP[0], 'a,b', ' pad ', 'x\ty', '=1+1', 'é', ' lead', 'trail ', '"q"', 'a;b', 'a",b'];

/** Column names: plain, or one of them hostile, or a duplicate of another. */
const header = fc
  .record({
    hostile: fc.option(fc.tuple(fc.integer({ min: 0, max: 4 }), fc.constantFrom(...HOSTILE_NAMES)), { freq: 3 }),
    duplicate: fc.boolean(),
  })
  .map(({ hostile, duplicate }) => {
    const names = ['g', 'u', 'y', 'x', 'z'];
    if (hostile) names[hostile[0]] = hostile[1];
    if (duplicate) names[4] = names[3];
    return names;
  });

/** A table: 0 to 40 records in up to 8 groups; cells of the `kind` of hostile content mixed in; odd names when `oddNames`. */
export function table(kind: HostileKind, oddNames: boolean): fc.Arbitrary<Table> {
  return fc
    .record({
      header: oddNames ? header : fc.constant<string[]>(['g', 'u', 'y', 'x', 'z']),
      codes: fc.integer({ min: 1, max: 8 }),
      n: fc.oneof({ weight: 1, arbitrary: fc.constantFrom(0, 1) }, { weight: 6, arbitrary: fc.integer({ min: 2, max: 40 }) }),
    })
    .chain(({ header: names, codes, n }) =>
      fc
        .array(fc.tuple(idCell(kind, codes), fc.nat({ max: 9999 }), valueCell(kind), valueCell(kind), valueCell(kind)), {
          minLength: n,
          maxLength: n,
        })
        .map((cells) => ({
          header: names,
          rows: cells.map(([g, u, y, x, z]) => [g, `U${u}`, y, x, z]),
          columns: { group: 0, unit: 1, outcome: 2, level1: 3 },
        })),
    );
}
