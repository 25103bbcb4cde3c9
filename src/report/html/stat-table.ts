import type { StatTable } from '../stat-tables.js';
import { tableHtml } from './tables.js';

/** A shared statistics table as an accessible HTML table. */
export function statTableHtml(t: StatTable): string {
  return tableHtml(
    t.caption,
    t.head,
    t.rows.map((r) => r.map((c, i) => (t.numeric.includes(i) && i > 0 ? { num: c } : c))),
  );
}
