import { describe, expect, it } from 'vitest';
import { createEngine } from '../../src/source/engines/duckdb/engine.js';
import { estimateGroups, MEMORY_CAP, neededBytes, scanBytes, startLimit, withMemory } from '../../src/source/engines/duckdb/memory.js';
import { readColumns } from '../../src/source/engines/duckdb/stream.js';

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

describe('the retry is a last resort for every query', () => {
  const oom = () => new Error('Out of Memory Error: failed to allocate data of size 32.0 MiB (70.4 MiB/95.3 MiB used)');

  it('look-ups that run out of memory at once raise the limit once, then succeed', async () => {
    const engine = await createEngine({ memoryLimit: '8MB', threads: 1 });
    try {
      // three queries that each fail until they run at a higher limit than the one they started at
      const failsOnce = () => {
        let tried = false;
        return () => {
          if (tried) return Promise.resolve(engine.memoryBytes);
          tried = true;
          return Promise.reject(oom());
        };
      };
      const got = await Promise.all([failsOnce(), failsOnce(), failsOnce()].map((q) => withMemory(engine, q)));
      expect(got).toEqual([32e6, 32e6, 32e6]);
      const [{ limit }] = await engine.all<{ limit: string }>("SELECT current_setting('memory_limit') AS limit");
      expect(limit).toBe('31.0 MiB'); // 32e6 bytes rounded up to whole MiB
    } finally {
      engine.close();
    }
  });

  it('gives up with the out-of-memory error at the cap', async () => {
    const engine = await createEngine({ memoryLimit: `${MEMORY_CAP}b`, threads: 1 });
    try {
      let attempts = 0;
      const query = () => {
        attempts++;
        return Promise.reject(oom());
      };
      await expect(withMemory(engine, query)).rejects.toThrow(/Out of Memory/);
      expect(attempts).toBe(1);
      expect(engine.memoryBytes).toBe(MEMORY_CAP);
    } finally {
      engine.close();
    }
  });

  it('passes other errors on at once', async () => {
    const engine = await createEngine({ memoryLimit: '8MB', threads: 1 });
    try {
      await expect(engine.all('SELECT * FROM no_such_table')).rejects.toThrow(/no_such_table/);
      expect(engine.memoryBytes).toBe(8e6);
    } finally {
      engine.close();
    }
  });
});

describe('the memory policy: the limit follows from the sizes the delivery needs', () => {
  const MiB = 2 ** 20;
  const csv = { format: 'csv' as const, threads: 2, scans: 3, aggregates: 42 };

  it('a CSV of 5,000 or 20,000 groups needs far less than 100MB: the limit stays', () => {
    // measured (docs/performance.md): the synthetic delivery's profile (42 aggregates) ran in
    // 29 MiB at 5,000 groups and 47 MiB at 20,000 groups (10M rows)
    expect(neededBytes({ ...csv, groups: 5_000 }) / MiB).toBeCloseTo(8 + 3 * 16 + 5.2, 0);
    expect(startLimit(100e6, { ...csv, groups: 5_000 })).toBe(100e6);
    expect(startLimit(100e6, { ...csv, groups: 20_000 })).toBe(100e6);
  });

  it('about 95,000 groups need more than 100MB: the limit starts at the need', () => {
    // measured: 94,590 groups needed 121 MiB for the profile alone
    const limit = startLimit(100e6, { ...csv, groups: 95_000 });
    expect(limit / MiB).toBeCloseTo(8 + 48 + (95_000 * 2 * (32 + 12 * 42)) / MiB, 0);
    expect(limit / MiB).toBeGreaterThan(121 + 2 * 16);
  });

  it('the need stops growing with the groups where DuckDB spills', () => {
    expect(startLimit(100e6, { ...csv, groups: 1e6 })).toBe(startLimit(100e6, { ...csv, groups: 240_000 }));
    // measured: 486,853 groups needed 233 MiB for the profile alone
    expect(startLimit(100e6, { ...csv, groups: 1e6 }) / MiB).toBeGreaterThan(233 + 2 * 16);
  });

  it("JSON readers' buffers: 32 MiB each, one per thread for NDJSON, whatever the file's size", () => {
    expect(scanBytes('ndjson', 2) / MiB).toBe(68);
    expect(scanBytes('json', 2) / MiB).toBe(36);
    expect(scanBytes('csv', 2) / MiB).toBe(16);
    // three NDJSON scans at once (the profile's and two look-ups') need more than 100MB
    expect(startLimit(100e6, { ...csv, format: 'ndjson', groups: 1 }) / MiB).toBeCloseTo(8 + 3 * 68, 0);
  });

  it("keeps a user's higher limit, and never starts above the cap", () => {
    expect(startLimit(2e9, { ...csv, groups: 95_000 })).toBe(2e9);
    expect(startLimit(100e6, { ...csv, threads: 64, format: 'ndjson', groups: 1e6 })).toBe(MEMORY_CAP);
  });

  it("the groups: exact from a sample that is the whole delivery, else twice Chao's lower bound", () => {
    expect(estimateGroups({ records: 3_201, groups: 550, seenOnce: 10, seenTwice: 20 })).toBe(550);
    // the first 20,480 records of the bench's 10M x 20,000 delivery: 19,972 groups in truth
    expect(estimateGroups({ records: 20_480, groups: 9_939, seenOnce: 5_272, seenTwice: 2_306 })).toBe(2 * 15_962);
    // of its 1M x 100k delivery: 94,590 groups in truth
    expect(estimateGroups({ records: 20_480, groups: 16_389, seenOnce: 13_363, seenTwice: 2_317 })).toBe(2 * 54_904);
    // sorted by group: 100 groups of 204 or 205 records seen, none once or twice
    expect(estimateGroups({ records: 20_480, groups: 100, seenOnce: 0, seenTwice: 0 })).toBe(200);
  });
});
