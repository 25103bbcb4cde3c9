import { Chalk } from 'chalk';
import { batchTally, cell, gateLine, iccText, standing } from './labels.js';
import type { BatchRow, BatchSummary } from './types.js';

const HEAD = ['', 'standing', 'delivery', 'sender', 'grade', 'score', 'blockers', 'warnings', 'notes', 'records', 'groups', 'ICC (REML)'];
/** columns holding numbers: right-aligned */
const NUMERIC = new Set([0, 5, 6, 7, 8, 9, 10]);

/**
 * The batch summary for the terminal: the tally and the gate first, then one line per delivery,
 * worst first, its standing as a word beside a shape, and under an unreadable one its error;
 * last, the files skipped and where each delivery's own reports are.
 */
export function renderBatchText(summary: BatchSummary, options: { color: 0 | 1 | 2 | 3 }): string {
  const c = new Chalk({ level: options.color });
  const tone: Record<string, (s: string) => string> = {
    unreadable: c.hex('#c2185b').bold,
    'not-ready': c.hex('#c2185b'),
    caveats: c.hex('#b26a00'),
    ready: c.hex('#2e7d32'),
  };
  const rows = summary.deliveries.map((row, i) => cells(row, i + 1));
  const widths = HEAD.map((h, col) => Math.max(h.length, ...rows.map((r) => r[col].length)));
  const line = (r: string[]) =>
    r
      .map((v, col) => (NUMERIC.has(col) ? v.padStart(widths[col]) : v.padEnd(widths[col])))
      .join('  ')
      .trimEnd();
  const out = [c.bold(`nestready batch: ${batchTally(summary)}`), `role map ${summary.roles}; ${gateLine(summary)}`, '', c.dim(line(HEAD))];
  summary.deliveries.forEach((row, i) => {
    out.push(tone[standing(row).key](line(rows[i])));
    const indent = ' '.repeat(widths[0] + 2);
    if (row.error) out.push(`${indent}${row.error}`);
    else if (row.files) out.push(c.dim(`${indent}report: ${row.files.html}`));
  });
  if (summary.skipped.length) {
    out.push('', `Skipped (${summary.skipped.length}):`, ...summary.skipped.map((s) => `  ${s.file}: ${s.reason}`));
  }
  return `${out.join('\n')}\n`;
}

function cells(row: BatchRow, n: number): string[] {
  const s = standing(row);
  return [
    String(n),
    `${s.shape} ${s.word}`,
    row.file,
    row.sender,
    cell(row.grade),
    cell(row.score),
    cell(row.blockers),
    cell(row.warnings),
    cell(row.notes),
    cell(row.records),
    cell(row.groups),
    row.status === 'audited' ? iccText(row.icc) : '–',
  ];
}
