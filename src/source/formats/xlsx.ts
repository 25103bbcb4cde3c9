import ExcelJS from 'exceljs';
import { InputError } from '../../errors.js';
import type { DuckLayout } from '../engines/duckdb/layout.js';
import type { RejectedLine } from '../types.js';
import type { ReadContext } from './registry.js';
import type { StagedColumn, StagedValue } from './staged.js';
import { Stager, stagedLayout } from './staged.js';

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

/**
 * Excel .xlsx: the first worksheet (or the one named), streamed row by row with exceljs and
 * appended to a staged DuckDB table as text; the first row is the header. A row with values
 * beyond the header's last column is rejected (with its row number, the header being row 1);
 * empty rows are not records.
 */
export async function xlsxLayout({ engine, file, display, roles, missing, options }: ReadContext): Promise<DuckLayout> {
  const { sheet } = options;
  const workbook = new ExcelJS.stream.xlsx.WorkbookReader(file, {
    worksheets: 'emit',
    sharedStrings: 'cache',
    styles: 'cache',
    hyperlinks: 'ignore',
    entries: 'ignore',
  });
  const seen: string[] = [];
  let columns: StagedColumn[] | null = null;
  let stager: Stager | null = null;
  const rejected: RejectedLine[] = [];
  try {
    for await (const ws of workbook) {
      const name = (ws as unknown as { name: string }).name;
      seen.push(name);
      const wanted = sheet === undefined || name === sheet;
      for await (const row of ws) {
        if (!wanted) continue; // drain a sheet that is not read
        const values = (row.values as unknown[]).slice(1).map(cellText);
        while (values.length && (values[values.length - 1] === null || values[values.length - 1] === '')) values.pop();
        if (!values.length) continue;
        if (!columns) {
          columns = values.map((v, i) => ({ name: v === null || v === '' ? `column${i}` : String(v), type: 'VARCHAR' as const }));
          stager = new Stager(engine, columns);
          await stager.open();
          continue;
        }
        if (values.length > columns.length) {
          rejected.push({
            line: row.number,
            kind: 'TOO MANY COLUMNS',
            reason: `Expected Number of Columns: ${columns.length} Found: ${values.length}`,
          });
          continue;
        }
        const out: StagedValue[] = columns.map((_, i) => {
          const v = values[i];
          return v === undefined || v === null ? null : typeof v === 'number' ? String(v) : v;
        });
        stager!.append(out);
      }
      if (wanted) break;
    }
  } catch (e) {
    stager?.close();
    if (e instanceof InputError) throw e;
    throw new InputError(`${display}: cannot read as Excel .xlsx (${(e as Error).message.split('\n')[0]})`);
  }
  stager?.close();
  if (sheet !== undefined && !seen.includes(sheet)) {
    throw new InputError(`${display}: no worksheet named "${sheet}" (sheets: ${seen.join(', ') || 'none'})`);
  }
  if (!columns) throw new InputError(`${display}: the worksheet "${seen[0] ?? sheet ?? ''}" is empty (no header, no records)`);
  return stagedLayout(display, 'xlsx', columns, roles, missing, rejected);
}
