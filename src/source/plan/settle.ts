import { ident } from '../sql.js';
import type { RejectedLine, Source } from '../types.js';

/**
 * Settle an opened delivery as the audit read it, for a second reading of its records (the
 * problem rows): one full read of every column, columns whose values failed to convert re-read
 * as text, and text columns whose every value is a number read as numbers (as buildProfile
 * settles them), so that record numbers, unreadable lines and values match the report's,
 * whatever the engine.
 *
 * @returns the unreadable lines of the last full read
 */
export async function settleSource(source: Source): Promise<RejectedLine[]> {
  while (true) {
    // a count of every column converts every column, so every unreadable line is seen; run as a
    // full read (columns), on the connection whose rejects log rejects() reads
    await source.columns(`SELECT ${source.header.map((c) => `count(${ident(c)})`).join(', ')} FROM ${source.view}`);
    const rejected = await source.rejects();
    const retype = [
      ...new Set(rejected.flatMap((r) => (r.column !== undefined && source.storage.get(r.column) === 'double' ? [r.column] : []))),
    ];
    if (retype.length === 0) {
      await settleProbed(source);
      return rejected;
    }
    await source.readAsText(retype);
  }
}

/** Probed columns (text whose sample was all numbers) read as numbers when every value is one. */
async function settleProbed(source: Source): Promise<void> {
  const probed = [...source.probe];
  if (!probed.length) return;
  const counts = probed.map((c, i) => `count(${ident(c)}) AS n${i}, count(${source.dialect.numeric(ident(c))}) AS k${i}`);
  const [row] = await source.all<Record<string, unknown>>(`SELECT ${counts.join(', ')} FROM ${source.view}`);
  const numbers = probed.filter((_, i) => Number(row[`n${i}`]) > 0 && Number(row[`k${i}`]) === Number(row[`n${i}`]));
  if (numbers.length) await source.readAsDouble(numbers);
}
