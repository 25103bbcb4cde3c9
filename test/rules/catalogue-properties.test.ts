import { describe, expect, it } from 'vitest';
import type { Report } from '../../src/report/types.js';
import type { Row } from '../helpers/delivery.js';
import { auditRows, findingsOf, groupId } from '../helpers/delivery.js';
import { mulberry32 } from '../helpers/prng.js';

const ROLES = {
  group: 'g',
  unit: 'id',
  parent: 'p',
  outcome: 'y',
  level1: ['x', 'c1'],
  level2: ['fmt', 'staff'],
};

/** A clean random delivery: J groups of 6–25 records, unique unit IDs, one parent per group. */
function cleanDelivery(seed: number): { rows: Row[]; groups: number } {
  const rand = mulberry32(seed);
  const normal = () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
  const groups = 16 + Math.floor(rand() * 20);
  const rows: Row[] = [];
  for (let j = 0; j < groups; j++) {
    const size = 6 + Math.floor(rand() * 20);
    const effect = 3 * normal();
    const fmt = ['weekly', 'monthly', 'pop-up'][Math.floor(rand() * 3)];
    const staff = 2 + Math.floor(rand() * 10);
    const parent = `P${1 + (j % 4)}`;
    for (let i = 0; i < size; i++) {
      rows.push({
        id: `u${j}-${i}`,
        g: groupId(j),
        p: parent,
        y: (40 + effect + 5 * normal()).toFixed(1),
        x: (10 + 2 * normal()).toFixed(2),
        c1: i % 3,
        region: `r${Math.floor(rand() * 5)}`,
        fmt,
        staff,
      });
    }
  }
  return { rows, groups };
}

interface Planted {
  rows: Row[];
  group: Record<string, string>;
  records: Record<string, number[]>;
}

/** The same delivery with one defect of each kind, each in its own randomly chosen group. */
function plantDefects(seed: number, clean: Row[], groups: number): Planted {
  const rand = mulberry32(seed + 1000);
  const order = Array.from({ length: groups }, (_, j) => j).sort(() => rand() - 0.5);
  const kinds = [
    'variant',
    'copy',
    'conflict',
    'mobileFrom',
    'mobileTo',
    'partlyMissing',
    'token',
    'sentinel',
    'reused',
    'split',
    'constantY',
    'allMissingX',
  ];
  const group = Object.fromEntries(kinds.map((k, i) => [k, groupId(order[i])]));
  const rows = clean.map((r) => ({ ...r }));
  const recordsOf = (g: string) => rows.map((r, k) => (r.g === g ? k : -1)).filter((k) => k >= 0);
  const records: Record<string, number[]> = {};
  // a group ID written in lower case on two records: "g007" beside "G007"
  const [v1, v2] = recordsOf(group.variant).slice(-2);
  rows[v1].g = rows[v2].g = group.variant.toLowerCase();
  records.variant = [v1 + 1, v2 + 1];
  // a unit ID shared by two differing records of one group
  const [c1, c2] = recordsOf(group.conflict);
  rows[c2].id = rows[c1].id;
  records.conflict = [c1 + 1, c2 + 1];
  // a unit ID moved into another group
  const [m1] = recordsOf(group.mobileFrom);
  const [m2] = recordsOf(group.mobileTo);
  rows[m2].id = rows[m1].id;
  records.mobile = [m1 + 1, m2 + 1];
  // a level-2 value blanked on one record
  const [pm] = recordsOf(group.partlyMissing);
  rows[pm].fmt = '';
  records.partlyMissing = [pm + 1];
  // a non-numeric token and a missing-value code in the outcome
  const [t1] = recordsOf(group.token);
  rows[t1].y = 'n/a';
  records.token = [t1 + 1];
  const sentinels = recordsOf(group.sentinel).slice(0, 3);
  for (const k of sentinels) rows[k].y = -999;
  records.sentinel = sentinels.map((k) => k + 1);
  // one code reused: half of a group under another parent with another staff value
  const reused = recordsOf(group.reused);
  for (const k of reused.slice(0, Math.ceil(reused.length / 2))) {
    rows[k].p = 'P-other';
    rows[k].staff = 99;
  }
  // one group split: a record under the wrong parent
  const [sp] = recordsOf(group.split);
  rows[sp].p = 'P-wrong';
  // the outcome copied down a whole group; x missing on a whole group
  for (const k of recordsOf(group.constantY)) rows[k].y = '45.0';
  for (const k of recordsOf(group.allMissingX)) rows[k].x = '';
  // exact re-sent copy, appended at the end
  const [cp] = recordsOf(group.copy);
  rows.push({ ...rows[cp] });
  records.copy = [cp + 1, rows.length];
  // c1 becomes a group property, region an undeclared one
  for (const r of rows) {
    r.c1 = Number(String(r.g).slice(1)) % 7;
    r.region = `r${Number(String(r.g).slice(1)) % 3}`;
  }
  return { rows, group, records };
}

