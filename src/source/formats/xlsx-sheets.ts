import { XMLParser } from 'fast-xml-parser';
import type { Roles } from '../../roles/types.js';
import { readZipEntries } from './zip-entry.js';

/** A worksheet as the workbook names it, and the zip entry that holds it. */
export interface SheetEntry {
  name: string;
  /** e.g. xl/worksheets/sheet1.xml */
  path: string;
}

const WORKBOOK = 'xl/workbook.xml';
const RELS = 'xl/_rels/workbook.xml.rels';

const asList = <T>(v: T | T[] | undefined): T[] => (v === undefined ? [] : Array.isArray(v) ? v : [v]);

/**
 * The worksheets of an .xlsx in the workbook's order, named as xl/workbook.xml names them (a
 * zip's entries may come in any order; writers common in Python put workbook.xml after the
 * sheets). Empty when the workbook cannot be read so (xlsx-book.ts names the sheets by their
 * entries then).
 */
export function workbookSheets(file: string): SheetEntry[] {
  let entries: Map<string, Buffer>;
  try {
    entries = readZipEntries(file, [WORKBOOK, RELS]);
  } catch {
    return [];
  }
  const book = entries.get(WORKBOOK);
  const rels = entries.get(RELS);
  if (!book || !rels) return [];
  // prefixes off (x:sheet, r:id), attributes kept, entities decoded
  const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '', removeNSPrefix: true, parseAttributeValue: false });
  try {
    const targets = new Map<string, string>();
    for (const r of asList(parser.parse(rels.toString('utf8'))?.Relationships?.Relationship)) {
      const target = String(r.Target ?? '');
      targets.set(String(r.Id), target.startsWith('/') ? target.slice(1) : `xl/${target}`);
    }
    const sheets = asList(parser.parse(book.toString('utf8'))?.workbook?.sheets?.sheet);
    return sheets.flatMap((s) => {
      const path = targets.get(String(s.id));
      return path ? [{ name: String(s.name), path }] : [];
    });
  } catch {
    return [];
  }
}

/** Every column the role map names (as the check of the header against the role map lists them). */
export function roleColumns(roles: Roles): string[] {
  const named = [roles.group, roles.unit, roles.parent, ...roles.outcomes, ...roles.level1, ...roles.level2, ...Object.keys(roles.types)];
  return [...new Set(named.filter((c): c is string => c !== undefined))];
}
