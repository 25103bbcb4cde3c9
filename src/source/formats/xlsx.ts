import { InputError } from '../../errors.js';
import type { DuckLayout } from '../engines/duckdb/layout.js';
import type { RejectedLine } from '../types.js';
import type { ReadContext } from './registry.js';
import type { StagedColumn, StagedValue } from './staged.js';
import { Stager, stagedLayout } from './staged.js';
import type { Workbook } from './xlsx-book.js';
import { openWorkbook } from './xlsx-book.js';
import { roleColumns } from './xlsx-sheets.js';

/** A cell's value as the text a CSV export of the sheet would hold (numbers stay numbers). */
export function cellText(v: unknown): string | number | null {
  if (v === null || v === undefined) return null;
  if (typeof v === 'number' || typeof v === 'string') return v;
  if (typeof v === 'boolean') return v ? 'TRUE' : 'FALSE';
  if (v instanceof Date) {
    const iso = v.toISOString();
    return iso.endsWith('T00:00:00.000Z') ? iso.slice(0, 10) : iso.replace('.000Z', 'Z');
  }
  if (typeof v === 'object') {
    const o = v as Record<string, unknown>;
    if (Array.isArray(o.richText)) return (o.richText as { text: string }[]).map((t) => t.text).join('');
    if ('result' in o) return cellText(o.result);
    if ('formula' in o || 'sharedFormula' in o) return null;
    if (typeof o.text === 'string') return o.text;
    if (typeof o.error === 'string') return o.error;
  }
  return String(v);
}

/** One worksheet as the streaming reader met it: its name and header, and whether it was staged. */
interface SheetSeen {
  name: string;
  header: string[] | null;
}

/** The header of a sheet: its first non-empty row, blank cells named by position. */
function headerOf(values: (string | number | null)[]): string[] {
  return values.map((v, i) => (v === null || v === '' ? `column${i}` : String(v)));
}

/**
 * Excel .xlsx: one worksheet, streamed row by row with exceljs and appended to a staged DuckDB
 * table as text; its first non-empty row is the header. The sheet is the one named (`--sheet`),
 * else the first whose header holds every column the role map names (a read-me sheet before the
 * data is passed over), else the sheet whose header holds most of them, so that the check of the
 * header against the role map lists a data sheet's header. Sheet names are the workbook's own
 * (xlsx-sheets.ts). The report's input notes say which sheet was read when it is not the
 * first, and which other sheets have the same header (data possibly split over sheets). A row
 * with values beyond the header's last column is rejected (with its row number, the header being
 * row 1); empty rows are not records.
 */
export async function xlsxLayout(ctx: ReadContext): Promise<DuckLayout> {
  const { display, roles, options } = ctx;
  const book = await openBook(ctx);
  const named = book.sheets;
  const wanted = roleColumns(roles);
  const holds = (header: readonly string[]) => wanted.filter((c) => header.includes(c)).length;
  let pick: (name: string, header: string[]) => boolean =
    options.sheet !== undefined ? (name) => name === options.sheet : (_, header) => holds(header) === wanted.length;
  let read = await readSheet(ctx, book, pick);
  const order = named.map((s) => s.name);
  if (options.sheet !== undefined && !read.chosen) {
    throw new InputError(`${display}: no worksheet named "${options.sheet}" (sheets: ${order.join(', ') || 'none'})`);
  }
  if (!read.chosen) {
    // no sheet holds the role map's columns: the one nearest to it, for the header check's message
    const candidates = read.seen.filter((s) => s.header);
    if (!candidates.length) throw new InputError(`${display}: the workbook's sheets are empty (no header, no records)`);
    const rank = (s: SheetSeen) => order.indexOf(s.name);
    const nearest = candidates.reduce((a, b) =>
      holds(b.header ?? []) > holds(a.header ?? []) || (holds(b.header ?? []) === holds(a.header ?? []) && rank(b) < rank(a)) ? b : a,
    );
    pick = (name) => name === nearest.name;
    read = await readSheet(ctx, book, pick);
  }
  const chosen = read.chosen as SheetSeen & { header: string[] };
  const notes: string[] = [];
  if (options.sheet === undefined && order.length > 1 && chosen.name !== order[0]) {
    notes.push(`sheet "${chosen.name}" read: the first whose header holds the role map's columns (sheets: ${order.join(', ')})`);
  }
  const same = read.seen.filter((s) => s !== chosen && s.header && s.header.join('\u0000') === chosen.header.join('\u0000'));
  if (same.length) {
    notes.push(
      `sheet(s) ${same.map((s) => `"${s.name}"`).join(', ')} have the same header as "${chosen.name}": the data may be split ` +
        `over sheets, and only "${chosen.name}" was read (--sheet NAME reads another)`,
    );
  }
  if (!read.columns) throw new InputError(`${display}: the worksheet "${chosen.name}" is empty (no header, no records)`);
  const layout = stagedLayout(display, 'xlsx', read.columns, roles, ctx.missing, read.rejected);
  return notes.length ? { ...layout, notes } : layout;
}

