import { describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { parseRoles } from '../../src/roles/load.js';
import { createLookup } from '../../src/source/lookups/lookup.js';
import { openDelivery } from '../../src/source/open.js';
import type { Row } from '../helpers/delivery.js';
import { writeDelivery } from '../helpers/delivery.js';

// Stage 1 of the unit-ID check groups on a 64-bit hash of the normalised ID. A collision must
// cost only a second look, never a finding: here every key is made to share one hash.
describe('unit IDs grouped by hash', () => {
  const rows: Row[] = [
    { g: 'A', id: 'u1', y: 1 },
    { g: 'A', id: 'u2', y: 2 },
    { g: 'B', id: 'u3', y: 3 },
    { g: 'B', id: 'U3', y: 3 }, // a variant of u3
    { g: 'C', id: '7', y: 4 },
    { g: 'C', id: '7', y: 4 }, // an exact copy
    { g: 'D', id: 'u2', y: 5 }, // u2 again, in another group
  ];

  async function summary(collide: boolean) {
    const d = writeDelivery(rows, { group: 'g', unit: 'id', outcome: 'y' });
    const { roles } = parseRoles('group: g\nunit: id\noutcome: y\n', 'roles.yaml', catalogue);
    const source = await openDelivery(d.csv, roles, { missing: roles.missing, threads: 1 });
    try {
      if (collide) source.dialect = { ...source.dialect, keyHash: () => '0' };
      return await createLookup(source, 'g').unitIds('id');
    } finally {
      await source.close();
      d.remove();
    }
  }

  it('reports the same IDs when every key shares one hash as with the real hash', async () => {
    const real = await summary(false);
    const colliding = await summary(true);
    expect(colliding).toEqual(real);
    expect(real.conflicting.examples.map((x) => x.id)).toEqual(['u2']);
    expect(real.copied.examples.map((x) => x.id)).toEqual(['7']);
    expect(real.mobile.examples.map((x) => x.id)).toEqual(['u2']);
    expect(real.variants.examples.map((v) => v.ids.map((x) => x.id))).toEqual([['U3', 'u3']]);
  });
});
