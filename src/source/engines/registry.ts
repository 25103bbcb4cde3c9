import type { Roles } from '../../roles/types.js';
import type { OpenOptions, Source } from '../types.js';
import { duckdbEngine } from './duckdb/index.js';
import { inputKind } from './kinds.js';
import type { DeliveryInput, Engine, InputKind } from './types.js';

/**
 * The engine of each kind of input, the one place an engine is chosen. An engine is loaded
 * only when an input of its kind comes (the PostgreSQL client only for a database source).
 */
const ENGINES: Record<InputKind, () => Promise<Engine>> = {
  file: async () => duckdbEngine,
  stdin: async () => duckdbEngine,
  url: async () => (await import('./postgres/index.js')).postgresEngine,
  database: async () => (await import('./postgres/index.js')).postgresEngine,
};

/** Open a delivery in the engine its kind calls for. */
export async function openSource(input: DeliveryInput, roles: Roles, options: OpenOptions): Promise<Source> {
  return (await ENGINES[inputKind(input)]()).open(input, roles, options);
}