/** The workbook, or an input error naming the file when it cannot be opened as one. */
async function openBook({ file, display }: ReadContext): Promise<Workbook> {
  const book = await openWorkbook(file).catch((e: Error) => {
    throw new InputError(`${display}: cannot read as Excel .xlsx (${e.message.split('\n')[0]})`);
  });
  if (!book) throw new InputError(`${display}: cannot read as Excel .xlsx (not a zip archive, or one cut short)`);
  return book;
}

/**
 * Read each sheet's header (its first non-empty row) in the workbook's order and stage the rows
 * of the first sheet `pick` takes; a sheet not taken is left after its header.
 */
async function readSheet(
  { engine, display }: ReadContext,
  book: Workbook,
  pick: (name: string, header: string[]) => boolean,
): Promise<{ seen: SheetSeen[]; chosen: SheetSeen | null; columns: StagedColumn[] | null; rejected: RejectedLine[] }> {
  const seen: SheetSeen[] = [];
  let chosen: SheetSeen | null = null;
  let target: SheetTable | null = null;
  try {
    for (const entry of book.sheets) {
      const sheet: SheetSeen = { name: entry.name, header: null };
      seen.push(sheet);
      for await (const row of book.rows(entry)) {
        const values = rowValues(row.values as unknown[]);
        if (!values.length) continue;
        if (sheet.header) {
          target?.add(values, row.number);
          continue;
        }
        sheet.header = headerOf(values);
        if (chosen || !pick(sheet.name, sheet.header)) break;
        chosen = sheet;
        target = new SheetTable(engine, sheet.header, display);
        await target.stager.open();
      }
    }
  } catch (e) {
    target?.stager.close();
    if (e instanceof InputError) throw e;
    throw new InputError(`${display}: cannot read as Excel .xlsx (${(e as Error).message.split('\n')[0]})`);
  }
  target?.stager.close();
  return { seen, chosen, columns: target?.columns ?? null, rejected: target?.rejected ?? [] };
}

/** A row's cells as text or numbers, without the empty cells after its last value. */
function rowValues(cells: unknown[]): (string | number | null)[] {
  const values = cells.slice(1).map(cellText);
  while (values.length && (values[values.length - 1] === null || values[values.length - 1] === '')) values.pop();
  return values;
}

/** The staged table of the sheet read: its columns, and the rows that have more cells than the header. */
class SheetTable {
  readonly columns: StagedColumn[];
  readonly stager: Stager;
  readonly rejected: RejectedLine[] = [];
  constructor(engine: ReadContext['engine'], header: readonly string[], display: string) {
    this.columns = uniqueNames(header).map((name) => ({ name, type: 'VARCHAR' as const }));
    this.stager = new Stager(engine, this.columns, display);
  }

  add(values: readonly (string | number | null)[], line: number): void {
    const n = this.columns.length;
    if (values.length > n) {
      this.rejected.push({ line, kind: 'TOO MANY COLUMNS', reason: `Expected Number of Columns: ${n} Found: ${values.length}` });
      return;
    }
    const out: StagedValue[] = this.columns.map((_, i) => {
      const v = values[i];
      return v === undefined || v === null ? null : typeof v === 'number' ? String(v) : v;
    });
    this.stager.append(out);
  }
}

/** Header names made unique (a second "note" becomes "note_2"), as a table needs them. */
function uniqueNames(header: readonly string[]): string[] {
  const used = new Set<string>();
  return header.map((h) => {
    let name = h;
    for (let k = 2; used.has(name.toLowerCase()); k++) name = `${h}_${k}`;
    used.add(name.toLowerCase());
    return name;
  });
}