const SEEDS = [1, 2, 3, 4, 5];

function ruleGroups(report: Report, rule: string): string[] {
  return findingsOf(report, rule).flatMap((f) => f.groups ?? []);
}
function ruleRows(report: Report, rule: string): number[] {
  return findingsOf(report, rule).flatMap((f) => f.rows ?? []);
}

describe('random deliveries (seeded)', () => {
  it.each(SEEDS)('seed %i: a clean delivery yields no blocker', async (seed) => {
    const { rows } = cleanDelivery(seed);
    const report = await auditRows(rows, ROLES);
    expect(report.findings.filter((f) => f.severity === 'blocker')).toEqual([]);
  });

  it.each(SEEDS)('seed %i: every planted defect is found', async (seed) => {
    const { rows: clean, groups } = cleanDelivery(seed);
    const { rows, group, records } = plantDefects(seed, clean, groups);
    const report = await auditRows(rows, ROLES);
    const failures: string[] = [];
    const check = (what: string, ok: boolean) => {
      if (!ok) failures.push(what);
    };
    const includes = (list: readonly (string | number)[], items: readonly (string | number)[]) => items.every((x) => list.includes(x));
    check('id-variants', includes(ruleGroups(report, 'id-variants'), [group.variant, group.variant.toLowerCase()]));
    check('id-variants rows', includes(ruleRows(report, 'id-variants'), records.variant));
    check(
      'duplicate copy',
      findingsOf(report, 'duplicate-unit-id').some((f) => f.severity === 'warning' && includes(f.rows ?? [], records.copy)),
    );
    check(
      'duplicate conflict',
      findingsOf(report, 'duplicate-unit-id').some((f) => f.severity === 'blocker' && includes(f.rows ?? [], records.conflict)),
    );
    check('unit-in-several-groups', includes(ruleGroups(report, 'unit-in-several-groups'), [group.mobileFrom, group.mobileTo]));
    check('level2-partly-missing', includes(ruleGroups(report, 'level2-partly-missing'), [group.partlyMissing]));
    check('level2-partly-missing rows', includes(ruleRows(report, 'level2-partly-missing'), records.partlyMissing));
    check('non-numeric-values', includes(ruleRows(report, 'non-numeric-values'), records.token));
    check('sentinel-values', includes(ruleRows(report, 'sentinel-values'), records.sentinel));
    check('group-code-reused', includes(ruleGroups(report, 'group-code-reused'), [group.reused]));
    check('group-in-several-parents', includes(ruleGroups(report, 'group-in-several-parents'), [group.split]));
    check('outcome-constant-within', includes(ruleGroups(report, 'outcome-constant-within'), [group.constantY]));
    check(
      'missing-by-group',
      findingsOf(report, 'missing-by-group').some((f) => f.column === 'x' && (f.groups ?? []).includes(group.allMissingX)),
    );
    check(
      'level1-constant-within',
      findingsOf(report, 'level1-constant-within').some((f) => f.column === 'c1'),
    );
    check(
      'undeclared-level2',
      findingsOf(report, 'undeclared-level2').some((f) => f.column === 'region'),
    );
    expect(failures, JSON.stringify(report.findings.map((f) => [f.rule, f.column, f.groups, f.rows]))).toEqual([]);
  });
});
