import type { Roles } from '../../../roles/types.js';
import { duckdb } from '../../dialect.js';
import { wordsAsDigits } from '../../plan/binary-words.js';
import { sampleHints } from '../../plan/sample-hints.js';
import { blankAsNull, ident } from '../../sql.js';
import type { BinaryWords, Source } from '../../types.js';
import type { DuckHost } from './host.js';
import type { DuckLayout } from './layout.js';
import { estimateGroups } from './memory.js';

/** The Source over a layout: the views nr_delivery and nr_numbered, the sample hints, the look-up API. */
export async function duckSource(engine: DuckHost, layout: DuckLayout, roles: Roles, missing: readonly string[]): Promise<Source> {
  const { all } = engine;
  const { header, storage } = layout;
  // a blank-looking group ID is missing; a variable's two words are read as 0/1 (plan/binary-words.ts)
  let words = new Map<string, BinaryWords>();
  const replace = () => {
    const items = header.includes(roles.group) ? [`${blankAsNull(roles.group, missing)} AS ${ident(roles.group)}`] : [];
    for (const [c, w] of words) items.push(`${wordsAsDigits(ident(c), w)} AS ${ident(c)}`);
    return items.length ? ` REPLACE (${items.join(', ')})` : '';
  };
  // DuckDB 1.5's CSV reader fails (and invalidates the database) when a line with invalid UTF-8
  // is met by a scan that reads only some of the columns; once such a line is known, the views
  // read every column (a filter that uses them all and is always true). A look-up that runs beside
  // the profile (the early unit check) may scan before the rejects are read: when the reader saw
  // such lines up front, the views read every column from the start
  const everyColumn = `hash(${header.map(ident).join(', ')}) IS NOT NULL`;
  let guarded = layout.typedReader && layout.invalidUtf8 === true;
  let viewVersion = 0;
  const define = async () => {
    viewVersion++;
    const rel = layout.relation(storage) + (guarded ? ` WHERE ${everyColumn}` : '');
    const group = replace();
    if (layout.numbering === 'rowid') {
      await engine.run(`CREATE OR REPLACE VIEW nr_numbered AS SELECT *${group} FROM ${rel}`);
      await engine.run('CREATE OR REPLACE VIEW nr_delivery AS SELECT * EXCLUDE (__rec) FROM nr_numbered');
    } else {
      // a blank-looking group ID (only spaces, or a missing token with spaces around it) is
      // missing; other IDs keep their spaces ("W-014 " is a variant to report, not W-014)
      await engine.run(`CREATE OR REPLACE VIEW nr_delivery AS SELECT *${group} FROM ${rel}`);
      await engine.run('CREATE OR REPLACE VIEW nr_numbered AS SELECT row_number() OVER () AS __rec, * FROM nr_delivery');
    }
  };
  await define();

  const ids = new Set([roles.group, roles.unit, roles.parent]);
  const sampled = layout.sample ? `(SELECT * FROM ${layout.sample()} WHERE ${everyColumn})` : 'nr_delivery';
  const hints = await sampleHints(all, sampled, header, storage, roles, ids, !layout.typedReader, duckdb);
  const { probe, textOnly, groups } = hints;
  // the profile's aggregates: a count per column, a text range, five numeric statistics
  const aggregates = header.reduce(
    (sum, c) =>
      sum + 1 + (storage.get(c) === 'text' && c !== roles.unit ? 2 : 0) + (storage.get(c) === 'double' || !textOnly.has(c) ? 5 : 0),
    1,
  );
  await engine.fitMemory({ format: layout.format, groups: estimateGroups(groups), aggregates });
  if (hints.binaryWords.size) {
    words = hints.binaryWords;
    await define();
  }
  const reading = { ...layout.reading, ...(words.size && { binary: Object.fromEntries(words) }) };

  return {
    path: layout.path,
    format: layout.format,
    ...(layout.notes?.length && { notes: layout.notes }),
    dialect: duckdb,
    header,
    storage,
    probe,
    textOnly,
    ...(Object.keys(reading).length && { reading }),
    view: 'nr_delivery',
    numbered: 'nr_numbered',
    get viewVersion() {
      return viewVersion;
    },
    all: (sql) => engine.lookupAll(sql),
    columns: (sql, options) => engine.columns(sql, options?.onScanned),
    session: (fn) => engine.session(fn),
    async rejects() {
      const rejected = await layout.rejects();
      if (!guarded && layout.typedReader && rejected.some((r) => r.kind === 'INVALID ENCODING')) {
        guarded = true;
        await define();
      }
      return rejected;
    },
    async readAsText(columns) {
      for (const c of columns) {
        storage.set(c, 'text');
        probe.delete(c);
      }
      await layout.beforeRetype?.();
      await define();
    },
    async readAsDouble(columns) {
      for (const c of columns) {
        storage.set(c, 'double');
        probe.delete(c);
      }
      await define();
    },
    close: () => engine.close(),
  };
}
