import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { draftRoles } from '../../src/draft/draft.js';
import { loadRoles } from '../../src/roles/load-file.js';
import { toCsv } from '../helpers/delivery.js';
import { mulberry32 } from '../helpers/prng.js';

const dir = mkdtempSync(join(tmpdir(), 'nr-draft-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The draft written to a file and read back as any role map is: it must load. */
function loadDrafted(name: string, text: string) {
  const file = join(dir, name);
  writeFileSync(file, text);
  return loadRoles(file, catalogue).roles;
}

const sorted = (xs: readonly string[]) => [...xs].sort();

describe('draft on High School and Beyond (fixtures/reference/hsb.csv)', () => {
  // fixtures/reference/README.md: 7,185 students (`student`, a row number) in 160 schools
  // (`school`); meanses, size, sector, pracad, disclim, himinty are school-level (constant within
  // school; meanses is the school mean of ses); minority, sex, ses, mathach are student-level
  it('picks school as the group, student as the unit, and sorts the columns by level', async () => {
    const draft = await draftRoles('fixtures/reference/hsb.csv');
    const roles = loadDrafted('hsb.yaml', draft.text);
    expect(roles.group).toBe('school');
    expect(roles.unit).toBe('student');
    expect(roles.parent).toBeUndefined();
    expect(sorted(roles.level2)).toEqual(sorted(['meanses', 'size', 'sector', 'pracad', 'disclim', 'himinty']));
    expect(sorted(roles.level1)).toEqual(sorted(['minority', 'sex', 'ses', 'mathach']));
    // the analyst chooses the outcome: candidates are comments, not roles
    expect(roles.outcomes).toEqual([]);
    expect(draft.plan.outcomes.map((c) => c.column)).toEqual(['ses', 'mathach']);
    expect(draft.text).toMatch(/^# {3}- mathach +# ICC 0\.18 /m); // REML ICC 0.1803518 (lme4, fixtures/reference/README.md)
    expect(draft.text).toMatch(/^ {2}- sector +# constant within 160 of 160 groups$/m);
    expect(roles.types).toEqual({ minority: 'categorical', sex: 'categorical', sector: 'categorical', himinty: 'binary' });
    // size has 149 values (some schools share a size): a candidate, ranked below school
    expect(draft.plan.otherGroups.map((c) => c.column)).toContain('size');
  });

  it('says it is a draft to review and defers to the analysis plan', async () => {
    const { text } = await draftRoles('fixtures/reference/hsb.csv');
    expect(text.split('\n')[0]).toMatch(/^# nestready role map: a DRAFT to review/);
    expect(text).toMatch(/guidance, not decisions/);
    expect(text).toMatch(/analysis plan/);
  });
});

describe('draft on the demo deliveries (fixtures/demo, roles in repairs-clean.roles.yaml)', () => {
  // fixtures/demo/README.md: jobs (job_id) in 60 workshops (workshop), each in one of six
  // networks (network, the parent); workshop_format, benches, opened_year are workshop-level;
  // repair_minutes (the outcome), fixed (0/1, undeclared but typed binary), item_kind,
  // item_age_years, helpers vary between jobs
  const expected = loadRoles('fixtures/demo/repairs-clean.roles.yaml', catalogue).roles;
  // a draft leaves the outcome to the analyst: the outcome and fixed stay level-1 variables
  const level1 = sorted([...expected.level1, ...expected.outcomes, 'fixed']);

  for (const file of ['repairs-clean.csv', 'repairs-delivery.csv']) {
    it(`${file}: group, unit, parent, level 1 and level 2 as the role map has them`, async () => {
      const draft = await draftRoles(`fixtures/demo/${file}`);
      const roles = loadDrafted(file.replace('.csv', '.yaml'), draft.text);
      expect(roles.group).toBe(expected.group);
      expect(roles.unit).toBe(expected.unit);
      expect(roles.parent).toBe(expected.parent);
      expect(sorted(roles.level2)).toEqual(sorted(expected.level2));
      expect(sorted(roles.level1)).toEqual(level1);
      expect(roles.types.fixed).toBe('binary');
    });
  }

  it('repairs-delivery.csv: the planted slips still read as level 2, the planted tokens as missing-code candidates', async () => {
    const { text, roles } = await draftRoles('fixtures/demo/repairs-delivery.csv');
    // defect b: workshop_format differs within W-017 and W-037, benches within W-052 (of 62 groups of two or more)
    expect(text).toMatch(/^ {2}- workshop_format +# constant within 60 of 62 groups$/m);
    expect(text).toMatch(/^ {2}- benches +# constant within 61 of 62 groups$/m);
    // defect d: "n/a" ×5 in repair_minutes is taken as missing; -999 ×4 is offered, commented out
    expect(roles.missing).toContain('n/a');
    expect(text).toMatch(/^ {2}- n\/a +# 5 in repair_minutes$/m);
    expect(roles.missing).not.toContain('-999');
    expect(text).toMatch(/^ {2}# - "-999" +# 4 in repair_minutes$/m);
    // defect f: three job IDs sent twice
    expect(text).toMatch(/^unit: job_id +# 3,004 distinct values on 3,007 records \(3 repeated\)$/m);
  });

  it('--group takes the given column and says so', async () => {
    const { roles, text } = await draftRoles('fixtures/demo/repairs-clean.csv', { group: 'network' });
    expect(roles.group).toBe('network');
    expect(text).toMatch(/^group: network +# given with --group; 6 groups/m);
  });

  it('--group naming no column is an input error naming the file', async () => {
    await expect(draftRoles('fixtures/demo/repairs-clean.csv', { group: 'nosuch' })).rejects.toThrow(
      /^fixtures\/demo\/repairs-clean\.csv: no column "nosuch" for --group/,
    );
  });
});

/**
 * Pupils in classes in schools: 8 schools of 5 classes each (class IDs unique across schools),
 * 8 to 20 pupils a class. school_type and school_size belong to the school, teacher_years and
 * class_shift to the class; score, age and female to the pupil. Two columns repeat their values
 * as a group ID would — class and school — and class is nested in school.
 */
function nestedDelivery(): string {
  const random = mulberry32(20261202);
  const rows = [];
  let pupil = 0;
  for (let s = 1; s <= 8; s++) {
    const school = `S${s}`;
    const schoolType = random() < 0.5 ? 'public' : 'private';
    const schoolSize = 200 + Math.floor(random() * 800);
    for (let c = 1; c <= 5; c++) {
      const teacherYears = 1 + Math.floor(random() * 30);
      const classShift = random() < 0.5 ? 'morning' : 'afternoon';
      const size = 8 + Math.floor(random() * 13);
      for (let p = 0; p < size; p++) {
        pupil++;
        rows.push({
          pupil_id: `P${String(pupil).padStart(5, '0')}`,
          school,
          class: `${school}-C${c}`,
          score: (50 + 10 * random() + teacherYears / 3).toFixed(1),
          age: (10 + 2 * random()).toFixed(2),
          female: random() < 0.5 ? 1 : 0,
          school_type: schoolType,
          school_size: schoolSize,
          teacher_years: teacherYears,
          class_shift: classShift,
        });
      }
    }
  }
  return toCsv(rows);
}

describe('draft on a delivery with two nested group columns', () => {
  it('proposes the finer (class) as the group and the coarser (school) as the parent', async () => {
    const file = join(dir, 'nested.csv');
    writeFileSync(file, nestedDelivery());
    const draft = await draftRoles(file);
    const roles = loadDrafted('nested.yaml', draft.text);
    expect(roles.group).toBe('class');
    expect(roles.parent).toBe('school');
    expect(roles.unit).toBe('pupil_id');
    expect(sorted(roles.level2)).toEqual(sorted(['school_type', 'school_size', 'teacher_years', 'class_shift']));
    expect(sorted(roles.level1)).toEqual(sorted(['score', 'age', 'female']));
    // school's own values hold school_type and school_size constant: a level above the classes
    expect(draft.plan.parent?.evidence).toMatch(/school_type, school_size/);
    expect(draft.plan.otherGroups[0]?.column).toBe('school');
  });
});

describe('draft with awkward column names', () => {
  it('quotes names YAML would misread, and the draft still loads', async () => {
    const random = mulberry32(7);
    const rows = [];
    for (let i = 0; i < 200; i++) {
      const site = `s${i % 20}`;
      rows.push({ 'rec: id': i + 1, 'site #': site, true: ((i % 20) % 3) + 0.5, 'score "x"': (10 * random()).toFixed(2) });
    }
    const file = join(dir, 'awkward.csv');
    writeFileSync(file, toCsv(rows));
    const draft = await draftRoles(file);
    const roles = loadDrafted('awkward.yaml', draft.text);
    expect(roles.group).toBe('site #');
    expect(roles.unit).toBe('rec: id');
    expect(roles.level2).toEqual(['true']);
    expect(roles.level1).toEqual(['score "x"']);
  });
});
