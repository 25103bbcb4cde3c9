import type { Storage } from '../../sql.js';
import type { RejectedLine, SourceFormat, ValueReading } from '../../types.js';

/** How a DuckDB-read delivery is laid out before the shared views are put on it. */
export interface DuckLayout {
  path: string;
  format: SourceFormat;
  header: string[];
  storage: Map<string, Storage>;
  /**
   * The relation with missing tokens already NULL and each column read per `storage`.
   * `rowid`: the relation has a `__rec` column (a staged table's rowid + 1); else numbered by a window.
   */
  relation(storage: Map<string, Storage>): string;
  numbering: 'window' | 'rowid';
  /** a relation to sample the first rows from, when not nr_delivery */
  sample?(): string;
  /** a typed reader (CSV) converts while reading and rejects lines; other sources are probed */
  typedReader: boolean;
  /** how the reader read values where the file's writing asked for it (decimal commas) */
  reading?: ValueReading;
  rejects(): Promise<RejectedLine[]>;
  /** what the report's input section should say about the reading (which Excel sheet was read, …) */
  notes?: string[];
  /**
   * Lines of invalid UTF-8 seen before any scan (CSV: in the first megabyte): the views read every
   * column from the start, not only once the rejects are read (views.ts says why)
   */
  invalidUtf8?: boolean;
  /** before the views are redefined with columns read as text (CSV: start the rejects log afresh) */
  beforeRetype?(): Promise<void>;
}
