import type { Finding } from '../../rules/types.js';
import { SEVERITIES, SEVERITY_ACTION, SEVERITY_SHAPE, SEVERITY_WORD } from '../../severity.js';
import { escapeHtml as e } from '../escape-html.js';
import { bySeverity, listed, listedGroups, origin, shownValues } from '../finding-parts.js';
import type { Report } from '../types.js';
import { visibleText } from '../visible.js';
import { markedHtml as v } from './marked.js';

/**
 * The findings section: one list per severity, numbered through the whole report (so a reply to
 * the sender can name them), each finding with its severity as shape and word in a column of its
 * own, the fix to ask for, what it lists, and the rule it comes from said plainly at the end.
 */
export function findingsHtml(report: Report): string {
  const out = ['<section id="findings" aria-labelledby="findings-h">', '<h2 id="findings-h">Findings</h2>'];
  if (!report.findings.length) out.push('<p class="none"><strong>No findings.</strong> Every rule that ran passed.</p>');
  let start = 1;
  for (const severity of SEVERITIES) {
    const list = bySeverity(report.findings, severity);
    if (!list.length) continue;
    out.push(
      `<section class="sev-${severity}" aria-labelledby="sev-${severity}-h">`,
      `<h3 class="sev-heading" id="sev-${severity}-h"><span class="shape" aria-hidden="true">${SEVERITY_SHAPE[severity]}</span> ` +
        `${SEVERITY_ACTION[severity].heading} (${list.length})</h3>`,
      `<ol class="findings" start="${start}">`,
      ...list.map((f, i) => findingHtml(f, start + i)),
      '</ol>',
      '</section>',
    );
    start += list.length;
  }
  out.push('</section>');
  return out.join('\n');
}

/** The severity column of a finding: its number, shape and word. */
export function severityCell(f: Finding, number: number): string {
  return (
    `<p class="sev"><span class="num">${number}</span> <span class="shape" aria-hidden="true">${SEVERITY_SHAPE[f.severity]}</span> ` +
    `<span class="word">${SEVERITY_WORD[f.severity].one}</span></p>`
  );
}

function findingHtml(f: Finding, number: number): string {
  const parts = [
    `<li class="finding sev-${f.severity}">`,
    severityCell(f, number),
    '<div class="body">',
    `<p class="message">${v(visibleText(f.message))}</p>`,
    `<p class="ask"><strong>Ask for:</strong> ${v(visibleText(f.fix))}</p>`,
  ];
  const rows: string[] = [];
  if (f.groups?.length) {
    rows.push(`<dt>Groups</dt><dd>${v(listedGroups(f))}</dd>`);
  }
  if (f.rows?.length) rows.push(`<dt>Records</dt><dd>${e(listed(f.rows.map(String)))}</dd>`);
  const values = shownValues(f);
  if (values.length) rows.push(`<dt>Values seen</dt><dd><ul>${values.map((x) => `<li>${v(x)}</li>`).join('')}</ul></dd>`);
  if (rows.length) parts.push(`<dl>${rows.join('')}</dl>`);
  parts.push(`<p class="origin">${v(origin(f))}</p>`, '</div>', '</li>');
  return parts.join('');
}
