import type { ChalkInstance } from 'chalk';
import { Chalk } from 'chalk';
import type { Finding } from '../rules/types.js';
import type { Severity } from '../severity.js';
import { SEVERITIES, SEVERITY_ACTION, SEVERITY_SHAPE, SEVERITY_WORD } from '../severity.js';
import { formatNumber, pClause } from '../util/format.js';
import { bySeverity, listed, listedGroups, origin, shownValues } from './finding-parts.js';
import { gradeLine, SCORE_RULE, THRESHOLD_CAVEAT, verdictSentence } from './labels.js';
import { planTextLines } from './plan-text.js';
import { poissonTable } from './poisson-table.js';
import { readingLines } from './reading.js';
import { threeLevelLines } from './three-level-table.js';
import type { Report } from './types.js';
import { MARKER_LEGEND, showsMarkers, visibleText } from './visible.js';

export interface TextOptions {
  /** chalk colour level: 0 none … 3 truecolor */
  color: 0 | 1 | 2 | 3;
}

/** Width of the severity column: number, shape and word, so that every message starts at one place. */
const WORD_WIDTH = Math.max(...SEVERITIES.map((s) => SEVERITY_WORD[s].one.length));
const GUTTER = ' '.repeat(3 + 2 + 2 + WORD_WIDTH + 2);

/**
 * Terminal report, read top-down: the verdict as a sentence about the delivery, grade and score
 * below it, then the findings numbered through (so a reply to the sender can name them), each
 * with its severity as a word in a fixed column, the fix to ask for and the rule after it, then
 * the statistics.
 */
export function renderText(report: Report, options: TextOptions): string {
  const c = new Chalk({ level: options.color });
  const tone = palette(c);
  const out: string[] = [];
  const verdictTone = report.verdict === 'ready' ? tone.ok : report.verdict === 'caveats' ? tone.warning : tone.blocker;
  out.push(verdictTone(verdictSentence(report)));
  out.push(`${gradeLine(report)} ${tone.dim(`(${SCORE_RULE})`)}`);
  out.push(
    tone.dim(
      `${report.input.path}: ${report.input.rows} records in ${report.groups.count} groups` +
        (report.input.rowsRejected ? `, ${report.input.rowsRejected} unreadable lines` : '') +
        ` (group ID: ${report.roles.group})`,
    ),
  );
  out.push(...readingLines(report.input.reading).map((r) => tone.dim(r)));
  for (const note of report.input.notes ?? []) out.push(tone.warning(`note: ${note}`));
  out.push('');
  let number = 0;
  for (const severity of SEVERITIES) {
    const list = bySeverity(report.findings, severity);
    if (!list.length) continue;
    out.push(c.bold(`${SEVERITY_ACTION[severity].heading} (${list.length})`));
    for (const f of list) out.push(...findingLines(++number, f, tone[severity], tone.dim), '');
  }
  if (!report.findings.length) out.push(tone.ok('No findings: every rule that ran passed.'), '');
  out.push(...statisticsLines(report, c));
  out.push(...planTextLines(report, c));
  out.push('');
  if (showsMarkers(out.join('\n'))) out.push(tone.dim(MARKER_LEGEND));
  out.push(tone.dim(THRESHOLD_CAVEAT));
  return `${out.join('\n')}\n`;
}

function palette(c: ChalkInstance) {
  // our own colours; severity is also carried by the word and shape in its column, never colour alone
  return {
    blocker: c.hex('#c2185b').bold,
    warning: c.hex('#b26a00'),
    note: c.hex('#1e6fa8'),
    ok: c.hex('#2e7d32').bold,
    dim: c.gray,
  };
}

/** The severity column of a finding's first line: "  3  ◆ warning  ". */
function severityColumn(number: number, severity: Severity): string {
  return `${String(number).padStart(3)}  ${SEVERITY_SHAPE[severity]} ${SEVERITY_WORD[severity].one.padEnd(WORD_WIDTH)}  `;
}

function findingLines(number: number, f: Finding, tone: (s: string) => string, dim: (s: string) => string): string[] {
  const lines = [`${tone(severityColumn(number, f.severity))}${visibleText(f.message)}`];
  lines.push(`${GUTTER}ask for: ${visibleText(f.fix)}`);
  if (f.groups?.length) lines.push(dim(`${GUTTER}groups: ${listedGroups(f)}`));
  if (f.rows?.length) lines.push(dim(`${GUTTER}records: ${listed(f.rows.map(String), undefined)}`));
  const values = shownValues(f);
  if (values.length) lines.push(dim(`${GUTTER}values: ${values.join('; ')}`));
  lines.push(dim(`${GUTTER}${origin(f)}`));
  return lines;
}

function statisticsLines(report: Report, c: ChalkInstance): string[] {
  const s = report.groups.sizes;
  const lines = [
    c.bold('Statistics'),
    `  groups ${report.groups.count}, singletons ${report.groups.singletons}, group size min ${s.min} / median ` +
      `${formatNumber(s.median, 1)} / mean ${formatNumber(s.mean, 1)} / max ${s.max}`,
  ];
  for (const [name, o] of Object.entries(report.outcomes)) {
    lines.push(`  outcome ${c.bold(name)}: n ${o.n} in ${o.groups} groups, mean ${formatNumber(o.mean, 3)}`);
    const row = (label: string, v: { tau2: number; sigma2: number; icc: number; logLik: number }) =>
      `    ${label.padEnd(6)} tau2 ${formatNumber(v.tau2, 4).padStart(10)}  sigma2 ${formatNumber(v.sigma2, 4).padStart(10)}  ICC ` +
      `${formatNumber(v.icc, 4)}  logLik ${formatNumber(v.logLik, 2)}`;
    lines.push(row('REML', o.reml), row('ML', o.ml));
    const a = o.anova;
    lines.push(
      `    ANOVA  ICC(1) ${formatNumber(a.icc, 4)} [95% ${formatNumber(a.ci95[0], 4)}, ${formatNumber(a.ci95[1], 4)}]  ICC(2) ` +
        `${formatNumber(a.icc2, 4)}  F ${formatNumber(a.f, 3)} on (${a.df1}, ${a.df2}) df, ${pClause(a.p)}`,
      `    design effect ${formatNumber(o.designEffect, 3)}, effective N ${formatNumber(o.effectiveN, 1)}, mean reliability of group ` +
        `means ${formatNumber(o.meanReliability, 3)}`,
    );
    const poisson = poissonTable(name, o);
    if (poisson) lines.push(`    ${poisson.caption.slice(name.length + 2)}`, ...poisson.rows.map(([k, v]) => `      ${k}: ${v}`));
    lines.push(...threeLevelLines(o));
  }
  return lines;
}
