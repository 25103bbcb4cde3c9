import { formatNumber } from '../util/format.js';
import { chartToSvg } from './charts/to-svg.js';
import { reportCharts } from './charts/report-charts.js';
import type { Chart } from './charts/types.js';
import { escapeHtml as e } from './escape-html.js';
import { SYMBOLS } from './html/findings.js';
import { findingsHtml } from './html/findings.js';
import { statisticsHtml } from './html/statistics.js';
import type { ChartSvgs } from './html/statistics.js';
import { STYLES } from './html/styles.js';
import { bySeverity } from './finding-parts.js';
import { HEADINGS, SEVERITIES, THRESHOLD_CAVEAT, VERDICT_TEXT } from './labels.js';
import type { Report } from './types.js';

/** Nothing in the page may load or run: no scripts, no network, only the inline styles. */
const CSP = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'";
const VERDICT_SYMBOL = { ready: '✔', caveats: '▲', 'not-ready': '✖' } as const;

/**
 * The report as one self-contained HTML page for a data manager to read and mail on: verdict and
 * grade first, findings by severity with the fix to ask for, then the statistics with plots.
 * No script, no network: inline CSS and SVG only (Vega-Lite charts rendered headless), a
 * Content-Security-Policy that forbids anything else, and every data value escaped.
 * Async only because Vega renders asynchronously; it reads nothing but the report.
 */
export async function renderHtml(report: Report): Promise<string> {
  const charts = reportCharts(report);
  const svg = (c: Chart | null) => (c ? chartToSvg(c) : Promise.resolve(null));
  const [sizes, icc, predictors, ...means] = await Promise.all([
    svg(charts.sizes),
    svg(charts.icc),
    svg(charts.predictors),
    ...charts.means.map((m) => chartToSvg(m.chart)),
  ]);
  const svgs: ChartSvgs = { sizes, icc, predictors, means: new Map() };
  charts.means.forEach((m, i) => svgs.means.set(m.outcome, means[i] as string));

  const title = `nestready: ${VERDICT_TEXT[report.verdict]} — ${report.input.path}`;
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
</div></header>
<main class="wrap">
${verdictHtml(report)}
<nav class="toc" aria-label="Contents"><ul><li><a href="#findings">Findings</a></li><li><a href="#statistics">Statistics</a></li><li><a href="#groups-h">Groups</a></li><li><a href="#outcomes-h">Outcomes</a></li>${report.plots && Object.keys(report.plots.predictorShares).length ? '<li><a href="#predictors-h">Level-1 predictors</a></li>' : ''}</ul></nav>
${findingsHtml(report)}
${statisticsHtml(report, svgs)}
</main>
<footer class="wrap">
<p>${e(THRESHOLD_CAVEAT)}</p>
<p>Made by ${e(report.tool.name)} ${e(report.tool.version)} (${e(report.schema)}). Group ID column: <code>${e(report.roles.group)}</code>${report.roles.unit ? `, unit ID column: <code>${e(report.roles.unit)}</code>` : ''}.</p>
</footer>
</body>
</html>
`;
}

function summaryLine(report: Report): string {
  return (
    `${report.input.rows} records in ${report.groups.count} groups, ${report.input.columns.length} columns` +
    (report.input.rowsRejected ? `, ${report.input.rowsRejected} unreadable lines` : '') +
    ` · group ID: ${report.roles.group}`
  );
}

function verdictHtml(report: Report): string {
  const counts = SEVERITIES.map((s) => {
    const n = bySeverity(report.findings, s).length;
    return `<li><span aria-hidden="true">${SYMBOLS[s]}</span> ${n} ${n === 1 ? HEADINGS[s].slice(0, -1).toLowerCase() : HEADINGS[s].toLowerCase()}</li>`;
  }).join('');
  return `<section class="verdict tone-${report.verdict}" aria-label="Verdict">
<div class="state"><p class="muted">Verdict</p><p class="word"><span aria-hidden="true">${VERDICT_SYMBOL[report.verdict]}</span> ${VERDICT_TEXT[report.verdict]}</p><p>${e(verdictAdvice(report))}</p></div>
<div class="grade"><p class="muted">Grade</p><span class="letter">${e(report.grade)}</span><span>score ${formatNumber(report.score, 0)}/100</span></div>
<div class="counts"><p class="muted">Findings</p><ul>${counts}</ul></div>
</section>`;
}

function verdictAdvice(report: Report): string {
  if (report.verdict === 'not-ready') return 'Send the blockers below back to the sender before any modelling.';
  if (report.verdict === 'caveats') return 'Usable, but read the warnings below and agree with the analyst how to handle them.';
  return 'No blocker or warning: the delivery can go on to modelling.';
}
