import { formatNumber } from '../util/format.js';
import type { BatchRow, BatchSummary } from './types.js';

/** A row's standing as a word and a shape, worst first; the shape is never shown without the word. */
export function standing(row: BatchRow): { key: string; word: string; shape: string } {
  if (row.status === 'unreadable') return { key: 'unreadable', word: 'unreadable', shape: '✕' };
  if (row.status === 'error') return { key: 'unreadable', word: 'nestready failed', shape: '✕' };
  if (row.verdict === 'not-ready') return { key: 'not-ready', word: 'not ready', shape: '■' };
  if (row.verdict === 'caveats') return { key: 'caveats', word: 'caveats', shape: '◆' };
  return { key: 'ready', word: 'ready', shape: '✓' };
}

/** "7 deliveries: 1 unreadable, 2 not ready, 1 with caveats, 3 ready". */
export function batchTally(summary: BatchSummary): string {
  const c = summary.counts;
  const parts = [
    c.unreadable && `${c.unreadable} unreadable`,
    c.notReady && `${c.notReady} not ready`,
    c.caveats && `${c.caveats} with caveats`,
    c.ready && `${c.ready} ready`,
  ].filter(Boolean);
  return `${c.deliveries} ${c.deliveries === 1 ? 'delivery' : 'deliveries'}: ${parts.join(', ')}`;
}

const EXIT_MEANING = {
  0: 'every delivery passed the gate',
  1: 'a delivery failed the gate',
  2: 'a delivery could not be read',
  3: 'nestready failed on a delivery (a bug: please report it)',
} as const;

/** The gate's outcome in words: "--fail-on warning: exit 2, a delivery could not be read". */
export function gateLine(summary: BatchSummary): string {
  return `--fail-on ${summary.failOn}: exit ${summary.exitCode}, ${EXIT_MEANING[summary.exitCode]}`;
}

/** The outcomes' REML ICCs: the number alone for one outcome, each with its name for several. */
export function iccText(icc: BatchRow['icc']): string {
  const entries = Object.entries(icc ?? {});
  const shown = (v: number | null) => (v === null ? 'n/a' : formatNumber(v, 3));
  if (entries.length === 1) return shown(entries[0][1]);
  return entries.map(([name, v]) => `${name} ${shown(v)}`).join('; ');
}

/** A count cell: the number, or a dash for a delivery that was not audited. */
export function cell(value: number | string | undefined): string {
  return value === undefined ? '–' : String(value);
}

/** Why the summary's numbers are guidance: the same caveat a delivery's report carries. */
export const BATCH_NOTE =
  "Each delivery's own report says what to ask its sender for; the grades order deliveries, the verdicts and the exit code gate them.";

/** A relative path as a link target: each folder name percent-encoded, brackets and quotes too (Markdown and HTML alike). */
export function href(path: string): string {
  return path
    .split('/')
    .map((part) => encodeURIComponent(part).replace(/[()'!*]/g, (ch) => `%${ch.charCodeAt(0).toString(16).toUpperCase()}`))
    .join('/');
}
