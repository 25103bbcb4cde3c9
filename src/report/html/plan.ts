import { escapeHtml as e } from '../escape-html.js';
import { planSections } from '../plan-sections.js';
import type { Report } from '../types.js';
import { statTableHtml } from './stat-table.js';

/** The plan's sections (precision, weights, how to fit) as HTML sections; empty when the report has none. */
export function planHtml(report: Report): string {
  return planSections(report)
    .map((s) =>
      [
        `<section aria-labelledby="${s.id}"><h2 id="${s.id}">${e(s.heading)}</h2>`,
        s.note ? `<p class="muted">${e(s.note)}</p>` : '',
        ...s.tables.map(statTableHtml),
        '</section>',
      ].join('\n'),
    )
    .join('\n');
}
