import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { loadRoles } from '../../src/roles/load-file.js';
import { nestready } from '../helpers/cli.js';

const dir = mkdtempSync(join(tmpdir(), 'nr-draft-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('nestready draft', () => {
  for (const delivery of ['fixtures/demo/repairs-delivery.csv', 'fixtures/reference/hsb.csv', 'fixtures/formats/repairs.parquet']) {
    it(`${delivery}: the drafted file loads, and auditing with it is never a usage error`, async () => {
      const out = join(dir, `${delivery.replace(/\W/g, '_')}.yaml`);
      const drafted = await nestready('draft', delivery, '--out', out);
      expect(drafted.code).toBe(0);
      expect(drafted.stdout).toBe('');
      expect(drafted.stderr).toContain(`nestready: wrote the drafted role map to ${out}`);
      expect(() => loadRoles(out, catalogue)).not.toThrow();
      const audited = await nestready('audit', delivery, '--roles', out, '--quiet', '--format', 'json');
      expect([0, 1]).toContain(audited.code);
      expect(JSON.parse(audited.stdout).roles.group).toBe(loadRoles(out, catalogue).roles.group);
    });
  }

  it('writes to stdout without --out', async () => {
    const run = await nestready('draft', 'fixtures/demo/repairs-clean.csv', '--quiet');
    expect(run.code).toBe(0);
    expect(run.stdout).toMatch(/^group: workshop /m);
    expect(run.stderr).toBe('');
  });

  it('a missing file: one line naming it, exit 2', async () => {
    const run = await nestready('draft', join(dir, 'nosuch.csv'), '--quiet');
    expect(run.code).toBe(2);
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
    expect(run.stderr).toContain(join(dir, 'nosuch.csv'));
    expect(run.stderr).not.toMatch(/\bat .+:\d+:\d+/);
  });

  it('a header without records: one line naming the file, exit 2', async () => {
    const file = join(dir, 'empty.csv');
    writeFileSync(file, 'id,site,score\n');
    const run = await nestready('draft', file, '--quiet');
    expect(run.code).toBe(2);
    expect(run.stderr.trim()).toBe(`nestready: ${file}: the delivery has no records`);
  });

  it('--group naming no column: exit 2', async () => {
    const run = await nestready('draft', 'fixtures/demo/repairs-clean.csv', '--group', 'nosuch', '--quiet');
    expect(run.code).toBe(2);
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
    expect(run.stderr).toMatch(/repairs-clean\.csv: no column "nosuch" for --group/);
  });

  it('a file that cannot be written: exit 2 naming it', async () => {
    const out = join(dir, 'no-such-dir', 'roles.yaml');
    const run = await nestready('draft', 'fixtures/demo/repairs-clean.csv', '--out', out, '--quiet');
    expect(run.code).toBe(2);
    expect(run.stderr).toContain(`${out}: cannot write the output (ENOENT)`);
    expect(() => readFileSync(out)).toThrow();
  });
});
