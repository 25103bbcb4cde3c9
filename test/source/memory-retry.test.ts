import { describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { parseRoles } from '../../src/roles/load.js';
import { createEngine } from '../../src/source/engines/duckdb/engine.js';
import { manyGroups } from '../../src/source/engines/duckdb/memory.js';
import { readColumns } from '../../src/source/engines/duckdb/stream.js';
import { openDelivery } from '../../src/source/open.js';
import type { Row } from '../helpers/delivery.js';
import { writeDelivery } from '../helpers/delivery.js';

// An aggregate whose size the data decides (here 250,000 groups with text states) does not fit a
// tiny limit; the engine raises the limit fourfold and runs it again rather than failing
describe('memory limit raised for a large aggregate', () => {
  const wide = `SELECT i % 250000 AS g, count(*) AS n, min(i::VARCHAR || 'xxxxxxxxxxxxxxxx') AS lo FROM range(500000) t(i) GROUP BY 1`;

  it('runs the aggregate again with four times the limit, and returns all of it', async () => {
    const engine = await createEngine({ memoryLimit: '8MB', threads: 1 });
    try {
      const result = await readColumns(engine, wide);
      expect(result.g).toHaveLength(250000);
      expect((result.n as number[]).reduce((a, b) => a + Number(b), 0)).toBe(500000);
      expect(engine.memoryBytes).toBe(32e6);
    } finally {
      engine.close();
    }
  });

  it('leaves the limit alone when the query fits', async () => {
    const engine = await createEngine({ memoryLimit: '8MB', threads: 1 });
    try {
      await readColumns(engine, 'SELECT i % 10 AS g, count(*) AS n FROM range(1000) t(i) GROUP BY 1');
      expect(engine.memoryBytes).toBe(8e6);
    } finally {
      engine.close();
    }
  });
});

describe('a delivery whose first records show very many groups', () => {
  it('manyGroups: half of a full sample (20,480 records) in groups of their own, 10,240 groups', () => {
    expect(manyGroups(20480)).toBe(true);
    expect(manyGroups(10240)).toBe(true);
    expect(manyGroups(10239)).toBe(false);
    expect(manyGroups(4900)).toBe(false); // 5,000 groups in random order
    expect(manyGroups(2000)).toBe(false); // a small delivery, every record its own group
    expect(manyGroups(0)).toBe(false);
  });

  async function limitAfterOpen(groupsOf: (i: number) => string): Promise<string> {
    const rows: Row[] = Array.from({ length: 24_000 }, (_, i) => ({ g: groupsOf(i), y: i % 7 }));
    const d = writeDelivery(rows, 'group: g\n');
    const { roles } = parseRoles('group: g\noutcome: y\n', 'roles.yaml', catalogue);
    const source = await openDelivery(d.csv, roles, { missing: roles.missing, memoryLimit: '64MB', threads: 1 });
    try {
      const [{ limit }] = await source.all<{ limit: string }>("SELECT current_setting('memory_limit') AS limit");
      return limit;
    } finally {
      await source.close();
      d.remove();
    }
  }

  it('opens with four times the memory limit; few groups leave it alone', async () => {
    const many = await limitAfterOpen((i) => `G${i}`);
    const few = await limitAfterOpen((i) => `G${i % 50}`);
    const mib = (s: string) => Number(/([\d.]+)\s*MiB/.exec(s)?.[1]);
    expect(mib(few)).toBeCloseTo(64e6 / 2 ** 20, 0); // 61.0 MiB
    expect(mib(many)).toBeCloseTo((4 * 64e6) / 2 ** 20, 0); // 244.1 MiB
  });
});
