import { Chalk } from 'chalk';
import type { ChalkInstance } from 'chalk';
import type { Finding } from '../rules/types.js';
import { formatNumber, formatP } from '../util/format.js';
import { listed, shownValues } from './finding-parts.js';
import { HEADINGS, MARKS, SEVERITIES, THRESHOLD_CAVEAT, VERDICT_TEXT } from './labels.js';
import type { Report } from './types.js';

export interface TextOptions {
  /** chalk colour level: 0 none … 3 truecolor */
  color: 0 | 1 | 2 | 3;
}

/** Terminal report, read top-down: verdict, then findings with the fix to ask for, then statistics. */
export function renderText(report: Report, options: TextOptions): string {
  const c = new Chalk({ level: options.color });
  const tone = palette(c);
  const out: string[] = [];
  const verdictTone = report.verdict === 'ready' ? tone.ok : report.verdict === 'caveats' ? tone.warning : tone.blocker;
  out.push(verdictTone(`${VERDICT_TEXT[report.verdict]}  grade ${report.grade}  score ${report.score}/100`));
  out.push(
    tone.dim(
      `${report.input.path}: ${report.input.rows} records in ${report.groups.count} groups` +
        (report.input.rowsRejected ? `, ${report.input.rowsRejected} unreadable lines` : '') +
        ` (group ID: ${report.roles.group})`,
    ),
  );
  out.push('');
  for (const severity of SEVERITIES) {
    const list = report.findings.filter((f) => f.severity === severity);
    if (!list.length) continue;
    out.push(c.bold(`${HEADINGS[severity]} (${list.length})`));
    for (const f of list) out.push(...findingLines(f, tone[severity], tone.dim));
    out.push('');
  }
  if (!report.findings.length) out.push(tone.ok('No findings.'), '');
  out.push(...statisticsLines(report, c));
  out.push('');
  out.push(tone.dim(THRESHOLD_CAVEAT));
  return `${out.join('\n')}\n`;
}

function palette(c: ChalkInstance) {
  // our own colours; severity is also carried by the [X]/[!]/[i] marks and headings, never colour alone
  return {
    blocker: c.hex('#c2185b').bold,
    warning: c.hex('#b26a00'),
    note: c.hex('#1e6fa8'),
    ok: c.hex('#2e7d32').bold,
    dim: c.gray,
  };
}

function findingLines(f: Finding, tone: (s: string) => string, dim: (s: string) => string): string[] {
  const lines = [`  ${tone(MARKS[f.severity])} ${tone(f.rule)}${f.column ? ` (${f.column})` : ''}: ${f.message}`];
  lines.push(`      ask for: ${f.fix}`);
  if (f.groups?.length) lines.push(dim(`      groups: ${listed(f.groups, f.count)}`));
  if (f.rows?.length) lines.push(dim(`      records: ${listed(f.rows.map(String), undefined)}`));
  const values = shownValues(f);
  if (values.length) lines.push(dim(`      values: ${values.join('; ')}`));
  return lines;
}

function statisticsLines(report: Report, c: ChalkInstance): string[] {
  const s = report.groups.sizes;
  const lines = [
    c.bold('Statistics'),
    `  groups ${report.groups.count}, singletons ${report.groups.singletons}, group size min ${s.min} / median ${formatNumber(s.median, 1)} / mean ${formatNumber(s.mean, 1)} / max ${s.max}`,
  ];
  for (const [name, o] of Object.entries(report.outcomes)) {
    lines.push(`  outcome ${c.bold(name)}: n ${o.n} in ${o.groups} groups, mean ${formatNumber(o.mean, 3)}`);
    const row = (label: string, v: { tau2: number; sigma2: number; icc: number; logLik: number }) =>
      `    ${label.padEnd(6)} tau2 ${formatNumber(v.tau2, 4).padStart(10)}  sigma2 ${formatNumber(v.sigma2, 4).padStart(10)}  ICC ${formatNumber(v.icc, 4)}  logLik ${formatNumber(v.logLik, 2)}`;
    lines.push(row('REML', o.reml), row('ML', o.ml));
    const a = o.anova;
    lines.push(
      `    ANOVA  ICC(1) ${formatNumber(a.icc, 4)} [95% ${formatNumber(a.ci95[0], 4)}, ${formatNumber(a.ci95[1], 4)}]  ICC(2) ${formatNumber(a.icc2, 4)}  F ${formatNumber(a.f, 3)} on (${a.df1}, ${a.df2}) df, p ${formatP(a.p)}`,
      `    design effect ${formatNumber(o.designEffect, 3)}, effective N ${formatNumber(o.effectiveN, 1)}, mean reliability of group means ${formatNumber(o.meanReliability, 3)}`,
    );
  }
  return lines;
}
