/** How another ID-like column sits against the groups. */
export type ColumnRelation = 'alias' | 'nested' | 'contains' | 'crossed' | 'partlyCrossed';

/**
 * The relation of a column to the group from its group × value pairs: each value in one group
 * and each group with one value is the group under another name (alias); each value in one group
 * is a level below the groups (nested); each group with one value a level above (contains); every
 * group with every value fully crossed; anything else partly crossed. P distinct pairs over J
 * groups and K values: one value per group ⇔ P = J; all pairs ⇔ P = J·K.
 * Source: the nested and crossed classifications of Searle, Casella & McCulloch (1992),
 * *Variance Components*, ch. 1; Rasbash & Goldstein (1994), *J. Educ. Behav. Stat.* 19(4),
 * 337–350 on cross-classified multilevel structures.
 *
 * @param valueGroups per value of the column, the distinct groups it occurs in
 * @param groups groups in which the column has a value (J)
 */
export function columnRelation(valueGroups: readonly number[], groups: number): ColumnRelation {
  let pairs = 0;
  let most = 0;
  for (const k of valueGroups) {
    pairs += k;
    if (k > most) most = k;
  }
  if (most === 1) return pairs === groups ? 'alias' : 'nested';
  if (pairs === groups) return 'contains';
  return pairs === groups * valueGroups.length ? 'crossed' : 'partlyCrossed';
}
