import { DuckDBInstance } from '@duckdb/node-api';
import pg from 'pg';
import { describe, expect, it } from 'vitest';
import { duckdb, postgres } from '../../src/source/dialect.js';

const url = process.env.NESTREADY_PG_URL;

// plain decimals take PostgreSQL's short path (one cast); the rest the guarded one
const TOKENS = [
  '12',
  ' 12 ',
  '-0',
  '+.5',
  '3.',
  '0.000001',
  `0.${'0'.repeat(96)}1`,
  `0.${'0'.repeat(280)}1`,
  '9'.repeat(100),
  '9'.repeat(101),
  '9'.repeat(320),
  '1e100',
  '1e308',
  '1e309',
  '1e-400',
  '2.5E3',
  '1,5',
  'inf',
  'NaN',
  '',
  '.',
  '12 kg',
];

describe.skipIf(!url)('the numeric reading of text in PostgreSQL', () => {
  it('reads every token as DuckDB does', async () => {
    const values = TOKENS.map((t) => `('${t}')`).join(', ');
    const sql = (d: typeof duckdb) => `SELECT ${d.numeric('t')} AS x FROM (VALUES ${values}) AS v(t)`;
    const client = new pg.Client({ connectionString: url });
    await client.connect();
    let inPg: (number | null)[];
    try {
      inPg = (await client.query(sql(postgres))).rows.map((r) => r.x);
    } finally {
      await client.end();
    }
    const instance = await DuckDBInstance.create(':memory:');
    const con = await instance.connect();
    try {
      const rows = (await con.runAndReadAll(sql(duckdb))).getRowObjectsJS() as { x: number | null }[];
      expect(inPg).toEqual(rows.map((r) => r.x));
      expect(inPg.slice(0, 5)).toEqual([12, 12, -0, 0.5, 3]);
      expect(inPg.slice(8, 16)).toEqual([1e100 - 1, null, null, 1e100, null, null, 0, 2500]);
    } finally {
      con.closeSync();
      instance.closeSync();
    }
  });
});
