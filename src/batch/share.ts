/** DuckDB threads a single audit runs with (the engine's default): a batch gives an audit no more. */
const SINGLE_AUDIT_THREADS = 2;

/**
 * What each of `atOnce` audits running side by side gets of the machine: an equal share of the
 * cores as DuckDB threads (at least one, at most what a single audit uses), and an equal share
 * of `--memory-limit`, which in a batch bounds the audits running at once together. Each
 * audit's memory policy still raises its share to what its delivery needs
 * (src/source/engines/duckdb/memory.ts), as it raises a single audit's limit.
 *
 * @param memoryLimit a size as `--memory-limit` accepts it ("100MB", "1.5GiB")
 * @param maxThreads at most this many threads an audit (1 for `--repeatable`)
 */
export function engineShare(
  atOnce: number,
  cores: number,
  memoryLimit: string,
  maxThreads = SINGLE_AUDIT_THREADS,
): { threads: number; memoryLimit: string } {
  const threads = Math.max(1, Math.min(maxThreads, Math.floor(cores / atOnce)));
  const m = /^\s*(\d+(?:\.\d*)?|\.\d+)\s*([a-z]+)\s*$/i.exec(memoryLimit);
  if (!m || atOnce <= 1) return { threads, memoryLimit };
  return { threads, memoryLimit: `${Number((Number(m[1]) / atOnce).toPrecision(6))}${m[2]}` };
}

/** Run `work` over `items` with at most `limit` at once; results in the items' order. */
export async function inPool<T, R>(items: readonly T[], limit: number, work: (item: T) => Promise<R>): Promise<R[]> {
  const results: R[] = new Array(items.length);
  let next = 0;
  const worker = async () => {
    while (next < items.length) {
      const i = next++;
      results[i] = await work(items[i]);
    }
  };
  await Promise.all(Array.from({ length: Math.max(1, Math.min(limit, items.length)) }, worker));
  return results;
}
