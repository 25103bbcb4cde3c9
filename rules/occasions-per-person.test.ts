import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Report } from '../src/report/types.js';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

const roles = { group: 'person', outcomes: ['score'], time: 'wave' };
const id = (j: number) => `P${String(j + 1).padStart(2, '0')}`;

/**
 * 24 persons, occasions 1–4 (time 0 never observed): 12 completers (score 10 + j mod 3 + wave),
 * 6 monotone dropouts after wave 2 (score 5 + wave), 3 with wave 2 missing, 3 entering at wave 3.
 */
function planted(): Row[] {
  const rows: Row[] = [];
  const add = (j: number, waves: number[], score: (t: number) => number) => {
    for (const t of waves) rows.push({ person: id(j), wave: t, score: score(t) });
  };
  for (let j = 0; j < 12; j++) add(j, [1, 2, 3, 4], (t) => 10 + (j % 3) + t);
  for (let j = 12; j < 18; j++) add(j, [1, 2], (t) => 5 + t);
  for (let j = 18; j < 21; j++) add(j, [1, 3, 4], (t) => 11 + t);
  for (let j = 21; j < 24; j++) add(j, [3, 4], (t) => 11 + t);
  return rows;
}

describe('occasions-per-person', () => {
  let report: Report;
  beforeAll(async () => {
    report = await auditRows(planted(), roles);
  });
  afterAll(() => undefined);

  it('finds time zero outside the data, the missing occasions by pattern and the dropouts’ lower outcome', () => {
    const found = findingsOf(report, 'occasions-per-person');
    expect(found.map((f) => f.messageId).sort()).toEqual(['dropoutDiffers', 'missingOccasions', 'timeZero']);
    const zero = found.find((f) => f.messageId === 'timeZero');
    // mean wave over the 72 records: (12·10 + 6·3 + 3·8 + 3·7) / 72 = 183 / 75 = 2.44
    expectMessage(zero as (typeof found)[0], 'timeZero', { column: 'wave', share: '0%', mean: '2.44' });
    expect(zero?.values).toEqual(['1']);
    expect(zero?.severity).toBe('note');
    const gaps = found.find((f) => f.messageId === 'missingOccasions');
    expectMessage(gaps as (typeof found)[0], 'missingOccasions', {
      persons: 24,
      occasions: 4,
      complete: 12,
      dropout: 6,
      gap: 3,
      late: 3,
    });
    expect(gaps?.groups).toEqual(['P19', 'P20', 'P21']);
    expect(gaps?.count).toBe(3);
    // by hand: completers at wave 2 score 12, 13, 14 four times each (mean 13, SD sqrt(8/11));
    // dropouts' last score 7: (7 − 13) / sqrt(8/11) = −7.0356
    const drop = found.find((f) => f.messageId === 'dropoutDiffers');
    expectMessage(drop as (typeof found)[0], 'dropoutDiffers', { outcome: 'score', dropouts: 6, difference: '-7.04' });
    expect(drop?.severity).toBe('warning');
    expect(drop?.column).toBe('score');
  });

  it('warns when most persons have fewer than three occasions', async () => {
    const rows: Row[] = [];
    for (let j = 0; j < 10; j++) for (const t of j < 3 ? [0, 1, 2] : [0, 1]) rows.push({ person: id(j), wave: t, score: (j % 3) + t });
    const r = await auditRows(rows, roles);
    const [f, ...more] = findingsOf(r, 'occasions-per-person');
    expect(more.map((m) => m.messageId)).toEqual(['missingOccasions']);
    expectMessage(f, 'fewOccasions', { persons: 10, three: '30%', one: '0%', two: '70%' });
    expect(f.severity).toBe('warning');
  });

  it('says when timing is person-specific instead of judging dropout', async () => {
    const rows: Row[] = [];
    for (let j = 0; j < 8; j++) for (let i = 0; i < 3; i++) rows.push({ person: id(j), wave: i + j / 10, score: j + i });
    const r = await auditRows(rows, roles);
    const found = findingsOf(r, 'occasions-per-person');
    expect(found.map((f) => f.messageId).sort()).toEqual(['personSpecific', 'timeZero']);
    expectMessage(found.find((f) => f.messageId === 'personSpecific') as (typeof found)[0], 'personSpecific', { occasions: 24, most: 3 });
  });

  it('a clean panel (three shared occasions from 0, no one missing) and a map without time yield nothing', async () => {
    const rows: Row[] = [];
    for (let j = 0; j < 10; j++) for (const t of [0, 1, 2]) rows.push({ person: id(j), wave: t, score: (j % 4) + t });
    expect(findingsOf(await auditRows(rows, roles), 'occasions-per-person')).toEqual([]);
    expect(findingsOf(await auditRows(planted(), { group: 'person', outcomes: ['score'] }), 'occasions-per-person')).toEqual([]);
  });
});
