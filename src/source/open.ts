// The one door to a delivery: the engine registry opens it; the profile, the look-ups and the
// problem rows read it through Source, whatever the engine.

export { openDelivery } from './engines/duckdb/open.js';
export { databaseInput, inputKind, inputLabel, isFileInput } from './engines/kinds.js';
export type { PostgresInput } from './engines/postgres/input.js';
export { openSource } from './engines/registry.js';
export type { DeliveryInput, Engine, InputKind } from './engines/types.js';
export type { Encoding, InputFormat, OpenOptions, RejectedLine, Session, Source, SourceFormat } from './types.js';
export { ENCODINGS, INPUT_FORMATS, STDIN } from './types.js';
