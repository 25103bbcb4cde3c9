import { grade } from '../grade.js';
import type { ChangesSummary, IccSide, Snapshot } from '../report/snapshot.js';
import type { Report } from '../report/types.js';
import type { Roles } from '../roles/types.js';
import { render, resolveParams, sortFindings } from '../rules/engine.js';
import type { Finding } from '../rules/types.js';
import { iccDifference } from '../stats/icc-difference.js';
import type { OutcomeStats } from '../stats/types.js';
import { findingKey } from './finding-key.js';
import type { AnyChangeRule, Baseline, ChangeContext, Measured } from './types.js';

/** Run every enabled change check; its findings come marked `change: true`, in report order. */
export function runChanges(
  catalogue: readonly AnyChangeRule[],
  base: Omit<ChangeContext<unknown>, 'params'>,
  options: { includeValues: boolean },
): Finding[] {
  const out: Finding[] = [];
  for (const rule of catalogue) {
    const params = resolveParams(rule, base.roles);
    if (params === 'off') continue;
    const setting = base.roles.rules[rule.meta.id];
    const forced = setting && setting !== 'off' ? setting.severity : undefined;
    for (const draft of rule.check({ ...base, params })) out.push({ ...render(rule, draft, forced, options), change: true });
  }
  return sortFindings(out);
}

/**
 * The report with the comparison added: the change findings among its findings (graded with
 * them, so the gate sees both) and the `changes` summary.
 */
export function withChanges(
  report: Report,
  measured: Measured,
  baseline: Baseline,
  roles: Roles,
  catalogue: readonly AnyChangeRule[],
  options: { includeValues: boolean },
): Report {
  const current = { snapshot: measured.snapshot, findings: report.findings, outcomes: report.outcomes };
  const changes = runChanges(catalogue, { roles, previous: baseline, current, measured }, options);
  const findings = sortFindings([...report.findings, ...changes]);
  const changed = summary(report, measured.snapshot, baseline, measured.skipped);
  const input = { ...report.input, notes: [...(report.input.notes ?? []), ...changeNotes(changed)] };
  return { ...report, input, findings, ...grade(findings), changes: changed };
}

/** The comparison in words for the report's notes, which every renderer shows under the input. */
function changeNotes(c: ChangesSummary): string[] {
  const how = c.previous.from === 'report' ? 'read from its report' : 'audited as a file';
  const r = (x: number | null) => (x === null ? 'n/a' : String(Math.round(x * 1000) / 1000));
  const notes = [
    `compared with the previous delivery ${c.previous.path} (${how}): ${c.groups.both} groups in both, ${c.groups.appeared} appeared, ` +
      `${c.groups.vanished} vanished; audit findings ${c.findings.new} new, ${c.findings.resolved} resolved, ` +
      `${c.findings.persisting} persisting`,
  ];
  for (const [name, o] of Object.entries(c.outcomes)) {
    const icc = (s: IccSide) => `${r(s.icc)} [${r(s.ci95[0])}, ${r(s.ci95[1])}]`;
    notes.push(
      `${name}: ICC(1) ${icc(o.previous)} before, ${icc(o.current)} now; REML between-group variance ${r(o.previous.tau2)} → ` +
        `${r(o.current.tau2)}, within ${r(o.previous.sigma2)} → ${r(o.current.sigma2)}; difference z = ${r(o.z)}, p = ${r(o.p)}`,
    );
  }
  for (const why of c.skipped) notes.push(`not checked: ${why}`);
  return notes;
}

/** Only the change findings, graded on their own: what `nestready compare` reports and gates on. */
export function changesOnly(report: Report): Report {
  const findings = report.findings.filter((f) => f.change);
  return { ...report, findings, ...grade(findings) };
}

function summary(report: Report, current: Snapshot, baseline: Baseline, skipped: string[]): ChangesSummary {
  const prev = baseline.report;
  const before = new Set(prev.snapshot.groups.ids);
  const now = new Set(current.groups.ids);
  const both = [...now].filter((g) => before.has(g)).length;
  const oldKeys = new Set(prev.findings.filter((f) => !f.change).map(findingKey));
  const newKeys = new Set(report.findings.filter((f) => !f.change).map(findingKey));
  const persisting = [...newKeys].filter((k) => oldKeys.has(k)).length;
  const outcomes: ChangesSummary['outcomes'] = {};
  for (const [name, cur] of Object.entries(report.outcomes)) {
    const old = prev.outcomes[name];
    if (!old) continue;
    const test = iccDifference(old.anova, cur.anova);
    outcomes[name] = { previous: side(old), current: side(cur), z: finite(test.z), p: finite(test.p) };
  }
  return {
    previous: { path: prev.input.path, rows: prev.input.rows, groups: prev.groups.count, from: baseline.from },
    groups: { both, appeared: now.size - both, vanished: before.size - both },
    findings: { new: newKeys.size - persisting, resolved: oldKeys.size - persisting, persisting },
    outcomes,
    skipped,
  };
}

function side(o: OutcomeStats): IccSide {
  return {
    icc: finite(o.anova.icc),
    ci95: [finite(o.anova.ci95[0]), finite(o.anova.ci95[1])],
    tau2: finite(o.reml.tau2),
    sigma2: finite(o.reml.sigma2),
  };
}

const finite = (x: number | null | undefined) => (typeof x === 'number' && Number.isFinite(x) ? x : null);
