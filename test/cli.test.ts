import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { catalogue } from '../rules/index.js';
import type { Report } from '../src/report/types.js';
import { SEVERITY_ORDER } from '../src/severity.js';
import { createAjv } from '../src/util/ajv.js';
import type { Run } from './helpers/cli.js';
import { cliScratch, nestready } from './helpers/cli.js';
import { groupedRows, toCsv } from './helpers/delivery.js';

/** Exit 2, nothing on stdout, exactly one line on stderr and no stack trace. */
function expectUsageError(run: Run): string {
  expect(run.code, run.stderr).toBe(2);
  expect(run.stdout).toBe('');
  expect(run.stderr.endsWith('\n')).toBe(true);
  expect(run.stderr.trimEnd().split('\n'), run.stderr).toHaveLength(1);
  expect(run.stderr).not.toContain('    at ');
  expect(run.stderr).not.toMatch(/internal error/);
  return run.stderr.trimEnd();
}

const DEMO = 'fixtures/demo';
const delivery = [`${DEMO}/repairs-delivery.csv`, '-r', `${DEMO}/repairs-delivery.roles.yaml`];
const clean = [`${DEMO}/repairs-clean.csv`, '-r', `${DEMO}/repairs-clean.roles.yaml`];
const STABLE_KEYS = ['schema', 'tool', 'input', 'roles', 'groups', 'outcomes', 'findings', 'fitAdvice', 'score', 'grade', 'verdict'];

/** A run several tests read: started once, on first use. */
const shared = new Map<string, Promise<Run>>();
const once = (...args: string[]) => {
  const k = JSON.stringify(args);
  if (!shared.has(k)) shared.set(k, nestready(...args));
  return shared.get(k)!;
};
const deliveryJson = () => once('audit', ...delivery, '--format', 'json');

const scratch = cliScratch('nestready-cli-');
const file = scratch.file;

