/**
 * The part of DuckDB-WASM's asynchronous API the engine uses, so that it can run on the
 * worker-backed AsyncDuckDB in the page and on any other binding that answers the same way.
 * Results are Arrow tables (apache-arrow, as bundled by @duckdb/duckdb-wasm).
 */
export interface WasmDatabase {
  connect(): Promise<WasmConnection>;
  registerFileBuffer(name: string, buffer: Uint8Array): Promise<void>;
  dropFile(name: string): Promise<unknown>;
}

export interface WasmConnection {
  query(sql: string): Promise<ArrowTable>;
  insertArrowFromIPCStream(buffer: Uint8Array, options: { name: string; create?: boolean }): Promise<void>;
  close(): Promise<void>;
}

/** An Arrow table as far as the engine reads it. */
export interface ArrowTable {
  numRows: number;
  schema: { fields: { name: string }[] };
  getChildAt(i: number): ArrowVector | null;
}

export interface ArrowVector {
  length: number;
  nullCount: number;
  type: { typeId: number };
  get(i: number): unknown;
  toArray(): ArrayLike<unknown>;
}
