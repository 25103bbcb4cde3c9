import type { ChalkInstance } from 'chalk';
import { planSections } from './plan-sections.js';
import type { StatTable } from './stat-tables.js';
import type { Report } from './types.js';

/** The plan's sections (precision, weights, how to fit) as terminal lines; none when the report has none. */
export function planTextLines(report: Report, c: ChalkInstance): string[] {
  const out: string[] = [];
  for (const s of planSections(report)) {
    out.push('', c.bold(s.heading));
    if (s.note) out.push(`  ${s.note}`);
    for (const t of s.tables) out.push(...(t.head[0] === 'advice' ? adviceLines(t) : tableLines(t, c)));
  }
  return out;
}

/** A table as aligned columns under its caption (numbers right-aligned). */
function tableLines(t: StatTable, c: ChalkInstance): string[] {
  const cells = [t.head, ...t.rows];
  const width = t.head.map((_, i) => Math.max(...cells.map((r) => (r[i] ?? '').length)));
  const line = (r: string[]) =>
    `    ${r.map((cell, i) => (t.numeric.includes(i) ? cell.padStart(width[i]) : cell.padEnd(width[i]))).join('  ')}`.trimEnd();
  return [`  ${t.caption}`, c.dim(line(t.head)), ...t.rows.map(line)];
}

/** Advice reads as prose: one numbered item with its reason and source beneath. */
function adviceLines(t: StatTable): string[] {
  return t.rows.flatMap(([advice, because, source], i) => [`  ${i + 1}. ${advice}`, `     because: ${because}`, `     source: ${source}`]);
}
