import type { Readable } from 'node:stream';
import ExcelJS from 'exceljs';
import type { SheetEntry } from './xlsx-sheets.js';
import { workbookSheets } from './xlsx-sheets.js';
import type { ZipEntry } from './zip-entry.js';
import { zipDirectory, zipEntryStream } from './zip-entry.js';

/** A worksheet row as exceljs gives it: `values[1]` is column A. */
export interface SheetRow {
  number: number;
  values: unknown;
}

/** An opened workbook: its sheets in the workbook's order, and the rows of each, streamed. */
export interface Workbook {
  sheets: SheetEntry[];
  rows(sheet: SheetEntry): AsyncGenerator<SheetRow>;
}

/**
 * The parts of exceljs's streaming reader that parse one zip entry each. Its own walk over the
 * zip is not used: that walk (unzipper's Parse) reports the end of the archive when the file has
 * been read, not when its entries have been handed over, so now and then the last entries
 * (workbook.xml, the shared strings) were never parsed ("reading 'sheets'") and the worksheets it
 * had spooled to temp files stayed behind.
 */
interface EntryParsers {
  properties?: unknown;
  _parseRels(entry: Readable): Promise<void>;
  _parseWorkbook(entry: Readable): Promise<void>;
  _parseSharedStrings(entry: Readable): AsyncGenerator<unknown>;
  _parseStyles(entry: Readable): Promise<void>;
  _parseWorksheet(entry: Readable, sheetNo: string): Generator<{ value: AsyncIterable<SheetRow> }>;
}

/** The worksheet entries of a workbook without a readable workbook.xml: named as exceljs names them. */
function sheetsByEntry(entries: readonly ZipEntry[]): SheetEntry[] {
  return entries.flatMap((e) => {
    const n = /^xl\/worksheets\/sheet(\d+)\.xml$/.exec(e.name)?.[1];
    return n ? [{ name: `Sheet${n}`, path: e.name }] : [];
  });
}

/**
 * Open an .xlsx through its zip's central directory: the relationships, workbook, shared strings
 * and styles are parsed first, whatever order the writer put them in, and each worksheet is
 * inflated straight from the file when its rows are asked for, so no sheet is spooled to a temp
 * file. Null when the file is not a zip with a central directory.
 */
export async function openWorkbook(file: string): Promise<Workbook | null> {
  const entries = zipDirectory(file);
  if (!entries) return null;
  const byName = new Map(entries.filter((e) => e.method === 0 || e.method === 8).map((e) => [e.name, e]));
  const reader = new ExcelJS.stream.xlsx.WorkbookReader(file, {
    worksheets: 'emit',
    sharedStrings: 'cache',
    styles: 'cache',
    hyperlinks: 'ignore',
  }) as unknown as EntryParsers;
  const parse = async (name: string, run: (s: Readable) => Promise<void>) => {
    const e = byName.get(name);
    if (e) await run(zipEntryStream(file, e));
  };
  await parse('xl/_rels/workbook.xml.rels', (s) => reader._parseRels(s));
  await parse('xl/workbook.xml', (s) => reader._parseWorkbook(s));
  await parse('xl/sharedStrings.xml', async (s) => {
    for await (const _ of reader._parseSharedStrings(s)); // cached on the reader, nothing yielded
  });
  await parse('xl/styles.xml', (s) => reader._parseStyles(s));
  // dates read the 1900/1904 setting from here; a workbook without workbook.xml has none
  reader.properties ??= { model: {} };
  const named = workbookSheets(file);
  return {
    sheets: named.length ? named : sheetsByEntry(entries),
    async *rows(sheet: SheetEntry): AsyncGenerator<SheetRow> {
      const e = byName.get(sheet.path);
      if (!e) return;
      const stream = zipEntryStream(file, e);
      try {
        const sheetNo = /sheet(\d+)\.xml$/.exec(sheet.path)?.[1] ?? '0';
        for (const { value } of reader._parseWorksheet(stream, sheetNo)) yield* value;
      } finally {
        // a sheet left after its header: stop inflating it
        stream.destroy();
      }
    },
  };
}
