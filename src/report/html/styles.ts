import { CHART_FONT } from '../charts/theme.js';
import { PALETTE as P } from '../palette.js';

/** The report's inline stylesheet: our own look, readable on screen and on paper. */
export const STYLES = `
:root { color-scheme: light; }
* { box-sizing: border-box; }
body { margin: 0; background: ${P.paper}; color: ${P.ink}; font: 15px/1.5 ${CHART_FONT}; }
a { color: ${P.accent}; }
code { font-family: ui-monospace, SFMono-Regular, Menlo, Consolas, monospace; font-size: 0.92em;
  background: ${P.grid}; padding: 0 0.25em; border-radius: 3px; }
.wrap { max-width: 72rem; margin: 0 auto; padding: 0 1.25rem; }
header.top { background: ${P.accent}; color: #fff; padding: 1.5rem 0 1.25rem; }
header.top .eyebrow { margin: 0; text-transform: uppercase; letter-spacing: 0.08em; font-size: 0.8rem; opacity: 0.9; }
header.top h1 { margin: 0.15rem 0 0.35rem; font-size: 1.9rem; line-height: 1.2; }
header.top .source { margin: 0; opacity: 0.95; overflow-wrap: anywhere; }
.verdict { margin: 1.5rem 0 1.25rem; padding: 0.2rem 0 0.9rem 1.1rem; border-left: 10px double var(--tone); }
.verdict h2 { margin: 0 0 0.4rem; padding: 0; border: 0; font-size: 1.65rem; line-height: 1.25; color: var(--tone); }
.verdict p { margin: 0.3rem 0 0; }
.verdict .tally { display: flex; flex-wrap: wrap; gap: 0.2rem 1.6rem; margin: 0; padding: 0; list-style: none; font-size: 1.05rem; }
.verdict .tally .shape { color: var(--tone); }
.verdict .tally .nil, .verdict .tally .nil .shape { color: ${P.muted}; font-weight: 400; }
.verdict .tally .nil strong { font-weight: 400; }
.verdict .grade-line { font-size: 0.92rem; }
.tone-ready { --tone: ${P.ok}; }
.tone-caveats { --tone: ${P.warning}; }
.tone-not-ready { --tone: ${P.blocker}; }
nav.toc { margin: 0 0 1.5rem; font-size: 0.95rem; }
nav.toc ul { display: flex; flex-wrap: wrap; gap: 0.4rem 1.25rem; padding: 0; margin: 0; list-style: none; }
h2 { font-size: 1.4rem; margin: 2rem 0 0.75rem; padding-bottom: 0.3rem; border-bottom: 2px solid ${P.line}; }
h3 { font-size: 1.12rem; margin: 1.5rem 0 0.6rem; }
.sev-heading { display: flex; align-items: center; gap: 0.5rem; }
ol.findings { list-style: none; margin: 0; padding: 0; display: grid; gap: 0.75rem; }
.finding { display: grid; grid-template-columns: 8.5rem 1fr; gap: 0 1rem; padding: 0.7rem 1rem; }
.finding { background: ${P.panel}; border: 1px solid ${P.line}; border-top: 3px solid var(--tone); }
.finding p { margin: 0.25rem 0; }
.finding .sev { margin: 0.25rem 0; font-weight: 700; color: var(--tone); white-space: nowrap; font-variant-numeric: tabular-nums; }
.finding .sev .num { display: inline-block; min-width: 1.6rem; color: ${P.muted}; font-weight: 600; }
.finding .body { min-width: 0; }
.finding .message { font-weight: 600; }
.finding .ask { border-left: 3px solid ${P.line}; padding: 0.1rem 0 0.1rem 0.6rem; }
.finding dl { margin: 0.4rem 0 0; display: grid; grid-template-columns: max-content 1fr; gap: 0.15rem 0.8rem; font-size: 0.92rem; }
.finding dt { font-weight: 600; color: ${P.muted}; }
.finding dd { margin: 0; overflow-wrap: anywhere; }
.finding dd ul { margin: 0; padding-left: 1.1rem; }
.finding .origin { font-size: 0.88rem; color: ${P.muted}; }
@media (max-width: 40rem) { .finding { grid-template-columns: 1fr; } }
.sev-blocker { --tone: ${P.blocker}; --soft: ${P.blockerSoft}; }
.sev-warning { --tone: ${P.warning}; --soft: ${P.warningSoft}; }
.sev-note { --tone: ${P.note}; --soft: ${P.noteSoft}; }
.none { background: ${P.okSoft}; border: 1px solid ${P.ok}; border-radius: 6px; padding: 0.75rem 1rem; }
table { border-collapse: collapse; background: ${P.panel}; margin: 0.5rem 0 1rem; font-size: 0.93rem; min-width: 20rem; }
caption { text-align: left; font-weight: 600; padding: 0.3rem 0; color: ${P.ink}; caption-side: top; }
th, td { border: 1px solid ${P.line}; padding: 0.3rem 0.6rem; text-align: left; vertical-align: top; }
thead th { background: ${P.grid}; }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; }
.tables { display: flex; flex-wrap: wrap; gap: 0 1.5rem; align-items: flex-start; }
.table-scroll { max-width: 100%; overflow-x: auto; }
figure.chart { margin: 0.75rem 0 1.25rem; background: ${P.panel}; border: 1px solid ${P.line}; border-radius: 6px;
  padding: 0.5rem; max-width: 100%; overflow-x: auto; }
figure.chart svg { display: block; width: 100%; height: auto; }
/* the chart drawn for the width at hand: wide from 60rem, else the narrow drawing (also on paper) */
figure.chart svg.narrow { display: none; }
@media (max-width: 59.99rem) { figure.chart svg.wide { display: none; } figure.chart svg.narrow { display: block; } }
.inv { font-family: ui-monospace, SFMono-Regular, Menlo, Consolas, monospace; font-size: 0.85em; font-weight: 600;
  color: ${P.highlight}; background: ${P.warningSoft}; border-radius: 2px; padding: 0 1px; }
figure.chart figcaption { font-size: 0.88rem; color: ${P.muted}; padding: 0.35rem 0.25rem 0; }
.muted { color: ${P.muted}; }
footer { margin: 2.5rem 0 2rem; padding-top: 0.75rem; border-top: 1px solid ${P.line}; font-size: 0.88rem; color: ${P.muted}; }
@page { size: A4; margin: 14mm 12mm; }
@media print {
  body { background: #fff; font-size: 10.5pt; }
  .wrap { max-width: none; padding: 0; }
  header.top { background: #fff; color: ${P.ink}; border-bottom: 3px solid ${P.accent}; padding: 0 0 0.6rem; }
  /* no card cut across two pages; a heading stays with what follows it */
  .finding, figure.chart, .verdict, .table-scroll, table, .none, .reading-legend { break-inside: avoid; }
  h2, h3, h4, caption { break-after: avoid; }
  figure.chart { overflow: visible; }
  figure.chart svg.wide { display: none; }
  figure.chart svg.narrow { display: block; }
  .table-scroll { overflow: visible; }
  nav.toc { display: none; }
  a { color: inherit; text-decoration: none; }
}
`;
