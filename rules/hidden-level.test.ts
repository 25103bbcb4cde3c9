import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Report } from '../src/report/types.js';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { mulberry32 } from '../test/helpers/prng.js';

/**
 * 12 groups × 4 codes × 3 records; `effect` gives each code's shift of y. `crossed` gives every
 * group all four codes (r1…r4), `nested` gives each group its own four (c-g-k), and `partly` drops
 * the fourth code from half the groups.
 */
function coded(layout: 'crossed' | 'nested' | 'partly', effect: number, seed: number): Row[] {
  const random = mulberry32(seed);
  const normal = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  const rows: Row[] = [];
  const shifts = new Map<string, number>();
  for (let g = 0; g < 12; g++) {
    const u = 0.5 * normal();
    for (let k = 0; k < 4; k++) {
      if (layout === 'partly' && k === 3 && g % 2) continue;
      const code = layout === 'nested' ? `c-${g}-${k}` : `r${k + 1}`;
      if (!shifts.has(code)) shifts.set(code, effect * normal());
      for (let i = 0; i < 3; i++) {
        rows.push({
          id: rows.length + 1,
          g: `G${String(g).padStart(2, '0')}`,
          code,
          y: (u + (shifts.get(code) ?? 0) + normal()).toFixed(4),
        });
      }
    }
  }
  return rows;
}

const roles = { group: 'g', outcome: 'y' };

describe('hidden-level', () => {
  let pastes: Report;
  let crossed: Report;
  let partly: Report;
  let nested: Report;
  let clean: Report;
  beforeAll(async () => {
    const csv = readFileSync(new URL('../fixtures/reference/pastes.csv', import.meta.url), 'utf8');
    [pastes, crossed, partly, nested, clean] = await Promise.all([
      // sample (cask within batch) as the group and batch left out of the role map
      auditRows(csv, { group: 'sample', outcome: 'strength' }),
      auditRows(coded('crossed', 2, 3), roles),
      auditRows(coded('partly', 2, 3), roles),
      auditRows(coded('nested', 2, 5), roles),
      // codes with no effect, and a code column the role map types (a variable, not an ID)
      auditRows(
        coded('crossed', 0, 3).map((r) => ({ ...r, kind: r.code })),
        { ...roles, types: { kind: 'categorical' } },
      ),
    ]);
  });

  it('a level above the groups: Pastes batch holds 31.1% (lme4 one-way REML, fixtures/reference/README.md)', () => {
    const f = onlyFinding(pastes, 'hidden-level');
    expect(f.severity).toBe('warning');
    expect(f.column).toBe('batch');
    // R 4.2.2 + lme4 1.1-31, lmer(strength ~ 1 + (1|batch), Pastes): 3.344042 / (3.344042 + 7.424933) = 0.3105
    expectMessage(f, 'levelAbove', { column: 'batch', group: 'sample', valueCount: 10, pairs: 30, share: '31.1%', outcome: 'strength' });
  });

  it('a crossed code: every group × code pair present', () => {
    const f = onlyFinding(crossed, 'hidden-level');
    expectMessage(f, 'crossed', { column: 'code', relation: 'crossed', valueCount: 4, pairs: 48, cells: 48 });
  });

  it('a partly crossed code', () => {
    const f = onlyFinding(partly, 'hidden-level');
    expectMessage(f, 'crossed', { column: 'code', relation: 'partly crossed', valueCount: 4, pairs: 42, cells: 48 });
  });

  it('a level below the groups: the share beyond the groups’ own', () => {
    const f = onlyFinding(nested, 'hidden-level');
    expectMessage(f, 'levelBelow', { column: 'code', valueCount: 48, groupShare: expect.stringMatching(/%$/) as unknown as string });
    expect(Number.parseFloat(String(f.data.share))).toBeGreaterThan(Number.parseFloat(String(f.data.groupShare)) + 5);
  });

  it('codes that do not move the outcome, a record number and a typed column: nothing', () => {
    expect(findingsOf(clean, 'hidden-level')).toEqual([]);
  });
});
