import { describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { planColumns } from '../../src/profile/build.js';
import { parseRoles } from '../../src/roles/load.js';
import { profileQuery } from '../../src/source/plan/profile-query.js';
import { writeDelivery } from '../helpers/delivery.js';
import { profileOf } from '../helpers/profile-of.js';

describe('the profiling plan', () => {
  const { roles } = parseRoles('group: g\nunit: id\nparent: p\noutcome: y\nlevel2: [w]\n', 'roles.yaml', catalogue);
  const storage = new Map([
    ['id', 'text'],
    ['p', 'text'],
    ['w', 'text'],
    ['y', 'double'],
  ] as const);

  it("profiles every text column's per-group range but the unit ID's, which no rule reads", () => {
    const plan = planColumns(['g', 'id', 'p', 'w', 'y'], roles, new Map(storage));
    expect(plan.map((c) => [c.name, c.textRange !== false])).toEqual([
      ['id', false],
      ['p', true],
      ['w', true],
      ['y', true],
    ]);
    const sql = profileQuery('v', 'g', plan);
    expect(sql).not.toContain('"id:min"');
    expect(sql).toContain('"id:nn"');
    expect(sql).toContain('"p:min"');
    expect(sql).toContain('"w:max"');
  });

  it('computes the optional statistics only for the rules that read them', () => {
    const { roles: r } = parseRoles('group: g\noutcome: y\nslopes: [s]\nlevel1: [s, x, band]\n', 'roles.yaml', catalogue);
    const types = new Map([
      ['s', 'double'],
      ['x', 'double'],
      ['y', 'double'],
      ['band', 'text'],
    ] as const);
    const sqlFor = (needs: Parameters<typeof planColumns>[4]) =>
      profileQuery('v', 'g', planColumns(['g', 'y', 's', 'x', 'band'], r, new Map(types), {}, needs));
    const all = sqlFor(undefined);
    // the planned slope's pair is the report's; the other level-1 pairs and the count of values
    // written like numbers are within-between-gap's and variable-without-statistics'
    expect(all).toContain('"y:×s:sxy"');
    expect(all).toContain('"y:×x:sxy"');
    expect(all).toContain('"band:like"');
    const none = sqlFor([]);
    expect(none).toContain('"y:×s:sxy"');
    expect(none).not.toContain('"y:×x:sxy"');
    expect(none).not.toContain('"band:like"');
  });

  it('the profile then has no range for the unit ID, and the rest as before', async () => {
    const d = writeDelivery(
      [
        { g: 'A', id: 'u2', p: 'P', w: 'x', y: 1 },
        { g: 'A', id: 'u1', p: 'P', w: 'x', y: 2 },
      ],
      'group: g\n',
    );
    try {
      const { profile } = await profileOf(d.csv, 'group: g\nunit: id\nparent: p\noutcome: y\nlevel2: [w]\n');
      expect(profile.column('id')).toMatchObject({ nonMissing: 2, min: null, max: null });
      expect(profile.column('w')).toMatchObject({ nonMissing: 2, min: 'x', max: 'x' });
    } finally {
      d.remove();
    }
  });
});
