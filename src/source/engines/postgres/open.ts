import pg from 'pg';
import { InputError } from '../../../errors.js';
import type { Roles } from '../../../roles/types.js';
import { postgres } from '../../dialect.js';
import { readingList, readingStorage } from '../../plan/reading.js';
import { sampleHints } from '../../plan/sample-hints.js';
import { ident, literal } from '../../sql.js';
import type { BinaryWords, OpenOptions, RejectedLine, Source } from '../../types.js';
import type { PostgresInput } from './input.js';
import { postgresLabel, redactUrl } from './input.js';

/** float4/8, int2/4/8, numeric: read as double precision */
const NUMERIC_OIDS = new Set([20, 21, 23, 700, 701, 1700]);

/** A schema-qualified name, each part quoted (a part already in double quotes is kept as written). */
function qualified(name: string): string {
  const parts = name.match(/"(?:[^"]|"")*"|[^.]+/g) ?? [name];
  return parts.map((p) => (p.startsWith('"') ? p : ident(p))).join('.');
}

/**
 * Open a table or query in PostgreSQL as a Source: the same profiling SQL and look-ups run there
 * (PostgreSQL dialect), so only group-level aggregates and the bounded examples leave the
 * database. Missing tokens and the reading of each column are applied in two session-local temp
 * views (nr_delivery, nr_numbered), dropped with the session; nothing in the database is changed.
 *
 * Record numbers: a table's rows are numbered in physical order (ctid), which for a table loaded
 * in one go is the order of the loaded file; a query's rows in the order it returns them (give
 * it an ORDER BY).
 */
export async function openPostgres(input: PostgresInput, roles: Roles, options: OpenOptions): Promise<Source> {
  if (!input.table === !input.query) throw new InputError('--source postgres: give exactly one of --table or --query');
  const display = postgresLabel(input);
  const client = new pg.Client({ connectionString: input.url, application_name: 'nestready' });
  try {
    await client.connect();
  } catch (e) {
    throw new InputError(`${redactUrl(input.url)}: cannot connect (${(e as Error).message.split('\n')[0]})`);
  }
  let closed = false;
  const close = async () => {
    if (closed) return;
    closed = true;
    await client.end().catch(() => undefined);
  };
  // one client runs one query at a time: the rules' look-ups, asked for at once, wait their turn
  // here rather than in the client's own queue (which pg has deprecated, with a warning on stderr)
  let turn: Promise<unknown> = Promise.resolve();
  const queued = <R>(fn: () => Promise<R>): Promise<R> => {
    const run = turn.then(fn);
    turn = run.catch(() => undefined);
    return run;
  };
  const query = (sql: string) => queued(() => client.query(sql));
  const all = async <T>(sql: string) => (await query(sql)).rows as T[];
  try {
    // for this session only: compiling the profile's hundreds of expressions (in every parallel
    // worker) cost more than the one scan it would speed up (docs/performance.md)
    await query('SET jit = off');
    // one engine thread asked for (--repeatable): no parallel workers, so that every group's sums
    // are added in one order and reruns give the same digits
    if (options.threads === 1) await query('SET max_parallel_workers_per_gather = 0');
    const base = input.table ? qualified(input.table) : `(${input.query}) AS nr_base`;
    let byCtid = false;
    if (input.table) {
      const [kind] = await all<{ relkind: string | null }>(
        `SELECT relkind FROM pg_class WHERE oid = to_regclass(${literal(qualified(input.table))})`,
      );
      if (!kind?.relkind) throw new InputError(`${display}: no such table or view`);
      byCtid = kind.relkind === 'r' || kind.relkind === 'm';
    }
    const probe = await query(`SELECT * FROM ${base} LIMIT 0`);
    const fields = probe.fields.map((f) => ({ name: f.name, number: NUMERIC_OIDS.has(f.dataTypeID), text: false }));
    const header = fields.map((f) => f.name);
    const ids = new Set([roles.group, roles.unit, roles.parent]);
    const storage = readingStorage(fields, roles);
    const missing = [...new Set(['', ...options.missing])];
    // no `* REPLACE` in PostgreSQL: the group ID's blank-looking values are made NULL in the list itself
    let words = new Map<string, BinaryWords>();
    const select = () => readingList(fields, storage, missing, postgres, roles.group, words);
    let viewVersion = 0;
    const define = async () => {
      viewVersion++;
      const list = select();
      // a view's column types cannot change in place (a probed column settled as numbers)
      await query('DROP VIEW IF EXISTS pg_temp.nr_delivery, pg_temp.nr_numbered');
      await query(`CREATE TEMP VIEW nr_delivery AS SELECT ${list} FROM ${base}`);
      await query(
        `CREATE TEMP VIEW nr_numbered AS SELECT row_number() OVER (${byCtid ? 'ORDER BY ctid' : ''}) AS __rec, ${list} FROM ${base}`,
      );
    };
    await define();
    const hints = await sampleHints(all, 'nr_delivery', header, storage, roles, ids, true, postgres);
    if (hints.binaryWords.size) {
      words = hints.binaryWords;
      await define();
    }

    return {
      path: display,
      format: 'postgres',
      dialect: postgres,
      header,
      storage,
      probe: hints.probe,
      textOnly: hints.textOnly,
      ...(words.size && { reading: { binary: Object.fromEntries(words) } }),
      view: 'nr_delivery',
      numbered: 'nr_numbered',
      get viewVersion() {
        return viewVersion;
      },
      all,
      // no onScanned: the one client runs one query at a time, so a look-up could not run beside
      async columns(sql) {
        const res = await queued(() => client.query({ text: sql, rowMode: 'array' }));
        const out: Record<string, unknown[]> = {};
        res.fields.forEach((f, i) => {
          const col = new Array(res.rows.length);
          for (let r = 0; r < res.rows.length; r++) col[r] = (res.rows[r] as unknown[])[i];
          out[f.name] = col;
        });
        return out;
      },
      // one client, one session: its queries queue up, and its temp tables are the session's
      session: (fn) => fn({ all, run: async (sql) => void (await query(sql)) }),
      // a table has no unreadable lines: whatever loaded it has already parsed every record
      rejects: async (): Promise<RejectedLine[]> => [],
      async readAsText(columns) {
        for (const c of columns) storage.set(c, 'text');
        await define();
      },
      async readAsDouble(columns) {
        for (const c of columns) {
          storage.set(c, 'double');
          hints.probe.delete(c);
        }
        await define();
      },
      close,
    };
  } catch (e) {
    await close();
    if (e instanceof InputError) throw e;
    throw new InputError(`${display}: ${(e as Error).message.split('\n')[0]}`);
  }
}
