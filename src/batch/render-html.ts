import { escapeHtml as e } from '../report/escape-html.js';
import { STYLES } from '../report/html/styles.js';
import { PALETTE as P } from '../report/palette.js';
import { BATCH_NOTE, batchTally, cell, gateLine, href, iccText, standing } from './labels.js';
import type { BatchRow, BatchSummary } from './types.js';

/** As a delivery's report: nothing in the page may load or run. */
const CSP = "default-src 'none'; style-src 'unsafe-inline'; base-uri 'none'; form-action 'none'";

const EXTRA_STYLES = `
tr.row-unreadable td:first-child, tr.row-not-ready td:first-child { color: var(--tone); font-weight: 700; }
tr.row-caveats td:first-child, tr.row-ready td:first-child { color: var(--tone); font-weight: 600; }
.row-unreadable, .row-not-ready { --tone: ${P.blocker}; }
.row-caveats { --tone: ${P.warning}; }
.row-ready { --tone: ${P.ok}; }
td.error { overflow-wrap: anywhere; }
`;

/**
 * The batch summary as one self-contained page: the tally and the gate, then a table of the
 * deliveries worst first, each naming its standing in words and linking to its own report by
 * relative path; no script, no network, every name escaped.
 */
export function renderBatchHtml(summary: BatchSummary): string {
  const rows = summary.deliveries.map((row, i) => rowHtml(row, i + 1)).join('\n');
  const skipped = summary.skipped.length
    ? `<h2 id="skipped-h">Skipped files (${summary.skipped.length})</h2>\n<ul>${summary.skipped
        .map((s) => `<li><code>${e(s.file)}</code>: ${e(s.reason)}</li>`)
        .join('')}</ul>`
    : '';
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="${CSP}">
<meta name="generator" content="${e(`${summary.tool.name} ${summary.tool.version}`)}">
<title>${e(`nestready batch: ${batchTally(summary)}`)}</title>
<style>${STYLES}${EXTRA_STYLES}</style>
</head>
<body>
<header class="top"><div class="wrap">
<p class="eyebrow">nestready audit of a batch of deliveries</p>
<h1>${e(batchTally(summary))}</h1>
<p class="source">Role map ${e(summary.roles)}; ${e(gateLine(summary))}</p>
</div></header>
<main class="wrap">
<h2 id="deliveries-h">Deliveries, worst first</h2>
<div class="table-scroll"><table aria-labelledby="deliveries-h">
<thead><tr><th scope="col">standing</th><th scope="col">delivery</th><th scope="col">sender</th><th scope="col">grade</th>
<th scope="col" class="num">score</th><th scope="col" class="num">blockers</th><th scope="col" class="num">warnings</th>
<th scope="col" class="num">notes</th><th scope="col" class="num">records</th><th scope="col" class="num">groups</th>
<th scope="col">ICC (REML)</th><th scope="col">files or error</th></tr></thead>
<tbody>
${rows}
</tbody>
</table></div>
${skipped}
</main>
<footer class="wrap">
<p>${e(BATCH_NOTE)}</p>
<p>Made by ${e(summary.tool.name)} ${e(summary.tool.version)} (${e(summary.schema)}).</p>
</footer>
</body>
</html>
`;
}

function rowHtml(row: BatchRow, n: number): string {
  const s = standing(row);
  const name = row.files ? `<a href="${e(href(row.files.html))}">${e(row.file)}</a>` : e(row.file);
  const num = (v: number | string | undefined) => `<td class="num">${e(cell(v))}</td>`;
  const last = row.error
    ? `<td class="error">${e(row.error)}</td>`
    : row.files
      ? `<td><a href="${e(href(row.files.json))}">JSON</a> · <a href="${e(href(row.files.problems))}">problem rows</a></td>`
      : '<td></td>';
  return (
    `<tr class="row-${s.key}" id="d${n}"><td><span aria-hidden="true">${s.shape}</span> ${e(s.word)}</td><td>${name}</td>` +
    `<td>${e(row.sender)}</td><td>${e(cell(row.grade))}</td>${num(row.score)}${num(row.blockers)}${num(row.warnings)}` +
    `${num(row.notes)}${num(row.records)}${num(row.groups)}<td>${row.status === 'audited' ? e(iccText(row.icc)) : '–'}</td>${last}</tr>`
  );
}
