import type { DuckDBConnection } from '@duckdb/node-api';
import { describe, expect, it } from 'vitest';
import { connectionPool } from '../../src/source/engines/duckdb/pool.js';

// stand-ins: the pool only lends them out and closes them
const fake = (name: string) => {
  const con = {
    name,
    closed: false,
    closeSync: () => {
      con.closed = true;
    },
  };
  return con as unknown as DuckDBConnection & { name: string; closed: boolean };
};

describe('connectionPool', () => {
  it('calls fn in the same turn when a connection is free (a look-up starts before other rules compute)', () => {
    const pool = connectionPool([fake('a')]);
    let called = false;
    void pool.use(async () => {
      called = true;
    });
    expect(called).toBe(true);
  });

  it('lends each connection to one caller at a time; the others wait their turn', async () => {
    const a = fake('a');
    const b = fake('b');
    const pool = connectionPool([a, b]);
    const inUse = new Set<string>();
    let most = 0;
    const order: string[] = [];
    const job = (id: number) =>
      pool.use(async (con) => {
        const name = (con as unknown as { name: string }).name;
        expect(inUse.has(name)).toBe(false);
        inUse.add(name);
        most = Math.max(most, inUse.size);
        await new Promise((r) => setTimeout(r, 5 * (id % 3)));
        inUse.delete(name);
        order.push(`${id}`);
        return id;
      });
    const results = await Promise.all([1, 2, 3, 4, 5, 6].map(job));
    expect(results).toEqual([1, 2, 3, 4, 5, 6]);
    expect(most).toBe(2);
    expect(order).toHaveLength(6);
  });

  it('takes a connection back when fn throws or rejects', async () => {
    const pool = connectionPool([fake('a')]);
    await expect(
      pool.use(() => {
        throw new Error('sync');
      }),
    ).rejects.toThrow('sync');
    await expect(
      pool.use(async () => {
        throw new Error('async');
      }),
    ).rejects.toThrow('async');
    await expect(pool.use(async (con) => (con as unknown as { name: string }).name)).resolves.toBe('a');
  });

  it('close closes every connection', () => {
    const a = fake('a');
    const b = fake('b');
    connectionPool([a, b]).close();
    expect([a.closed, b.closed]).toEqual([true, true]);
  });
});
