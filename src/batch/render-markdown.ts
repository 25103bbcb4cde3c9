import { mdText as m } from '../report/md-escape.js';
import { batchTally, cell, gateLine, href, iccText, standing } from './labels.js';
import type { BatchRow, BatchSummary } from './types.js';

/**
 * The batch summary as Markdown for a ticket: the tally and the gate, then a table of the
 * deliveries worst first, each linking to its own HTML report (and its JSON report and problem
 * rows) by relative path; an unreadable delivery's row carries its error instead.
 */
export function renderBatchMarkdown(summary: BatchSummary): string {
  const out = [
    `# nestready batch: ${m(batchTally(summary))}`,
    '',
    `Role map ${m(summary.roles)}; ${m(gateLine(summary))}.`,
    '',
    '| # | standing | delivery | sender | grade | score | blockers | warnings | notes | records | groups | ICC (REML) | files or error |',
    '|---:|---|---|---|---|---:|---:|---:|---:|---:|---:|---|---|',
  ];
  summary.deliveries.forEach((row, i) => {
    const s = standing(row);
    out.push(
      `| ${i + 1} | ${s.shape} ${s.word} | ${deliveryCell(row)} | ${m(row.sender)} | ${cell(row.grade)} | ${cell(row.score)} | ` +
        `${cell(row.blockers)} | ${cell(row.warnings)} | ${cell(row.notes)} | ${cell(row.records)} | ${cell(row.groups)} | ` +
        `${row.status === 'audited' ? m(iccText(row.icc)) : '–'} | ${filesCell(row)} |`,
    );
  });
  if (summary.skipped.length) {
    out.push('', `Skipped (${summary.skipped.length}):`, '', ...summary.skipped.map((s) => `- ${m(s.file)}: ${m(s.reason)}`));
  }
  return `${out.join('\n')}\n`;
}

function deliveryCell(row: BatchRow): string {
  return row.files ? `[${m(row.file)}](${href(row.files.html)})` : m(row.file);
}

function filesCell(row: BatchRow): string {
  if (row.error) return m(row.error);
  if (!row.files) return '';
  return `[JSON](${href(row.files.json)}) · [problem rows](${href(row.files.problems)})`;
}
