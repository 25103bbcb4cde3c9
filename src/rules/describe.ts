import { formatNumber } from '../util/format.js';

/** An ID as the sender wrote it, quoted so that spaces show: `"W-014 "`. */
export function quoteId(id: string): string {
  return JSON.stringify(id);
}

/** An ID a record holds, as a problem-rows reason names it: quoted as written, "(missing)" when absent. */
export function recordId(value: unknown): string {
  return value === null || value === undefined ? '(missing)' : quoteId(String(value));
}

/** A share as a percentage with one decimal: `12.5%`. */
export function percent(share: number): string {
  return `${formatNumber(100 * share, 1)}%`;
}

/** The first `limit` items joined with `, `, and "… (N more)" when there are more. */
export function listSome(items: readonly string[], limit = 10): string {
  const shown = items.slice(0, limit).join(', ');
  return items.length > limit ? `${shown}, … (${items.length - limit} more)` : shown;
}

/** Record numbers of several examples merged: sorted, unique, the first `limit`. */
export function firstRows(lists: readonly (readonly number[])[], limit = 20): number[] {
  return [...new Set(lists.flat())].sort((a, b) => a - b).slice(0, limit);
}
