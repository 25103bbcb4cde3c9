import { describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { parseRoles } from '../../src/roles/load.js';
import { createLookup } from '../../src/source/lookups/lookup.js';
import { openDelivery } from '../../src/source/open.js';
import type { Row } from '../helpers/delivery.js';
import { auditRows, onlyFinding, writeDelivery } from '../helpers/delivery.js';

// The audit starts the unit-ID check as soon as the profile has read the delivery. When that
// read rejects a line for a value that is not a number (past the type sniff's sample), the
// column is read as text and the pass runs again: a check started on the first reading did not
// see that line and must not be the one the rules get.
describe('the unit-ID check started while the profile is converted', () => {
  // 25,000 records: the sniff's 20,480-row sample sees only numbers in x
  const rows: Row[] = Array.from({ length: 25_000 }, (_, i) => ({ g: `G${i % 50}`, id: `u${i + 1}`, x: i % 7, y: i % 11 }));
  rows[24_000] = { g: 'G0', id: 'u1', x: 'about 3', y: 1 }; // u1 again, on the line the typed read rejects
  const roleMap = { group: 'g', unit: 'id', outcome: 'y', level1: ['x'] };

  it('holds for the view it read: after the view is redefined the check runs again', async () => {
    const d = writeDelivery(rows, roleMap);
    const { roles } = parseRoles('group: g\nunit: id\noutcome: y\nlevel1: [x]\n', 'roles.yaml', catalogue);
    const source = await openDelivery(d.csv, roles, { missing: roles.missing, threads: 1 });
    try {
      const lookup = createLookup(source, 'g');
      const early = lookup.unitIds('id');
      expect(lookup.unitIds('id')).toBe(early); // one check per view
      const first = await early;
      await source.readAsText(['x']);
      const again = lookup.unitIds('id');
      expect(again).not.toBe(early);
      const second = await again;
      // the typed reading skips the line with "about 3" where it reads every column (the copy
      // test); read as text, the line is there
      expect(second.conflicting).toMatchObject({ ids: 1, records: 2 });
      expect(second.conflicting.examples[0]).toMatchObject({ id: 'u1', rows: [1, 24_001] });
      expect(first).not.toEqual(second);
    } finally {
      await source.close();
      d.remove();
    }
  });

  it('gives the rules the check of the final pass', async () => {
    const report = await auditRows(rows, roleMap);
    expect(report.input).toMatchObject({ rows: 25_000, rowsRejected: 0 });
    const dup = onlyFinding(report, 'duplicate-unit-id');
    expect(dup.count).toBe(1);
    expect(dup.rows).toEqual([1, 24_001]);
  });
});
