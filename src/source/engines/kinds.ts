import { InputError } from '../../errors.js';
import { STDIN } from '../types.js';
import type { PostgresInput } from './postgres/input.js';
import { isPostgresInput, isPostgresUrl, postgresLabel } from './postgres/input.js';
import type { DeliveryInput, InputKind } from './types.js';

// Telling inputs apart needs no engine: the CLI asks here before any engine is loaded.

/** The kind of a delivery input: what the engine registry is keyed by. */
export function inputKind(input: DeliveryInput): InputKind {
  if (isPostgresInput(input)) return 'database';
  if (input === STDIN) return 'stdin';
  return isPostgresUrl(input) ? 'url' : 'file';
}

/** What messages call an input before it is opened: the path ("-" for stdin), or the database relation. */
export function inputLabel(input: DeliveryInput): string {
  return isPostgresInput(input) ? postgresLabel(input) : input;
}

/** Whether the input is read from a file (or stdin) rather than from where it lives in a database. */
export function isFileInput(input: DeliveryInput): input is string {
  const kind = inputKind(input);
  return kind === 'file' || kind === 'stdin';
}

/**
 * The input a database URL and a table or query name (`--source`, `--table`, `--query`).
 *
 * @throws InputError when the URL is no engine's
 */
export function databaseInput(url: string, relation: { table?: string; query?: string }): PostgresInput {
  if (inputKind(url) !== 'url') throw new InputError('--source: expected a postgres:// URL');
  return {
    url,
    ...(relation.table !== undefined && { table: relation.table }),
    ...(relation.query !== undefined && { query: relation.query }),
  };
}
