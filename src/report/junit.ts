import type { Finding } from '../rules/types.js';
import type { FailOn } from '../severity.js';
import { failsGate } from '../severity.js';
import { listed, listedGroups, origin } from './finding-parts.js';
import type { Report, RuleRun } from './types.js';
import { visibleText, visibleValue } from './visible.js';
import { xmlAttr, xmlText } from './xml-escape.js';

export interface JunitOptions {
  /** findings at or above this severity fail their test case (as the CLI's exit code) */
  failOn: FailOn;
}

/**
 * The gate as JUnit XML, so CI systems show it natively: one <testsuite> for the delivery and one
 * <testcase> per rule that ran (report.rulesRun), failing when the rule has a finding at or above
 * `failOn`. A rule without a finding is a passing test case; findings below the gate go to the
 * test case's <system-out>. Without rulesRun (an older report), test cases come from the findings.
 */
export function renderJunit(report: Report, options: JunitOptions): string {
  const failing = (f: Finding) => failsGate(f.severity, options.failOn);
  const rules: RuleRun[] = [...(report.rulesRun ?? [])];
  for (const f of report.findings) {
    if (!rules.some((r) => r.id === f.rule)) rules.push({ id: f.rule, title: f.rule, level: 'data' });
  }
  let failures = 0;
  const cases = rules.map((rule) => {
    const mine = report.findings.filter((f) => f.rule === rule.id);
    const failed = mine.filter(failing);
    const other = mine.filter((f) => !failing(f));
    if (failed.length) failures++;
    const body: string[] = [];
    if (failed.length) {
      const first = visibleText(failed[0].message);
      const message = failed.length === 1 ? first : `${failed.length} findings; first: ${first}`;
      body.push(
        `      <failure message="${xmlAttr(message)}" type="${xmlAttr(failed[0].severity)}">` +
          `${xmlText(failed.map(findingText).join('\n\n'))}</failure>`,
      );
    }
    if (other.length) body.push(`      <system-out>${xmlText(other.map(findingText).join('\n\n'))}</system-out>`);
    const open = `    <testcase name="${xmlAttr(rule.id)}" classname="${xmlAttr(`nestready.${rule.level}`)}" time="0"`;
    return body.length ? `${open}>\n${body.join('\n')}\n    </testcase>` : `${open}/>`;
  });
  const counts = `tests="${rules.length}" failures="${failures}" errors="0" skipped="0" time="0"`;
  const props = [
    ['verdict', report.verdict],
    ['grade', report.grade],
    ['score', String(report.score)],
    ['fail-on', options.failOn],
    ['records', String(report.input.rows)],
    ['groups', String(report.groups.count)],
    ['tool', `${report.tool.name} ${report.tool.version}`],
  ]
    .map(([name, value]) => `      <property name="${xmlAttr(name)}" value="${xmlAttr(value)}"/>`)
    .join('\n');
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<testsuites name="nestready" ${counts}>`,
    `  <testsuite name="${xmlAttr(`nestready: ${report.input.path}`)}" ${counts}>`,
    '    <properties>',
    props,
    '    </properties>',
    ...cases,
    '  </testsuite>',
    '</testsuites>',
    '',
  ].join('\n');
}

function findingText(f: Finding): string {
  const lines = [`${f.severity}: ${visibleText(f.message)}`, `ask for: ${visibleText(f.fix)}`];
  if (f.groups?.length) lines.push(`groups: ${listedGroups(f)}`);
  if (f.rows?.length) lines.push(`records: ${listed(f.rows.map(String))}`);
  if (f.values?.length) lines.push(`values: ${f.values.map(visibleValue).join('; ')}`);
  lines.push(origin(f));
  return lines.join('\n');
}
