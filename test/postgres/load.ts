import { readFileSync } from 'node:fs';
import { parse } from 'csv-parse/sync';
import pg from 'pg';

/** Column types for the typed copy of the demo delivery (numbers where every value is one). */
export const TYPED: Record<string, string> = {
  fixed: 'integer',
  item_age_years: 'double precision',
  helpers: 'integer',
  benches: 'integer',
  opened_year: 'integer',
};

/**
 * Load a CSV into a fresh table, in file order (so physical order = record order): every column
 * as text as delivered, or with `types` for some columns (blank fields become NULL there).
 */
export async function loadCsv(url: string, csv: string, table: string, types: Record<string, string> = {}): Promise<void> {
  const records = parse(readFileSync(csv), { bom: true }) as string[][];
  const [header, ...rows] = records;
  const q = (s: string) => `"${s.replace(/"/g, '""')}"`;
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    await client.query(`DROP TABLE IF EXISTS ${q(table)}`);
    await client.query(`CREATE TABLE ${q(table)} (${header.map((h) => `${q(h)} ${types[h] ?? 'text'}`).join(', ')})`);
    const batch = 500;
    for (let i = 0; i < rows.length; i += batch) {
      const chunk = rows.slice(i, i + batch);
      const params: (string | null)[] = [];
      const tuples = chunk.map((r) => {
        const cells = header.map((h, j) => {
          params.push(types[h] && r[j] === '' ? null : r[j]);
          return `$${params.length}${types[h] ? `::${types[h]}` : ''}`;
        });
        return `(${cells.join(', ')})`;
      });
      await client.query(`INSERT INTO ${q(table)} VALUES ${tuples.join(', ')}`, params);
    }
  } finally {
    await client.end();
  }
}

/** Drop the tables a test file loaded (after its tests, whatever they did). */
export async function dropTables(url: string, tables: readonly string[]): Promise<void> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    await client.query(`DROP TABLE IF EXISTS ${tables.map((t) => `"${t.replace(/"/g, '""')}"`).join(', ')}`);
  } finally {
    await client.end();
  }
}
