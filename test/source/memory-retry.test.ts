import { describe, expect, it } from 'vitest';
import { createEngine, readColumns } from '../../src/source/duck.js';

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
