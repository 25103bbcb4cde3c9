import type { Utf8Check } from './utf8-advice.js';

/**
 * What the CSV reader (csv.ts) asks of the delivery's bytes before DuckDB reads it, and the
 * copies it may need: from files on disk in the command line (text-files-node.ts), from the
 * picked file's bytes in the page (engines/wasm/text-files.ts). `file` is what DuckDB reads.
 */
export interface TextFiles {
  /** the lines of the first megabyte (gzip undone) that are not UTF-8 */
  checkUtf8(file: string, gzip: boolean): Utf8Check;
  /** whether the first megabyte ends some lines with CRLF and others with LF */
  mixedLineEnds(file: string, gzip: boolean): boolean;
  /** the first megabyte of the text (gzip undone): the quote check and the header as written read it */
  head(file: string, gzip: boolean): Uint8Array;
  /** a UTF-8 copy of a windows-1252 delivery; `dir` is deleted on close */
  transcodeToUtf8(file: string, gzip: boolean): Promise<{ file: string; dir: string }>;
  /** a copy with every CRLF written as LF; `dir` is deleted on close */
  lfCopy(file: string, gzip: boolean): Promise<{ file: string; dir: string }>;
}
