import type { Dialect } from './dialect.js';
import type { InputFormat } from './formats/registry.js';
import type { Storage } from './sql.js';

export type { InputFormat } from './formats/registry.js';
export { INPUT_FORMATS } from './formats/registry.js';

/** A line of the delivery that could not be read as a record. */
export interface RejectedLine {
  line: number;
  reason: string;
  /** the column a value failed to convert in (CAST errors only) */
  column?: string;
  kind: string;
}

/** `-` as the delivery: read stdin (spooled to a temp file first, deleted afterwards). */
export const STDIN = '-';

/** Delivery formats read from files (or stdin, see formats/registry.ts); `postgres` is a table or query in a database. */
export type SourceFormat = InputFormat | 'postgres';

/** Text encodings of a CSV/TSV delivery; cp1252 is another name of windows-1252, which latin1 is read as too. */
export const ENCODINGS = ['utf-8', 'latin1', 'windows-1252', 'cp1252'] as const;

/** Two words of a binary variable read as 1 and 0, as compared (lower case, trimmed), and as written. */
export interface BinaryWords {
  one: string;
  zero: string;
  /** the forms the first records write them in, when each is written one way */
  written?: { one: string; zero: string };
}

/** How values were read where the delivery's own writing asked for it: the report states it. */
export interface ValueReading {
  /** numbers were read with a decimal comma (12,5 is twelve and a half) */
  decimalComma?: boolean;
  /** per column: which word was read as 1 and which as 0 */
  binary?: Record<string, BinaryWords>;
}
export type Encoding = (typeof ENCODINGS)[number];

/**
 * An opened delivery: the relations the profile and rules read, in one SQL dialect. The
 * profile is the only full pass; rules run bounded look-ups through `all`.
 */
export interface Source {
  /** what the report names as the input (a file path, "-" for stdin, or a database relation) */
  path: string;
  format: SourceFormat;
  /** what the report's input section says about the reading (e.g. which Excel sheet was read) */
  notes?: readonly string[];
  dialect: Dialect;
  header: string[];
  /** how each column is read: text, or double where every value is a number */
  storage: Map<string, Storage>;
  /**
   * Columns read as text whose values all looked like numbers in a sample: the profile computes
   * their numeric reading too and settles them as double when every value is one (sources
   * without a typed reader: Parquet/JSON/Excel text columns, PostgreSQL text columns).
   */
  probe: Set<string>;
  /** text columns of undeclared type whose sample held no number at all: no numeric reading */
  textOnly: Set<string>;
  /** the delivery with missing tokens read as NULL (a relation name or a parenthesised query) */
  view: string;
  /** the same with `__rec`, the 1-based record number (header and rejected lines not counted) */
  numbered: string;
  /** run a query and return plain JS rows (look-ups may run several at once) */
  all<T = Record<string, unknown>>(sql: string): Promise<T[]>;
  /**
   * Run a full read and return its result by column (the profile's group table): on the one
   * connection whose log of unreadable lines `rejects()` reads. `onScanned` is called (where the
   * source can tell) once the delivery has been read and the result is being fetched.
   */
  columns(sql: string, options?: { onScanned?: () => void }): Promise<Record<string, unknown[]>>;
  /**
   * Counts the redefinitions of `view` (a column read as text after a value in it was not a
   * number, …): a look-up's result holds for the version it read. `onScanned` of `columns` may be
   * called while a later redefinition is still to come.
   */
  readonly viewVersion: number;
  /** run `fn` on one session of its own: the temp tables it makes are its own and stay until it drops them */
  session<T>(fn: (session: Session) => Promise<T>): Promise<T>;
  /** how values were read where the delivery's writing asked for it (decimal commas, words as 0/1) */
  reading?: ValueReading;
  /** rejected lines of the latest full read */
  rejects(): Promise<RejectedLine[]>;
  /** read these columns as text from now on (a value in them was not a number) */
  readAsText(columns: readonly string[]): Promise<void>;
  /** read these (probe) columns as double from now on: the profile found only numbers in them */
  readAsDouble(columns: readonly string[]): Promise<void>;
  /** release the engine and delete any temp file (a spooled stdin, a staged table) */
  close(): void | Promise<void>;
}

/** One connection's worth of queries: what a look-up that builds temp tables needs. */
export interface Session {
  all<T = Record<string, unknown>>(sql: string): Promise<T[]>;
  /** Run a statement (where the engine has a memory limit, it is raised for one that needs more). */
  run(sql: string): Promise<void>;
}

export interface OpenOptions {
  missing: readonly string[];
  /** DuckDB memory limit, e.g. "512MB"; DuckDB spills to disk beyond it */
  memoryLimit?: string;
  threads?: number;
  /** the format, when not detected from the name and content */
  format?: InputFormat;
  /** text encoding of CSV/TSV (default UTF-8, with or without a byte-order mark; see ENCODINGS) */
  encoding?: Encoding;
  /** Excel: the worksheet to read (default the first) */
  sheet?: string;
  /** what the report calls the input (default the path) */
  displayPath?: string;
  /** CSV/TSV: read numbers with a decimal comma (default: when the first records leave no doubt) */
  decimalComma?: boolean;
}