describe.concurrent('nestready audit: exit codes', () => {
  it('exit 0 on the clean demo delivery', async ({ expect }) => {
    const run = await nestready('audit', ...clean);
    expect(run.code, run.stderr).toBe(0);
    expect(run.stderr).toBe('');
    // the clean demo has notes only (e.g. predictor-between-share reports every level-1 predictor)
    expect(run.stdout).toMatch(/^Ready for a multilevel model: \d+ notes? for the record\.\ngrade A, score \d+ of 100 \(/);
    expect(run.stdout).not.toMatch(/Blockers|Warnings|blocker {2}|warning {2}/);
    expect(run.stdout).not.toMatch(/\x1b\[/); // NO_COLOR
  });

  it('exit 1 on the delivery with planted defects; the text report says what to ask for', async ({ expect }) => {
    const run = await nestready('audit', ...delivery);
    expect(run.code, run.stderr).toBe(1);
    expect(run.stderr).toBe('');
    const [sentence, gradeLine] = run.stdout.split('\n');
    expect(sentence).toMatch(/^Not ready for a multilevel model: 4 blockers to send back, 2 warnings to settle, \d+ notes /);
    expect(gradeLine).toMatch(/^grade F, score 0 of 100 \(/);
    expect(run.stdout).toContain('Blockers: send back to the sender (4)');
    // severity as a word in a fixed column, numbered through; the rule said plainly after the message
    expect(run.stdout).toMatch(/^ {2}4 {2}■ blocker {2}10 of 3007 records have no workshop/m);
    expect(run.stdout).toMatch(/^ {2}5 {2}◆ warning {2}/m);
    expect(run.stdout).toMatch(/^ {16}rule missing-group-id, column workshop$/m);
    expect(run.stdout).not.toMatch(/\[X\]|\[!\]|\[i\]/);
    expect(run.stdout).toContain('ask for: Ask the sender to supply workshop for the listed records');
    expect(run.stdout).toContain('records: 309, 609, 742, 817, 1147, 1526, 1546, 1564, 2738, 2983');
    expect(run.stdout).not.toMatch(/\x1b\[/);
  });

  it('--fail-on never: exit 0 even with blockers, the report is still written', async ({ expect }) => {
    const run = await nestready('audit', ...delivery, '--fail-on', 'never');
    expect(run.code).toBe(0);
    expect(run.stdout).toMatch(/^Not ready for a multilevel model: /);
  });

  it('--fail-on warning: a warning fails the gate, by default it does not', async ({ expect }) => {
    // 20 groups of 2: few-groups warning (fewer than 30), nothing worse (notes aside: small-groups)
    const csv = file('twenty.csv', toCsv(groupedRows(20, 2, (j, i) => ({ y: j + 2 * i }))));
    const roles = file('twenty.yaml', 'group: g\n');
    const json = await nestready('audit', csv, '-r', roles, '--format', 'json');
    const report = JSON.parse(json.stdout) as Report;
    expect(report.findings.filter((f) => f.severity !== 'note').map((f) => [f.rule, f.severity])).toEqual([['few-groups', 'warning']]);
    expect(json.code).toBe(0); // --fail-on blocker is the default
    const [warning, never] = await Promise.all([
      nestready('audit', csv, '-r', roles, '--fail-on', 'warning'),
      nestready('audit', csv, '-r', roles, '--fail-on', 'never'),
    ]);
    expect(warning.code).toBe(1);
    expect(warning.stdout).toMatch(/^Ready for a multilevel model, with caveats: 1 warning to settle/);
    expect(never.code).toBe(0);
  });

  it('a header-only CSV (no records) is an input error saying so: exit 2, one line naming the file', async ({ expect }) => {
    const csv = file('header-only.csv', 'g,y\n');
    const roles = file('header-only.yaml', 'group: g\noutcome: y\n');
    const run = await nestready('audit', csv, '-r', roles, '--format', 'json');
    expect(run.code, run.stderr).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toBe(`nestready: ${csv}: no records (a header and nothing under it)\n`);
  });
});

describe.concurrent('nestready audit --out: where the files went', () => {
  it('says on stderr where it wrote each --out file, one line each, and nothing with --quiet', async ({ expect }) => {
    const names = ['wrote.html', 'wrote.json', 'wrote-quiet.html', 'wrote-quiet.json'];
    const [html, json, quietHtml, quietJson] = names.map((n) => join(scratch.dir(), n));
    const [loud, quiet] = await Promise.all([
      nestready('audit', ...clean, '--out', html, '--out', json),
      nestready('audit', ...clean, '--out', quietHtml, '--out', quietJson, '-q'),
    ]);
    expect(loud.code, loud.stderr).toBe(0);
    expect(loud.stdout).toBe('');
    expect(loud.stderr).toBe(`nestready: wrote the HTML report to ${html}\nnestready: wrote the JSON report to ${json}\n`);
    expect(existsSync(html) && existsSync(json)).toBe(true);
    expect(quiet.code, quiet.stderr).toBe(0);
    expect(quiet.stderr).toBe('');
    expect(existsSync(quietHtml) && existsSync(quietJson)).toBe(true);
  });

  it('says nothing when the report goes to stdout', async ({ expect }) => {
    const run = await once('audit', ...clean);
    expect(run.stderr).toBe('');
  });
});

describe.concurrent('nestready audit: usage and input errors exit 2 with one line', () => {
  it("a --memory-limit below what DuckDB's readers need is raised to the need: no out-of-memory error", async ({ expect }) => {
    // DuckDB's CSV sniffer needs a buffer of about 30 MiB, so 10MB alone cannot work for any file
    const run = await nestready('audit', ...clean, '--memory-limit', '10MB');
    expect(run.code, run.stderr).toBe(0);
    expect(run.stderr).toBe('');
  });

  it('malformed YAML: the role map file and line:col', async ({ expect }) => {
    const roles = file('bad.yaml', 'group: workshop\nlevel1: [item_kind, helpers]]\n');
    const line = expectUsageError(await nestready('audit', `${DEMO}/repairs-clean.csv`, '-r', roles));
    expect(line).toBe(`nestready: ${roles}:2:29: invalid YAML: Unexpected flow-seq-end token in YAML stream: "]"`);
  });

  it('an invalid role map (unknown key) points at the key', async ({ expect }) => {
    const roles = file('unknown-key.yaml', 'group: workshop\nlevel3: [x]\n');
    const line = expectUsageError(await nestready('audit', `${DEMO}/repairs-clean.csv`, '-r', roles));
    expect(line).toBe(`nestready: ${roles}:2:1: the role map: unknown key "level3" (did you mean "level1"?)`);
  });

  it('an unknown column: where it is named, and the header', async ({ expect }) => {
    const roles = file('unknown-column.yaml', 'group: workshop\noutcome: repair_minutes\nlevel2: [workshop_format, staff]\n');
    const line = expectUsageError(await nestready('audit', `${DEMO}/repairs-clean.csv`, '-r', roles));
    expect(line).toBe(
      `nestready: ${roles}:3:27: column "staff" is not in ${DEMO}/repairs-clean.csv; its header is: ` +
        'job_id, workshop, network, repair_minutes, fixed, item_kind, item_age_years, helpers, workshop_format, benches, opened_year',
    );
  });

  it('a missing delivery file', async ({ expect }) => {
    const line = expectUsageError(await nestready('audit', 'no/such/file.csv', '-r', `${DEMO}/repairs-clean.roles.yaml`));
    expect(line).toBe('nestready: no/such/file.csv: cannot read the delivery (ENOENT)');
  });

  it('a missing role map file', async ({ expect }) => {
    const line = expectUsageError(await nestready('audit', `${DEMO}/repairs-clean.csv`, '-r', 'no/such/roles.yaml'));
    expect(line).toBe('nestready: no/such/roles.yaml: cannot read the role map (ENOENT)');
  });

  it('a directory without a delivery (a directory is a batch: README, Auditing a folder)', async ({ expect }) => {
    const empty = join(scratch.dir(), 'no-deliveries');
    mkdirSync(empty);
    writeFileSync(join(empty, 'notes.md'), '# nothing to audit\n');
    const line = expectUsageError(await nestready('audit', empty, '-r', `${DEMO}/repairs-clean.roles.yaml`));
    expect(line).toBe(`nestready: ${empty}: no delivery found (1 file(s) skipped: their names name no delivery format)`);
  });

  it('an empty (0-byte) delivery', async ({ expect }) => {
    const csv = file('empty.csv', '');
    const line = expectUsageError(await nestready('audit', csv, '-r', `${DEMO}/repairs-clean.roles.yaml`));
    expect(line).toBe(`nestready: ${csv}: the file is empty (no header, no records)`);
  });

  it('an unknown option', async ({ expect }) => {
    const line = expectUsageError(await nestready('audit', ...clean, '--bogus'));
    expect(line).toMatch(/unknown option '--bogus'/);
  });

  it('a bad --fail-on value', async ({ expect }) => {
    const line = expectUsageError(await nestready('audit', ...clean, '--fail-on', 'sometimes'));
    expect(line).toMatch(/'sometimes' is invalid/);
  });

  it('no --roles', async ({ expect }) => {
    const line = expectUsageError(await nestready('audit', `${DEMO}/repairs-clean.csv`));
    expect(line).toMatch(/required option '-r, --roles <file>' not specified/);
  });

  it('an unknown command', async () => {
    expectUsageError(await nestready('inspect', `${DEMO}/repairs-clean.csv`));
  });
});

describe.concurrent('nestready audit --format json', () => {
  it('--out writes the stable report fields, findings with rule/severity/message/fix, sorted', async ({ expect }) => {
    const out = join(scratch.dir(), 'report.json');
    const run = await nestready('audit', ...delivery, '--format', 'json', '--out', out);
    expect(run.code).toBe(1);
    expect(run.stdout).toBe('');
    expect(run.stderr).toBe(`nestready: wrote the JSON report to ${out}\n`);
    const text = readFileSync(out, 'utf8');
    expect(text).not.toMatch(/\x1b\[/);
    const report = JSON.parse(text) as Report;
    // a JSON report also carries the snapshot the next delivery is compared with (README: Snapshot)
    expect(Object.keys(report)).toEqual([...STABLE_KEYS, 'snapshot']);
    expect(report.schema).toBe('nestready/report@1');
    expect(report.tool).toEqual({ name: 'nestready', version: JSON.parse(readFileSync('package.json', 'utf8')).version });
    expect(report.input).toMatchObject({ path: `${DEMO}/repairs-delivery.csv`, rows: 3007, rowsRejected: 0 });
    expect(report.findings.length).toBeGreaterThan(0);
    for (const f of report.findings) {
      expect(typeof f.rule).toBe('string');
      expect(['blocker', 'warning', 'note']).toContain(f.severity);
      expect(f.message.length).toBeGreaterThan(0);
      expect(f.fix.length).toBeGreaterThan(0);
      if (f.groups) expect(f.groups.length).toBeLessThanOrEqual(20);
      if (f.rows) expect(f.rows.length).toBeLessThanOrEqual(20);
    }
    const key = (f: Report['findings'][number]) => [SEVERITY_ORDER[f.severity], f.rule, f.column ?? ''] as const;
    for (let i = 1; i < report.findings.length; i++) {
      const [a, b] = [key(report.findings[i - 1]), key(report.findings[i])];
      const inOrder = a[0] < b[0] || (a[0] === b[0] && (a[1] < b[1] || (a[1] === b[1] && a[2] <= b[2])));
      expect(inOrder, `${JSON.stringify(a)} before ${JSON.stringify(b)}`).toBe(true);
    }
    expect(report.findings.map((f) => `${f.severity} ${f.rule} ${f.column ?? ''}`.trim())).toEqual([
      'blocker id-variants workshop',
      'blocker level2-varies benches',
      'blocker level2-varies workshop_format',
      'blocker missing-group-id workshop',
      'warning duplicate-unit-id job_id',
      'warning non-numeric-values repair_minutes',
      // the demo's repair times are lognormal with a workshop effect, so their spread grows with the workshop mean
      'note level1-variance-heterogeneity repair_minutes',
      'note predictor-between-share helpers',
      'note predictor-between-share item_age_years',
      'note singleton-groups',
      'note unbalanced-groups',
    ]);
    expect(report.outcomes.repair_minutes.reml.icc).toBeGreaterThan(0.1);
  });

  it('the same input gives the same bytes, on stdout and in a file', async ({ expect }) => {
    const [a, b] = [join(scratch.dir(), 'a.json'), join(scratch.dir(), 'b.json')];
    const [ra, rb, rc] = await Promise.all([
      nestready('audit', ...delivery, '--format', 'json', '--out', a),
      nestready('audit', ...delivery, '--format', 'json', '--out', b),
      deliveryJson(),
    ]);
    expect([ra.code, rb.code, rc.code]).toEqual([1, 1, 1]);
    const bytes = readFileSync(a);
    expect(bytes.equals(readFileSync(b))).toBe(true);
    expect(rc.stdout).toBe(bytes.toString('utf8'));
  });

  it('--no-values leaves no raw data value in the JSON; IDs and record numbers stay', async ({ expect }) => {
    const run = await nestready('audit', ...delivery, '--format', 'json', '--no-values');
    expect(run.code).toBe(1);
    for (const raw of ['monthly', 'weekly', 'pop-up', '×']) expect(run.stdout).not.toContain(raw);
    const report = JSON.parse(run.stdout) as Report;
    for (const f of report.findings) expect(f).not.toHaveProperty('values');
    const varies = report.findings.filter((f) => f.rule === 'level2-varies');
    expect(varies.map((f) => f.message)).toEqual([
      'benches is declared level-2 but takes more than one value in 1 group(s): (values withheld)',
      'workshop_format is declared level-2 but takes more than one value in 2 group(s): (values withheld)',
    ]);
    expect(varies[1].groups).toEqual(['W-017', 'W-037']);
    expect(varies[1].rows).toEqual([230, 553, 1067, 1233, 2548]);
    // with values, the same report does carry them
    const withValues = await deliveryJson();
    expect(withValues.stdout).toContain('W-017: weekly ×34 / monthly ×3');
  });

  it('--no-values in the text report too', async ({ expect }) => {
    const run = await nestready('audit', ...delivery, '--no-values');
    expect(run.code).toBe(1);
    expect(run.stdout).not.toContain('monthly');
    expect(run.stdout).toContain('(values withheld)');
  });
});

describe.concurrent('nestready rules and schema', () => {
  it('rules --format json: every rule of the catalogue with its params', async ({ expect }) => {
    const run = await nestready('rules', '--format', 'json');
    expect(run.code).toBe(0);
    const list = JSON.parse(run.stdout) as {
      id: string;
      title: string;
      level: string;
      defaultSeverity: string;
      description: string;
      params: { name: string; default: unknown; description: string }[];
      sources: string[];
    }[];
    expect(list.map((r) => r.id)).toEqual(catalogue.map((r) => r.meta.id));
    for (const r of list) {
      expect(Object.keys(r)).toEqual(['id', 'title', 'level', 'defaultSeverity', 'description', 'params', 'messages', 'sources']);
      expect(r.sources.length).toBeGreaterThan(0);
      // each messageId a finding can carry, with its templates
      expect((r as unknown as { messages: unknown }).messages).toEqual(catalogue.find((c) => c.meta.id === r.id)!.meta.messages);
    }
    const few = list.find((r) => r.id === 'few-groups')!;
    expect(few.params.map((p) => [p.name, p.default])).toEqual([
      ['block_below', 10],
      ['warn_below', 30],
      ['note_below', 50],
    ]);
  });

  it('rules --format md: a table row per rule', async ({ expect }) => {
    const run = await nestready('rules', '--format', 'md');
    expect(run.code).toBe(0);
    const lines = run.stdout.trimEnd().split('\n');
    expect(lines[0]).toBe('| rule | level | default severity | what it catches | params (default) |');
    expect(lines[1]).toBe('|---|---|---|---|---|');
    expect(lines.slice(2).map((l) => l.match(/^\| `([a-z0-9-]+)` \|/)?.[1])).toEqual(catalogue.map((r) => r.meta.id));
  });

  it('rules --format text: a block per rule', async ({ expect }) => {
    const text = await nestready('rules', '--format', 'text');
    expect(text.code).toBe(0);
    const heads = text.stdout
      .split('\n')
      .filter((l) => /^\S/.test(l))
      .map((l) => l.split(/\s/)[0]);
    expect(heads).toEqual(catalogue.map((r) => r.meta.id));
    expect(text.stdout).toContain('few-groups  [structure, default warning]  Too few groups');
  });

  it('rules --format xml is a usage error', async () => {
    expectUsageError(await nestready('rules', '--format', 'xml'));
  });

  it('schema: a JSON Schema the project ajv compiles and that accepts the demo role maps', async ({ expect }) => {
    const run = await nestready('schema');
    expect(run.code).toBe(0);
    const schema = JSON.parse(run.stdout) as Record<string, unknown>;
    expect(schema.$schema).toBe('http://json-schema.org/draft-07/schema#');
    const validate = createAjv({ checkSchemas: true }).compile(schema);
    for (const name of ['repairs-clean.roles.yaml', 'repairs-delivery.roles.yaml']) {
      const map = parse(readFileSync(`${DEMO}/${name}`, 'utf8')) as unknown;
      expect(validate(map), `${name}: ${JSON.stringify(validate.errors)}`).toBe(true);
    }
    expect(validate({ group: 'g', rules: { 'few-groups': { warn_below: 5 }, 'low-icc': 'off' } })).toBe(true);
    expect(validate({})).toBe(false); // group is required
    expect(validate({ group: 'g', colour: 'red' })).toBe(false);
    expect(validate({ group: 'g', types: { x: 'text' } })).toBe(false);
    expect(validate({ group: 'g', rules: { 'few-groups': 'on' } })).toBe(false);
  });

  it('--version and --help exit 0', async ({ expect }) => {
    const [version, help] = await Promise.all([nestready('--version'), nestready('--help')]);
    expect(version.code).toBe(0);
    expect(version.stdout.trim()).toBe(JSON.parse(readFileSync('package.json', 'utf8')).version);
    expect(help.code).toBe(0);
    expect(help.stdout).toContain('audit');
  });
});
