import type { Roles } from '../../roles/types.js';
import type { OpenOptions, Source } from '../types.js';
import type { PostgresInput } from './postgres/input.js';

/** A delivery: a file path (`-` for standard input), a database URL, or a table or query in a database. */
export type DeliveryInput = string | PostgresInput;

/** What kind of thing a delivery input is; the engine registry is keyed by it. */
export type InputKind = 'file' | 'stdin' | 'url' | 'database';

/**
 * An engine: one folder under engines/ that opens deliveries of some kinds as a Source (the
 * views, the dialect, the full reads and the look-ups' queries). The registry picks it.
 */
export interface Engine {
  name: string;
  open(input: DeliveryInput, roles: Roles, options: OpenOptions): Promise<Source>;
}
