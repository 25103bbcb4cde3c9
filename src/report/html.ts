import { countOf, SEVERITIES, SEVERITY_ACTION, SEVERITY_SHAPE } from '../severity.js';
import { reportCharts } from './charts/report-charts.js';
import { chartToSvg } from './charts/to-svg.js';
import type { Chart } from './charts/types.js';
import { escapeHtml as e } from './escape-html.js';
import { bySeverity } from './finding-parts.js';
import { findingsHtml } from './html/findings.js';
import { markedHtml } from './html/marked.js';
import { planHtml } from './html/plan.js';
import type { ChartSvgs } from './html/statistics.js';
import { statisticsHtml } from './html/statistics.js';
import { STYLES } from './html/styles.js';
import { gradeLine, SCORE_RULE, THRESHOLD_CAVEAT, VERDICT_ADVICE, VERDICT_HEADLINE } from './labels.js';
import { readingLines } from './reading.js';
import type { Report } from './types.js';
import { MARKER_LEGEND } from './visible.js';

/** Nothing in the page may load or run: no scripts, no network, only the inline styles. */
const CSP = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'";

/**
 * The report as one self-contained HTML page for a data manager to read and mail on: the verdict
 * as a sentence about the delivery first (grade and score beneath it), findings by severity with
 * the fix to ask for, then the statistics with plots.
 * No script, no network: inline CSS and SVG only (Vega-Lite charts rendered headless), a
 * Content-Security-Policy that forbids anything else, and every data value escaped.
 * Async only because Vega renders asynchronously; it reads nothing but the report.
 */
export async function renderHtml(report: Report): Promise<string> {
  const charts = reportCharts(report);
  const svg = (c: Chart | null) => (c ? bothWidths(c) : Promise.resolve(null));
  const [sizes, icc, predictors, ...means] = await Promise.all([
    svg(charts.sizes),
    svg(charts.icc),
    svg(charts.predictors),
    ...charts.means.map((m) => bothWidths(m.chart)),
  ]);
  const svgs: ChartSvgs = { sizes, icc, predictors, means: new Map() };
  charts.means.forEach((m, i) => {
    svgs.means.set(m.outcome, means[i] as string);
  });

  const title = `nestready: ${VERDICT_HEADLINE[report.verdict]} — ${report.input.path}`;
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="${CSP}">
<meta name="generator" content="${e(`${report.tool.name} ${report.tool.version}`)}">
<title>${e(title)}</title>
<style>${STYLES}</style>
</head>
<body>
<header class="top"><div class="wrap">
<p class="eyebrow">nestready audit of a two-level delivery</p>
<h1>${e(report.input.path)}</h1>
<p class="source">${e(summaryLine(report))}</p>
${readingLines(report.input.reading)
  .map((r) => `<p class="source">${e(r)}</p>`)
  .join('\n')}${(report.input.notes ?? []).map((note) => `\n<p class="source">Note: ${e(note)}</p>`).join('')}
</div></header>
<main class="wrap">
${verdictHtml(report)}
<nav class="toc" aria-label="Contents"><ul>${tocItems(report)}</ul></nav>
${findingsHtml(report)}
${statisticsHtml(report, svgs)}
${planHtml(report)}
</main>
<footer class="wrap">
<p>${e(THRESHOLD_CAVEAT)}</p>
<p class="reading-legend">${markedHtml(MARKER_LEGEND)}</p>
<p>${madeBy(report)}</p>
</footer>
</body>
</html>
`;
}

/** A chart drawn for a wide screen and for a narrow screen or paper, side by side; the stylesheet shows one. */
async function bothWidths(chart: Chart): Promise<string> {
  return (await Promise.all([chartToSvg(chart, 'wide'), chartToSvg(chart, 'narrow')])).join('');
}

function summaryLine(report: Report): string {
  return (
    `${report.input.rows} records in ${report.groups.count} groups, ${report.input.columns.length} columns` +
    (report.input.rowsRejected ? `, ${report.input.rowsRejected} unreadable lines` : '') +
    ` · group ID: ${report.roles.group}`
  );
}

/**
 * The verdict as a headline about the delivery, what each severity found asks the reader to do,
 * and grade and score as one secondary line with how the score is reached: no card, no big letter.
 */
function verdictHtml(report: Report): string {
  const tally = SEVERITIES.map((s) => {
    const n = bySeverity(report.findings, s).length;
    const what = n ? ` ${SEVERITY_ACTION[s].tally}` : '';
    const shape = `<span class="shape" aria-hidden="true">${SEVERITY_SHAPE[s]}</span>`;
    // a severity with nothing found stays in the tally (the reader sees it was looked for), muted
    return `<li class="sev-${s}${n ? '' : ' nil'}">${shape} <strong>${countOf(s, n)}</strong>${what}</li>`;
  }).join('');
  return `<section class="verdict tone-${report.verdict}" aria-labelledby="verdict-h">
<h2 id="verdict-h">${e(VERDICT_HEADLINE[report.verdict])}</h2>
<ul class="tally">${tally}</ul>
<p class="advice">${e(VERDICT_ADVICE[report.verdict])}</p>
<p class="grade-line"><strong>${e(gradeLine(report))}</strong> <span class="muted">(${e(SCORE_RULE)})</span></p>
</section>`;
}

/** The contents line: a link per section, the level-1 predictors only when the report has them. */
function tocItems(report: Report): string {
  const sections: [string, string][] = [
    ['findings', 'Findings'],
    ['statistics', 'Statistics'],
    ['groups-h', 'Groups'],
    ['outcomes-h', 'Outcomes'],
  ];
  if (report.plots && Object.keys(report.plots.predictorShares).length) sections.push(['predictors-h', 'Level-1 predictors']);
  return sections.map(([id, label]) => `<li><a href="#${id}">${label}</a></li>`).join('');
}

/** The footer's line: which tool made the report, and the ID columns it keyed on. */
function madeBy(report: Report): string {
  const unit = report.roles.unit ? `, unit ID column: <code>${e(report.roles.unit)}</code>` : '';
  return (
    `Made by ${e(report.tool.name)} ${e(report.tool.version)} (${e(report.schema)}). ` +
    `Group ID column: <code>${e(report.roles.group)}</code>${unit}.`
  );
}
