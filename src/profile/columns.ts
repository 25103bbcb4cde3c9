import type { ColumnTable } from 'arquero';
import type { Roles, ValueType } from '../roles/types.js';
import type { ProfileColumnPlan } from '../source/plan/profile-query.js';
import { groupIds, groupStat } from './group-stats.js';
import { mostlyNumbers } from './reads-as-numbers.js';
import { roleOf } from './role-of.js';
import type { ColumnProfile } from './types.js';

/** Summarise one column over all groups (the missing-ID group included) of the raw profile. */
export function columnProfile(
  name: string,
  roles: Roles,
  raw: ColumnTable,
  plan: ProfileColumnPlan | undefined,
  rows: number,
  missingGroupRows: number,
): ColumnProfile {
  const role = roleOf(name, roles);
  if (!plan) {
    // the group column itself: it is the key of the profile
    const ids = groupIds(raw).filter((g) => g !== null);
    return base(name, role, 'categorical', 'text', rows - missingGroupRows, rows, minOf(ids), maxOf(ids));
  }
  const nonMissing = sum(groupStat(raw, name, 'nonMissing'));
  const text = plan.storage === 'text';
  const ranged = text && plan.textRange !== false;
  const mins = ranged ? groupStat(raw, name, 'textMin').filter(notNull) : [];
  const maxs = ranged ? groupStat(raw, name, 'textMax').filter(notNull) : [];
  const p = base(name, role, 'categorical', plan.storage, nonMissing, rows, minOf(mins), maxOf(maxs));
  if (text && plan.textPattern) p.numberLike = sum(groupStat(raw, name, 'numberLike'));
  if (!plan.numberStats) return { ...p, type: roles.types[name] ?? 'categorical' };

  const num = groupStat(raw, name, 'numericCount');
  const means = groupStat(raw, name, 'mean');
  const ss = groupStat(raw, name, 'ss');
  const numericCount = sum(num);
  let total = 0;
  let squares = 0;
  for (let i = 0; i < num.length; i++) {
    if (!num[i]) continue;
    total += num[i] * (means[i] as number);
    squares += (ss[i] as number) + num[i] * (means[i] as number) ** 2;
  }
  const numMin = minOf(groupStat(raw, name, 'numMin').filter(notNull));
  const numMax = maxOf(groupStat(raw, name, 'numMax').filter(notNull));
  const mean = numericCount ? total / numericCount : null;
  // all values in {0, 1} ⇔ range [0, 1] and Σx = Σx² (x(1 − x) ≥ 0 on [0, 1], zero only at 0 and 1)
  const zeroOne = numericCount > 0 && numMin === 0 && numMax === 1 && Math.abs(squares - total) <= 1e-9 * Math.max(1, total);
  const isVariable = role === 'outcome' || role === 'level1' || role === 'level2' || role === 'weight';
  // a column read as DOUBLE holds numbers only: ±inf, NaN or an overflowing value in it is listed as
  // not a number, and does not make the column text (it has no text statistics to read)
  const mostlyNumeric = (!text && nonMissing > 0) || mostlyNumbers(numericCount, nonMissing, isVariable);
  const inferred: ValueType = mostlyNumeric ? (zeroOne ? 'binary' : 'numeric') : 'categorical';
  const type = roles.types[name] ?? inferred;
  const asText = (x: number | null) => (x === null ? null : String(x));
  const range = text ? {} : { min: asText(numMin), max: asText(numMax) };
  return { ...p, ...range, type, numericProfiled: true, numericCount, numMin, numMax, mean };
}

function base(
  name: string,
  role: ColumnProfile['role'],
  type: ValueType,
  storage: ColumnProfile['storage'],
  nonMissing: number,
  rows: number,
  min: string | null,
  max: string | null,
): ColumnProfile {
  return {
    name,
    role,
    type,
    storage,
    numericProfiled: false,
    nonMissing,
    missing: rows - nonMissing,
    numericCount: 0,
    min,
    max,
    numMin: null,
    numMax: null,
    mean: null,
    numberLike: null,
  };
}

const notNull = <T>(v: T | null): v is T => v !== null;
const sum = (xs: number[]) => xs.reduce((a, b) => a + (b ?? 0), 0);
function minOf<T>(xs: T[]): T | null {
  return xs.length ? xs.reduce((a, b) => (b < a ? b : a)) : null;
}
function maxOf<T>(xs: T[]): T | null {
  return xs.length ? xs.reduce((a, b) => (b > a ? b : a)) : null;
}
