/**
 * Opt-in timing of engine queries for performance work: with NESTREADY_TRACE=1 each query's wall
 * time and first words (with NESTREADY_TRACE=full: the whole statement) go to standard error
 * (DEVELOPERS.md, "Finding where the time goes").
 * Off by default, and never part of a report.
 */
const mode = typeof process !== 'undefined' ? process.env?.NESTREADY_TRACE : undefined;
const on = mode === '1' || mode === 'full';
const started = on ? performance.now() : 0;

export async function traced<T>(sql: string, run: () => Promise<T>): Promise<T> {
  if (!on) return run();
  const t0 = performance.now();
  try {
    return await run();
  } finally {
    const t1 = performance.now();
    const head = mode === 'full' ? sql : sql.replace(/\s+/g, ' ').slice(0, 160);
    process.stderr.write(`[trace] ${(t0 - started).toFixed(0)}ms +${(t1 - t0).toFixed(0)}ms ${head}\n`);
  }
}
