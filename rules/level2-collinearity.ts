import { groupStat } from '../src/profile/group-stats.js';
import { readsAsNumbers } from '../src/profile/reads-as-numbers.js';
import { defineRule } from '../src/rules/define.js';
import type { FindingDraft } from '../src/rules/types.js';
import { varianceInflation } from '../src/stats/variance-inflation.js';
import { formatNumber } from '../src/util/format.js';

interface Params {
  warn_at: number;
}

/** One group-level column of the one-row-per-group table: a level-2 variable or a level-1 variable's group mean. */
interface GroupColumn {
  label: string;
  column: string;
  values: (number | null)[];
}

/** Group-level predictors that carry the same information cannot be told apart on the groups there are. */
export default defineRule<Params>({
  meta: {
    id: 'level2-collinearity',
    title: 'Collinear group-level predictors',
    level: 'structure',
    defaultSeverity: 'warning',
    description:
      'Variance inflation among the numeric level-2 variables and the group means of the numeric level-1 variables (the ' +
      'contextual terms a model may add), on the table of one row per group with every value present. A level-2 effect is ' +
      'estimated on the groups alone, so a predictor that is nearly a combination of the others leaves its coefficient with a ' +
      'standard error inflated by √VIF. The number of groups per predictor is groups-per-level2-predictor’s; this rule runs ' +
      'only when the groups outnumber the predictors.',
    params: {
      type: 'object',
      properties: {
        warn_at: {
          type: 'number',
          exclusiveMinimum: 1,
          default: 10,
          description: 'a warning from this variance inflation factor (Kutner et al. 2005, §10.5; common practice)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      high: {
        message:
          '{column}: variance inflation factor {vif} among {predictors} group-level predictors on {groups} groups (R² {r2} on the ' +
          'others; most correlated with {partner}, r = {r})',
        fix:
          'No change to the delivery; guidance: enter {column} and {partner} in separate models, combine them, or keep the one the ' +
          'analysis plan names',
      },
      exact: {
        message:
          '{column}: an exact linear function of the other group-level predictors on {groups} groups (most correlated with ' +
          '{partner}, r = {r}), so its level-2 effect cannot be estimated beside them',
        fix: 'Check whether {column} was derived from the others (a sum, a share, the same mean twice); enter only one of them',
      },
    },
    sources: [
      'Marquardt, D. W. (1970). Generalized inverses, ridge regression, biased linear estimation, and nonlinear estimation. ' +
        'Technometrics, 12(3), 591–612',
      'Kutner, M. H., Nachtsheim, C. J., Neter, J., & Li, W. (2005). Applied Linear Statistical Models (5th ed.), §10.5 (VIF above ' +
        '10 as a sign of serious multicollinearity)',
      'warn_at 10: common practice',
    ],
  },
  check({ profile, roles, params }) {
    const candidates: GroupColumn[] = [
      ...roles.level2.map((c) => ({ c, label: c })),
      ...roles.level1.map((c) => ({ c, label: `${c} (group mean)` })),
    ]
      .filter(({ c }) => readsAsNumbers(profile.column(c)))
      .map(({ c, label }) => ({ label, column: c, values: groupStat(profile.groups, c, 'mean') }));
    if (candidates.length < 2) return [];
    const complete: number[] = [];
    for (let j = 0; j < profile.groups.numRows(); j++) {
      if (candidates.every((col) => Number.isFinite(col.values[j]))) complete.push(j);
    }
    const columns = candidates
      .map((col) => ({ ...col, series: complete.map((j) => col.values[j] as number) }))
      .filter((col) => col.series.some((v) => v !== col.series[0]));
    const groups = complete.length;
    // with no more groups than predictors the table cannot separate them at all: that is the
    // groups-per-level2-predictor rule's finding, not a collinearity
    if (columns.length < 2 || groups <= columns.length + 1) return [];
    const v = varianceInflation(columns.map((c) => c.series));
    const findings: FindingDraft[] = [];
    columns.forEach((col, k) => {
      const vif = v.vif[k];
      if (!(vif >= params.warn_at)) return;
      const partner = columns[v.partner[k]]?.label ?? '';
      const shared = { column: col.label, partner, r: formatNumber(v.partnerR[k], 3), groups };
      findings.push(
        Number.isFinite(vif)
          ? {
              messageId: 'high',
              column: col.column,
              data: { ...shared, vif: showVif(vif), r2: formatNumber(1 - 1 / vif, 3), predictors: columns.length },
            }
          : { messageId: 'exact', column: col.column, data: shared },
      );
    });
    return findings;
  },
});

// past a thousand the digits of a VIF are rounding noise of a near-singular matrix (and would
// differ between engines that sum in another order); the size is what matters
function showVif(vif: number): string {
  return vif < 1000 ? formatNumber(vif, 1) : 'above 1000';
}
