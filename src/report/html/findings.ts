import type { Severity } from '../../roles/types.js';
import type { Finding } from '../../rules/types.js';
import { escapeHtml as e } from '../escape-html.js';
import { bySeverity, listed, shownValues } from '../finding-parts.js';
import { HEADINGS, SEVERITIES } from '../labels.js';
import type { Report } from '../types.js';

/** A symbol per severity, shown beside the word (never instead of it). */
export const SYMBOLS: Record<Severity, string> = { blocker: '✖', warning: '▲', note: 'ℹ' };
const WORDS: Record<Severity, string> = { blocker: 'Blocker', warning: 'Warning', note: 'Note' };

/** The findings section: one list per severity, each finding with the fix to ask for and what it lists. */
export function findingsHtml(report: Report): string {
  const out = ['<section id="findings" aria-labelledby="findings-h">', '<h2 id="findings-h">Findings</h2>'];
  if (!report.findings.length) out.push('<p class="none"><strong>No findings.</strong> Every rule that ran passed.</p>');
  for (const severity of SEVERITIES) {
    const list = bySeverity(report.findings, severity);
    if (!list.length) continue;
    out.push(
      `<section class="sev-${severity}" aria-labelledby="sev-${severity}-h">`,
      `<h3 class="sev-heading" id="sev-${severity}-h"><span aria-hidden="true">${SYMBOLS[severity]}</span> ${HEADINGS[severity]} (${list.length})</h3>`,
      '<ol class="findings">',
      ...list.map(findingHtml),
      '</ol>',
      '</section>',
    );
  }
  out.push('</section>');
  return out.join('\n');
}

export function badge(severity: Severity): string {
  return `<span class="badge"><span aria-hidden="true">${SYMBOLS[severity]}</span> ${WORDS[severity]}</span>`;
}

function findingHtml(f: Finding): string {
  const parts = [
    `<li class="finding sev-${f.severity}">`,
    `<p class="head">${badge(f.severity)} <code>${e(f.rule)}</code>${f.column !== undefined ? ` <span>column <strong>${e(f.column)}</strong></span>` : ''}</p>`,
    `<p class="message">${e(f.message)}</p>`,
    `<p class="ask"><strong>Ask for:</strong> ${e(f.fix)}</p>`,
  ];
  const rows: string[] = [];
  if (f.groups?.length) {
    rows.push(`<dt>Groups</dt><dd>${e(listed(f.groups, f.count))}</dd>`);
  }
  if (f.rows?.length) rows.push(`<dt>Records</dt><dd>${e(listed(f.rows.map(String)))}</dd>`);
  const values = shownValues(f);
  if (values.length) rows.push(`<dt>Values seen</dt><dd><ul>${values.map((v) => `<li>${e(v)}</li>`).join('')}</ul></dd>`);
  if (rows.length) parts.push(`<dl>${rows.join('')}</dl>`);
  parts.push('</li>');
  return parts.join('');
}
