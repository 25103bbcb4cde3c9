import { AsyncDuckDB, VoidLogger } from '@duckdb/duckdb-wasm';
import type { ArrowTable, WasmDatabase } from '../source/engines/wasm/types.js';

/** The DuckDB-WASM files beside index.html (copied by scripts/page-build.js): same origin, no CDN. */
export const WASM_FILES = { worker: 'duckdb-browser-eh.worker.js', module: 'duckdb-eh.wasm' } as const;

/**
 * Start DuckDB-WASM in a worker from the page's own folder. Extensions are never installed or
 * loaded: that would fetch them from elsewhere.
 */
export async function startDatabase(base: URL): Promise<WasmDatabase> {
  const worker = new Worker(new URL(WASM_FILES.worker, base));
  const db = new AsyncDuckDB(new VoidLogger(), worker);
  await db.instantiate(new URL(WASM_FILES.module, base).href);
  await db.open({ query: { castDecimalToDouble: true } });
  const setup = await db.connect();
  await setup.query('SET autoinstall_known_extensions = false');
  await setup.query('SET autoload_known_extensions = false');
  await setup.close();
  return {
    connect: async () => {
      const c = await db.connect();
      return {
        // the engine reads Arrow results through the few members ArrowTable names
        query: async (sql) => (await c.query(sql)) as unknown as ArrowTable,
        insertArrowFromIPCStream: (buffer, options) => c.insertArrowFromIPCStream(buffer, options),
        close: () => c.close(),
      };
    },
    registerFileBuffer: (name, buffer) => db.registerFileBuffer(name, buffer),
    dropFile: (name) => db.dropFile(name),
  };
}
