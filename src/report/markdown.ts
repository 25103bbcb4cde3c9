import { SEVERITIES, SEVERITY_ACTION, SEVERITY_WORD } from '../severity.js';
import { bySeverity, listed, listedGroups, shownValues } from './finding-parts.js';
import { gradeLine, SCORE_RULE, THRESHOLD_CAVEAT, VERDICT_HEADLINE, verdictSentence } from './labels.js';
import { mdText as m, mdHeading, mdLine } from './md-escape.js';
import { planSections } from './plan-sections.js';
import { poissonTable } from './poisson-table.js';
import { readingLines } from './reading.js';
import { slopesTable } from './slopes-table.js';
import type { StatTable } from './stat-tables.js';
import { anovaTable, componentsTable, extremesTable, groupsTable, predictorsTable } from './stat-tables.js';
import { threeLevelTables } from './three-level-table.js';
import type { Report } from './types.js';
import { MARKER_LEGEND, showsMarkers, visibleText, visibleValue } from './visible.js';

/**
 * The report as Markdown for a ticket or pull request: the same content as the HTML report
 * (verdict, findings by severity with the fix to ask for, statistics), as tables, no plots.
 * Every data value is escaped (see mdText).
 */
export function renderMarkdown(report: Report): string {
  const out: string[] = [];
  out.push(`# nestready: ${VERDICT_HEADLINE[report.verdict]}`, '', `**${verdictSentence(report)}**`, '');
  out.push(`${gradeLine(report)} (${SCORE_RULE})`, '');
  out.push(
    `Delivery ${m(report.input.path)}: ${report.input.rows} records in ${report.groups.count} groups` +
      (report.input.rowsRejected ? `, ${report.input.rowsRejected} unreadable lines` : '') +
      ` (group ID: ${m(report.roles.group)})`,
    '',
    ...inputNotes(report),
  );
  out.push(...readingLines(report.input.reading).flatMap((r) => [m(r), '']));
  out.push(
    `| ${SEVERITIES.map((s) => SEVERITY_WORD[s].many).join(' | ')} |`,
    `|${SEVERITIES.map(() => '---:').join('|')}|`,
    `| ${SEVERITIES.map((s) => bySeverity(report.findings, s).length).join(' | ')} |`,
    '',
  );

  out.push('## Findings', '');
  if (!report.findings.length) out.push('No findings: every rule that ran passed.', '');
  for (const severity of SEVERITIES) {
    const list = bySeverity(report.findings, severity);
    if (!list.length) continue;
    out.push(`### ${SEVERITY_ACTION[severity].heading} (${list.length})`, '');
    out.push('| finding | ask for | groups | records | rule | column |', '|---|---|---|---|---|---|');
    for (const f of list) {
      const values = shownValues(f);
      const finding = m(visibleText(f.message)) + (values.length ? ` (values: ${m(values.join('; '))})` : '');
      const column = f.column !== undefined ? m(visibleValue(f.column)) : '';
      out.push(
        `| ${finding} | ${m(visibleText(f.fix))} | ${f.groups?.length ? m(listedGroups(f)) : ''} | ` +
          `${f.rows?.length ? m(listed(f.rows.map(String))) : ''} | ${f.rule} | ${column} |`,
      );
    }
    out.push('');
  }

  out.push('## Statistics', '', '### Groups', '', ...table(groupsTable(report)));
  const sizes = report.plots?.groupSizes;
  if (sizes?.length && sizes.length <= 30) {
    out.push(
      ...table({
        caption: 'Group sizes',
        head: ['records per group', 'groups'],
        rows: sizes.map((s) => [String(s.size), String(s.count)]),
        numeric: [0, 1],
      }),
    );
  }
  for (const [name, o] of Object.entries(report.outcomes)) {
    out.push(`### Outcome ${mdHeading(name)}`, '', ...table(componentsTable(name, o)), ...table(anovaTable(name, o)));
    out.push(...threeLevelTables(name, o).flatMap(table));
    // the extreme group means (with plot data) and the tables the role map asks for (slopes; count: the Poisson model)
    out.push(...[extremesTable(report, name), slopesTable(name, o), poissonTable(name, o)].flatMap((t) => (t ? table(t) : [])));
  }
  const predictors = predictorsTable(report);
  if (predictors) out.push('### Level-1 predictors', '', ...table(predictors));
  out.push(...planMarkdown(report));
  out.push('---', '');
  if (showsMarkers(out.join('\n'))) out.push(`_${m(MARKER_LEGEND)}_`, '');
  out.push(`_${m(THRESHOLD_CAVEAT)}_`, '', `${mdLine(report.tool.name)} ${m(report.tool.version)} (${m(report.schema)})`);
  return `${out.join('\n')}\n`;
}

/** The plan's sections (precision, weights, how to fit), each under its own heading. */
function planMarkdown(report: Report): string[] {
  return planSections(report).flatMap((s) => [`## ${s.heading}`, '', ...(s.note ? [m(s.note), ''] : []), ...s.tables.flatMap(table)]);
}

function table(t: StatTable): string[] {
  return [
    `**${m(t.caption)}**`,
    '',
    `| ${t.head.map(m).join(' | ')} |`,
    `|${t.head.map((_, i) => (t.numeric.includes(i) ? '---:' : '---')).join('|')}|`,
    ...t.rows.map((r) => `| ${r.map(m).join(' | ')} |`),
    '',
  ];
}

/** The input section's notes (which Excel sheet was read, …), one paragraph each. */
function inputNotes(report: Report): string[] {
  return (report.input.notes ?? []).flatMap((note) => [`Note: ${m(note)}`, '']);
}
