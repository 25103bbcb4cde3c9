import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Report } from '../../src/report/types.js';
import type { Finding } from '../../src/rules/types.js';
import { auditRows, findingsOf, groupId } from '../helpers/delivery.js';
import { expectMessage } from '../helpers/messages.js';
import type { PlantedCase } from '../helpers/planted-delivery.js';
import { constantGroupIds, emptyCellRecords, PLANTED_ROLES, plantedCase, plantedRows } from '../helpers/planted-delivery.js';

// `npm test` runs a seeded 25; PLANTED_RUNS and PLANTED_SEED run more or others by hand
const runs = Number(process.env.PLANTED_RUNS ?? 25);
const seed = Number(process.env.PLANTED_SEED ?? 20261213);

const byMessage = (report: Report, rule: string, messageId: string): Finding[] =>
  findingsOf(report, rule).filter((f) => f.messageId === messageId);

function only(list: readonly Finding[], what: string): Finding {
  if (list.length !== 1) throw new Error(`expected one ${what} finding, got ${list.length}: ${JSON.stringify(list)}`);
  return list[0];
}

function checkHiddenLevel(report: Report, c: PlantedCase): void {
  const found = findingsOf(report, 'hidden-level');
  if (!c.plants.hiddenLevel) {
    expect(found, 'hidden-level on a ward without variance').toEqual([]);
    return;
  }
  const f = only(found, 'hidden-level');
  expectMessage(f, 'levelAbove', { column: 'ward', group: 'g', valueCount: c.wards, outcome: 'y' });
}

function checkSlope(report: Report, c: PlantedCase): void {
  const found = findingsOf(report, 'slope-support');
  if (!c.plants.flatSlope) {
    expect(found, 'slope-support with spread in every group').toEqual([]);
    return;
  }
  const groups = c.wards * c.rows;
  expect(found.map((f) => f.data?.outcome).sort()).toEqual(['b', 'y']);
  for (const f of found) {
    expectMessage(f, 'noSupport', { column: 'x', informing: 0, groups });
    expect(f.count).toBe(groups);
    expect(f.groups).toEqual(Array.from({ length: Math.min(groups, 20) }, (_, j) => groupId(j)));
  }
}

function checkSeparation(report: Report, c: PlantedCase): void {
  const constant = byMessage(report, 'binary-separation', 'constantGroups');
  const separation = byMessage(report, 'binary-separation', 'separation');
  if (!c.plants.constantGroups && !c.plants.emptyCell) {
    expect(findingsOf(report, 'binary-separation'), 'binary-separation on a clean 0/1 outcome').toEqual([]);
  }
  if (c.plants.constantGroups) {
    const { allZero, allOne } = constantGroupIds(c);
    const f = only(constant, 'constantGroups');
    expectMessage(f, 'constantGroups', { column: 'b', count: 2 * c.wards, groups: c.wards * c.rows, allZero: c.wards, allOne: c.wards });
    expect([...(f.groups ?? [])].sort()).toEqual([...allZero, ...allOne].sort());
  } else {
    expect(constant).toEqual([]);
  }
  if (c.plants.emptyCell) {
    const records = emptyCellRecords(c);
    const f = only(separation, 'separation');
    expectMessage(f, 'separation', { column: 'b', predictor: 'cat', value: 0, levelCount: 1, records });
    expect(f.values).toEqual([`D (${records})`]);
  } else {
    expect(separation).toEqual([]);
  }
}

describe('planted structure', () => {
  it(`finds each planted structure by its rule and none that is not planted (${runs} runs, seed ${seed})`, {
    timeout: Math.max(60_000, runs * 4_000),
  }, async () => {
    await fc.assert(
      fc.asyncProperty(plantedCase, async (c) => {
        const report = await auditRows(plantedRows(c), PLANTED_ROLES, { plotData: false });
        checkHiddenLevel(report, c);
        checkSlope(report, c);
        checkSeparation(report, c);
      }),
      { numRuns: runs, seed, endOnFailure: true },
    );
  });
});
