import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import type { FailOn } from '../../src/grade.js';
import { renderJunit } from '../../src/report/junit.js';
import type { Report } from '../../src/report/types.js';
import { xmlAttr, xmlText } from '../../src/report/xml-escape.js';
import { demoReport, HOSTILE, hostileReport } from './fixtures/reports.js';

interface Case {
  name: string;
  classname: string;
  failure?: { message: string; type: string; '#text': string };
  'system-out'?: string;
}

/** Parse JUnit XML the way CI systems read it: testsuites > testsuite > testcase (> failure). */
function parse(xml: string) {
  expect(XMLValidator.validate(xml)).toBe(true);
  const doc = new XMLParser({
    ignoreAttributes: false,
    attributeNamePrefix: '',
    parseAttributeValue: false,
    isArray: (name) => ['testsuite', 'testcase', 'property'].includes(name),
  }).parse(xml);
  const suites = doc.testsuites;
  expect(suites).toBeDefined();
  expect(suites.testsuite).toHaveLength(1);
  const suite = suites.testsuite[0];
  return { suites, suite, cases: suite.testcase as Case[] };
}

function run(report: Report, failOn: FailOn) {
  return parse(renderJunit(report, { failOn }));
}

describe('renderJunit', () => {
  it('has one test case per rule that ran; blockers fail by default', () => {
    const report = demoReport();
    const { suites, suite, cases } = run(report, 'blocker');
    expect(cases.map((c) => c.name)).toEqual(report.rulesRun!.map((r) => r.id));
    expect(cases.every((c) => c.classname.startsWith('nestready.'))).toBe(true);
    const failed = cases.filter((c) => c.failure).map((c) => c.name);
    expect(failed).toEqual(['level2-varies', 'missing-group-id']);
    for (const s of [suites, suite]) {
      expect(s.tests).toBe(String(cases.length));
      expect(s.failures).toBe('2');
      expect(s.errors).toBe('0');
    }
    const l2 = cases.find((c) => c.name === 'level2-varies')!;
    expect(l2.failure!.type).toBe('blocker');
    expect(l2.failure!['#text']).toContain('records: 305, 918, 1768');
    // the note is reported but does not fail
    const singles = cases.find((c) => c.name === 'singleton-groups')!;
    expect(singles.failure).toBeUndefined();
    expect(singles['system-out']).toContain('4 of 66 groups');
    // rules with no finding pass
    expect(cases.find((c) => c.name === 'few-groups')).toEqual({ name: 'few-groups', classname: 'nestready.structure', time: '0' });
    const props = Object.fromEntries(suite.properties.property.map((p: { name: string; value: string }) => [p.name, p.value]));
    expect(props).toMatchObject({ verdict: 'not-ready', grade: 'F', score: String(report.score), 'fail-on': 'blocker' });
  });

  it('follows --fail-on: warnings fail with "warning", nothing fails with "never"', () => {
    const report = demoReport();
    report.findings[0] = { ...report.findings[0], severity: 'warning' };
    report.findings.splice(1, 1); // level2-varies now only has a warning
    expect(
      run(report, 'blocker')
        .cases.filter((c) => c.failure)
        .map((c) => c.name),
    ).toEqual(['missing-group-id']);
    expect(
      run(report, 'warning')
        .cases.filter((c) => c.failure)
        .map((c) => c.name),
    ).toEqual(['level2-varies', 'missing-group-id']);
    const never = run(report, 'never');
    expect(never.suite.failures).toBe('0');
    expect(never.cases.filter((c) => c['system-out']).length).toBe(3);
  });

  it('without rulesRun, builds test cases from the findings', () => {
    const report = demoReport();
    delete report.rulesRun;
    expect(run(report, 'blocker').cases.map((c) => c.name)).toEqual(['level2-varies', 'missing-group-id', 'singleton-groups']);
  });

  it('escapes hostile text: still well-formed, text round-trips, control characters replaced', () => {
    const report = hostileReport();
    const { cases, suite } = run(report, 'blocker');
    const f = cases.find((c) => c.failure)!.failure!;
    expect(f.message).toContain('<script>window.__pwned = 1</script>');
    expect(f.message).toContain('a & b < c > d "e"');
    expect(f.message).not.toMatch(/[\u0001\u0008]/);
    expect(suite.name).toBe(`nestready: ${HOSTILE.script}.csv`);
  });

  it('xmlText and xmlAttr', () => {
    expect(xmlText(`<a href="x">&'`)).toBe('&lt;a href=&quot;x&quot;&gt;&amp;&apos;');
    expect(xmlText('a\u0000b\u001fc\ud800d')).toBe('a\ufffdb\ufffdc\ufffdd');
    expect(xmlText('ok 😀')).toBe('ok 😀');
    expect(xmlAttr('a\nb\tc')).toBe('a&#10;b&#9;c');
  });
});
