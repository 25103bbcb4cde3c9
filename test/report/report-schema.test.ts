import { describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import { renderJson } from '../../src/report/json.js';
import { reportSchema } from '../../src/report/report-schema.js';
import { parseRoles } from '../../src/roles/load.js';
import { loadRoles } from '../../src/roles/load-file.js';
import { createAjv } from '../../src/util/ajv.js';
import { demoReport } from './fixtures/reports.js';

const validate = createAjv({ checkSchemas: true }).compile(reportSchema);
const check = (json: unknown) => {
  const ok = validate(json);
  return ok ? [] : (validate.errors ?? []).map((e) => `${e.instancePath} ${e.message}`);
};
const demoRoles = () => loadRoles('fixtures/demo/repairs-delivery.roles.yaml', catalogue);
const demo = (includeValues = true) =>
  audit('fixtures/demo/repairs-delivery.csv', demoRoles(), { threads: 1, includeValues, plotData: false });

describe("the report's JSON Schema", () => {
  it('accepts the frozen demo report', () => {
    expect(check(demoReport())).toEqual([]);
  });

  it("accepts the demo delivery's report as --format json writes it, and each finding names its message", async () => {
    const json = JSON.parse(renderJson(await demo()));
    expect(check(json)).toEqual([]);
    for (const f of json.findings) expect(Object.keys(catalogue.find((r) => r.meta.id === f.rule)!.meta.messages)).toContain(f.messageId);
  });

  it('accepts the HSB report', async () => {
    const yaml = 'group: school\nunit: student\noutcome: mathach\nlevel1: [ses, minority, sex]\nlevel2: [sector, size, meanses]\n';
    const roles = parseRoles(yaml, 'hsb.yaml', catalogue);
    const json = JSON.parse(renderJson(await audit('fixtures/reference/hsb.csv', roles, { threads: 1, plotData: false })));
    expect(check(json)).toEqual([]);
    expect(json.outcomes.mathach.n).toBe(7185);
  });

  it('accepts a report that states how values were read (decimal commas, words as 0/1, the word named as 1)', () => {
    const report = demoReport() as unknown as { input: Record<string, unknown>; roles: Record<string, unknown> };
    report.input.reading = { decimalComma: true, binary: { fixed: { one: 'no', zero: 'yes', written: { one: 'No', zero: 'Yes' } } } };
    report.roles.binaryOne = { fixed: 'No' };
    expect(check(report)).toEqual([]);
    report.input.reading = { binary: { fixed: { one: 'no' } } };
    expect(check(report)).toEqual(["/input/reading/binary/fixed must have required property 'zero'"]);
  });

  it('rejects a finding without its messageId', () => {
    const report = demoReport() as unknown as { findings: Record<string, unknown>[] };
    delete report.findings[0].messageId;
    expect(check(report)).toContain("/findings/0 must have required property 'messageId'");
  });

  it("with --no-values, no raw value reaches a finding's data or text", async () => {
    const shown = await demo(true);
    const withheld = await demo(false);
    expect(withheld.findings.map((f) => [f.rule, f.messageId, f.data])).toEqual(shown.findings.map((f) => [f.rule, f.messageId, f.data]));
    const raw = shown.findings.flatMap((f) => f.values ?? []);
    expect(raw.length).toBeGreaterThan(0);
    const text = JSON.stringify(withheld.findings);
    for (const v of raw) expect(text).not.toContain(v);
    expect(withheld.findings.some((f) => 'values' in f)).toBe(false);
  });
});
