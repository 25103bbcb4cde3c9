import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
// @ts-expect-error a checked JavaScript script without declarations
import { writeSynthetic } from '../scripts/synth.js';
import { nestready } from './helpers/cli.js';

// A CSV of 300,000 records × 10 columns (about 15 MB) is read by two DuckDB threads, and two-thread
// audits of it differed in the last digits of their statistics from run to run (README, "Repeatable
// reports"). With --repeatable the engine runs one thread and every rerun must give the same bytes.
describe('--repeatable', () => {
  const dir = mkdtempSync(join(tmpdir(), 'nestready-repeatable-'));
  const delivery = join(dir, 'd.csv');
  const roles = join(dir, 'roles.yaml');
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('gives byte-identical JSON reports and problem rows on reruns of a two-thread-sized delivery', async () => {
    await writeSynthetic({ path: delivery, rows: 300_000, groups: 2_000, seed: 7 });
    writeFileSync(
      roles,
      'group: site_code\nunit: record_id\nparent: region_code\noutcomes: [wait_minutes]\n' +
        'level1: [age_band, visits, distance_km]\nlevel2: [site_type, staff, opened_year]\n',
    );
    const outputs: string[] = [];
    for (let i = 0; i < 3; i++) {
      const json = join(dir, `r${i}.json`);
      const rows = join(dir, `p${i}.csv`);
      const run = await nestready(
        'audit',
        delivery,
        '-r',
        roles,
        '--repeatable',
        '-o',
        json,
        '--problems',
        rows,
        '-q',
        '--fail-on',
        'never',
      );
      expect(run.stderr).toBe('');
      expect(run.code).toBe(0);
      outputs.push(readFileSync(json, 'utf8') + readFileSync(rows, 'utf8'));
    }
    expect(outputs[0].length).toBeGreaterThan(10_000);
    expect(outputs[1]).toBe(outputs[0]);
    expect(outputs[2]).toBe(outputs[0]);
  }, 60_000);
});
