import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

/**
 * Two deliveries cut from HSB (fixtures/reference/hsb.csv, 160 schools) with planted changes,
 * each named here so that the test can assert it was found exactly:
 * - APPEARED: in the current delivery only; VANISHED: in the previous only;
 * - FLIPPED: its sector flipped (Public ↔ Catholic) in the current delivery;
 * - MOVED: pupils moved from one school to another (their school-level columns follow the school);
 * - the column `homework` added in the current delivery (varies within schools);
 * - MISSING_SES: ses blank for every pupil of these schools in the current delivery.
 */
export const PLANTED = {
  appeared: ['1288', '1296'],
  vanished: ['1308', '1317', '1358'],
  flipped: '1374',
  moved: { from: '1433', to: '1436', students: ['247', '248', '249'] },
  missingSes: ['1461', '1462'],
};

export const HSB_ROLES =
  'group: school\nunit: student\noutcome: mathach\nlevel1: [minority, sex, ses]\n' +
  'level2: [meanses, size, sector, pracad, disclim, himinty]\n';

/** Write previous.csv, current.csv and roles.yaml into `dir`; the paths come back. */
export function writeHsbDeliveries(dir: string): { previous: string; current: string; same: string; roles: string } {
  const [header, ...lines] = readFileSync('fixtures/reference/hsb.csv', 'utf8').trim().split('\n');
  const cols = header.split(',');
  const at = (name: string) => cols.indexOf(name);
  const rows = lines.map((l) => l.split(','));
  const schoolRow = new Map(rows.map((r) => [r[at('school')], r]));
  const level2 = ['meanses', 'size', 'sector', 'pracad', 'disclim', 'himinty'].map(at);

  const previous = rows.filter((r) => !PLANTED.appeared.includes(r[at('school')]));
  const current = rows
    .filter((r) => !PLANTED.vanished.includes(r[at('school')]))
    .map((r, i) => {
      const out = [...r];
      const school = out[at('school')];
      if (school === PLANTED.flipped) out[at('sector')] = out[at('sector')] === 'Public' ? 'Catholic' : 'Public';
      if (PLANTED.moved.students.includes(out[at('student')])) {
        const dest = schoolRow.get(PLANTED.moved.to)!;
        out[at('school')] = PLANTED.moved.to;
        for (const k of level2) out[k] = dest[k];
      }
      if (PLANTED.missingSes.includes(school)) out[at('ses')] = '';
      // a level-1 column that varies within schools: deterministic, spread over 0–9
      out.push(String((i * 7919) % 10));
      return out;
    });
  const csv = (h: string[], rs: string[][]) => `${[h, ...rs].map((r) => r.join(',')).join('\n')}\n`;
  const paths = {
    previous: join(dir, 'previous.csv'),
    current: join(dir, 'current.csv'),
    same: join(dir, 'same.csv'),
    roles: join(dir, 'roles.yaml'),
  };
  writeFileSync(paths.previous, csv(cols, previous));
  writeFileSync(paths.same, csv(cols, previous));
  writeFileSync(paths.current, csv([...cols, 'homework'], current));
  writeFileSync(paths.roles, HSB_ROLES);
  return paths;
}
