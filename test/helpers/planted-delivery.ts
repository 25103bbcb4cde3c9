import fc from 'fast-check';
import type { Row } from './delivery.js';
import { groupId } from './delivery.js';
import { mulberry32 } from './prng.js';

/** The structures a planted delivery can carry, each found by one rule. */
export interface Plants {
  /** `ward` holds each group in one of its values and the outcome `y` moves with it (hidden-level) */
  hiddenLevel: boolean;
  /** the planned slope `x` is constant within every group (slope-support) */
  flatSlope: boolean;
  /** in one row of groups `b` is all 0, in another all 1 (binary-separation) */
  constantGroups: boolean;
  /** the level `D` of `cat` occurs only with `b` = 0 (binary-separation) */
  emptyCell: boolean;
}

/** The drawn shape and effects of a delivery, and what is planted in it. */
export interface PlantedCase {
  /** wards (values of the undeclared `ward` column) */
  wards: number;
  /** groups per ward: group j is in ward j % wards and in row ⌊j / wards⌋ */
  rows: number;
  /** records per group, by row (every ward has one group of each row, so every ward has as many records) */
  sizes: number[];
  /** SD of the group intercepts, of the residuals, and the scale of the group slopes */
  tau: number;
  sigma: number;
  slopeScale: number;
  /** seed of the normal draws */
  seed: number;
  plants: Plants;
}

/** The role map of every planted delivery: `ward` is left out on purpose. */
export const PLANTED_ROLES = { group: 'g', outcomes: ['y', 'b'], level1: ['cat'], slopes: ['x'] };

/** Rows whose groups are all 0 and all 1 when constant groups are planted; the `D` records avoid both. */
const ALL_ZERO_ROW = 0;
const ALL_ONE_ROW = 1;
/** Distance between ward effects on `y`: many times any other spread of `y` (see plantedRows). */
const WARD_STEP = 60;

/**
 * Cases drawn with fast-check. The ranges make each rule's decision certain by construction,
 * not by chance (the reasons are beside plantedRows): at least 3 wards of 4 groups (12 groups,
 * above slope-support's 10), 16 to 20 records per group.
 */
export const plantedCase: fc.Arbitrary<PlantedCase> = fc
  .record({
    wards: fc.integer({ min: 3, max: 4 }),
    rows: fc.integer({ min: 4, max: 5 }),
    tau: fc.double({ min: 0.5, max: 2, noNaN: true }),
    sigma: fc.double({ min: 0.5, max: 1, noNaN: true }),
    slopeScale: fc.double({ min: 1.5, max: 3, noNaN: true }),
    seed: fc.integer(),
    plants: fc.record({ hiddenLevel: fc.boolean(), flatSlope: fc.boolean(), constantGroups: fc.boolean(), emptyCell: fc.boolean() }),
  })
  .chain((c) => fc.array(fc.integer({ min: 16, max: 20 }), { minLength: c.rows, maxLength: c.rows }).map((sizes) => ({ ...c, sizes })));

/**
 * A delivery from a random-intercept, random-slope model, y = u_j + β_j·x + e, with a 0/1
 * outcome b and a three-level categorical `cat`, and the planted structures of `c.plants`.
 * Why each rule's answer is certain, planted or not:
 * - hidden-level: `y` is centred within wards after it is drawn, so without the plant the
 *   between-ward variance of `y` is exactly 0 (share 0 < 5%); `b` has the same number of 1s in
 *   every ward (its counts go by row, and every ward has one group of each row). Planted, the ward
 *   effects are WARD_STEP apart, so their variance (≥ 2,400 with 3 wards) dwarfs everything else in
 *   `y` (within-group variance ≤ 6²/3 + 1, between-group variance ≤ 2² + 3²): share > 90%.
 * - slope-support: without the plant, x spans [−1, 1] in each group (Sxx ≥ 16/3) and the group
 *   slopes take the five values slopeScale·{−2, …, 2}, each in ≥ 2 groups: their variance (≥ 4)
 *   is over 20 times the sampling variance σ²/Sxx ≤ 0.19, so the moment estimate is positive and
 *   the reliability near 1, with ≥ 12 informing groups. Planted, x is one value per group: no group
 *   informs the slope (noSupport for both outcomes).
 * - binary-separation: group j has ⌊n/2⌋ + (row mod 3) − 1 ones (7 to 11 of 16 to 20, so 7 to 9
 *   zeros), the first records, and cat cycles A, B, C over the records, so every level has ≥ 2
 *   zeros and ≥ 2 ones in each of ≥ 12 groups (≥ 24 > 5, no sparse cell), ≥ 84 events for 7 parameters
 *   (≥ 10 per parameter) and ≥ 16 records per group (no quadrature advice). Planted, rows 0 and 1
 *   are all 0 and all 1; the `D` records are the last record of each group in rows ≥ 2, always
 *   a 0 since no group there has more than 11 ones.
 */
