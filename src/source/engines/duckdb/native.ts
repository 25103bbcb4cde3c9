import { createRequire } from 'node:module';
import type * as DuckDB from '@duckdb/node-api';

// required, not imported: importing this CommonJS package from an ES module makes Node scan its
// sixty files for their export names first, on every run (docs/performance.md)
export const native = createRequire(import.meta.url)('@duckdb/node-api') as typeof DuckDB;
export type { DuckDB };
