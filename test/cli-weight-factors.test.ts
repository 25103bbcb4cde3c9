import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { nestready } from './helpers/cli.js';
import type { Delivery } from './helpers/delivery.js';
import { groupedRows, writeDelivery } from './helpers/delivery.js';

describe('audit --weight-factors', () => {
  const made: Delivery[] = [];
  afterAll(() => {
    for (const d of made) d.remove();
  });
  const delivery = (roles: Record<string, unknown>) => {
    const d = writeDelivery(
      groupedRows(6, 3, (j, i) => ({ y: i + j, w: 1 + ((i + j) % 3) })),
      roles,
    );
    made.push(d);
    return d;
  };

  it("writes every group's factors to its CSV while the JSON report keeps them bounded", async () => {
    const d = delivery({ group: 'g', outcomes: ['y'], weights: { level1: 'w' } });
    const out = join(d.dir, 'factors.csv');
    const run = await nestready('audit', d.csv, '-r', d.roles, '-f', 'json', '--fail-on', 'never', '--weight-factors', out);
    expect(run.code, run.stderr).toBe(0);
    expect(run.stderr).toContain(`wrote the weight scale factors (CSV) to ${out}`);
    const lines = readFileSync(out, 'utf8').trimEnd().split('\r\n');
    expect(lines).toHaveLength(7);
    // G001: weights 1, 2, 3: Σw 6, Σw² 14, factors 3/6 and 6/14 (by hand)
    const [group, records, sum, , toSize, toEffective] = lines[1].split(',');
    expect([group, records, sum]).toEqual(['G001', '3', '6']);
    expect(Number(toSize)).toBeCloseTo(0.5, 15);
    expect(Number(toEffective)).toBeCloseTo(6 / 14, 15);
    const json = JSON.parse(run.stdout);
    expect(json).not.toHaveProperty('weightFactors');
    expect(json.weights.level1.scaling.groups).toBe(6);
  });

  it('without level-1 weights in the role map: one line naming it, exit 2, nothing written', async () => {
    const d = delivery({ group: 'g', outcomes: ['y'] });
    const out = join(d.dir, 'factors.csv');
    const run = await nestready('audit', d.csv, '-r', d.roles, '--weight-factors', out);
    expect(run.code).toBe(2);
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
    expect(run.stderr).toContain(`${d.roles}: --weight-factors needs level-1 weights`);
    expect(existsSync(out)).toBe(false);
  });
});