export function plantedRows(c: PlantedCase): Row[] {
  const uniform = mulberry32(c.seed);
  const normal = () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
  const rows: Row[] = [];
  const wardOf: number[] = [];
  const groups = c.wards * c.rows;
  for (let j = 0; j < groups; j++) {
    const [ward, row] = [j % c.wards, Math.floor(j / c.wards)];
    const n = c.sizes[row];
    const u = c.tau * normal();
    const beta = c.slopeScale * (((j * 3) % 5) - 2);
    // the group's centre of x, so that x varies between groups too
    const centre = (((j * 7) % 11) - 5) / 10;
    const ones = onesIn(c, row, n);
    for (let i = 0; i < n; i++) {
      const x = c.plants.flatSlope ? centre : centre + (2 * i) / (n - 1) - 1;
      const last = i === n - 1 && row !== ALL_ZERO_ROW && row !== ALL_ONE_ROW;
      rows.push({
        g: groupId(j),
        ward: `W${ward + 1}`,
        x,
        cat: c.plants.emptyCell && last ? 'D' : 'ABC'[i % 3],
        y: u + beta * x + c.sigma * normal(),
        b: i < ones ? 1 : 0,
      });
      wardOf.push(ward);
    }
  }
  centreWithinWards(rows, wardOf, c.wards);
  if (c.plants.hiddenLevel) {
    for (const [k, r] of rows.entries()) r.y = (r.y as number) + WARD_STEP * wardOf[k];
  }
  return rows;
}

/** How many of a group's n records have b = 1: its first ones. */
function onesIn(c: PlantedCase, row: number, n: number): number {
  if (c.plants.constantGroups && row === ALL_ZERO_ROW) return 0;
  if (c.plants.constantGroups && row === ALL_ONE_ROW) return n;
  return Math.floor(n / 2) + (row % 3) - 1;
}

/** Shift `y` so that every ward has the grand mean: no variance between wards is left. */
function centreWithinWards(rows: Row[], wardOf: readonly number[], wards: number): void {
  const sum = new Array<number>(wards).fill(0);
  const count = new Array<number>(wards).fill(0);
  rows.forEach((r, k) => {
    sum[wardOf[k]] += r.y as number;
    count[wardOf[k]]++;
  });
  const grand = sum.reduce((a, b) => a + b, 0) / rows.length;
  for (const [k, r] of rows.entries()) r.y = (r.y as number) - sum[wardOf[k]] / count[wardOf[k]] + grand;
}

/** The IDs of the groups planted all 0 and all 1, in group order. */
export function constantGroupIds(c: PlantedCase): { allZero: string[]; allOne: string[] } {
  const ids = (row: number) => Array.from({ length: c.wards }, (_, w) => groupId(row * c.wards + w));
  return { allZero: ids(ALL_ZERO_ROW), allOne: ids(ALL_ONE_ROW) };
}

/** The number of `D` records when the empty cell is planted: one per group outside the constant rows. */
export function emptyCellRecords(c: PlantedCase): number {
  return c.wards * (c.rows - 2);
}
