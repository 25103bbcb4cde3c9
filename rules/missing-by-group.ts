import { groupIds, groupSizes, groupStat } from '../src/profile/group-stats.js';
import { defineRule } from '../src/rules/define.js';
import { percent } from '../src/rules/describe.js';
import type { FindingDraft } from '../src/rules/types.js';
import { chiSquareHomogeneity } from '../src/stats/chi-square-homogeneity.js';
import { formatNumber, pClause } from '../src/util/format.js';

interface Params {
  alpha: number;
}

/** Missing values bunched in some groups are not missing at random across groups. */
export default defineRule<Params>({
  meta: {
    id: 'missing-by-group',
    title: 'Missing values concentrated in groups',
    level: 'data',
    defaultSeverity: 'warning',
    description:
      'For the outcomes and every declared level-1 and level-2 variable: the missing rate per group, ' +
      "Pearson's chi-square test that the rate is equal across groups (level-1 variables and " +
      'outcomes), and the groups in which a variable is missing on every record. Missingness that ' +
      'differs by group must be handled by an imputation model that includes the groups; a group ' +
      'without any value of a level-2 variable is dropped whole.',
    params: {
      type: 'object',
      properties: {
        alpha: {
          type: 'number',
          exclusiveMinimum: 0,
          maximum: 1,
          default: 0.01,
          description: 'level of the chi-square test of equal missing rates (common practice; no published threshold)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      uneven: {
        message:
          '{column}: {missing} of {records} values missing ({share}); the missing rate differs between groups (X² = {chi2} on {df} ' +
          'df, {p}{rough}), from {low} to {high}, highest in {worst}',
        fix:
          'Ask the sender why {column} is missing more often in the listed groups; impute with a model that includes the groups ' +
          '(random intercepts or group means), not a single-level one',
      },
      allMissing: {
        message: '{column} is missing on every record of {count} group(s) ({records} records): {ids}',
        fix: 'Ask the sender for {column} in the listed groups; a model that uses {column} drops these groups entirely',
      },
    },
    sources: [
      'van Buuren, S. (2018). Flexible Imputation of Missing Data (2nd ed.), §7.3: missing values in multilevel data; missing level-2 ' +
        'values delete whole groups',
      'Grund, S., Lüdtke, O., & Robitzsch, A. (2018). Multiple imputation of missing data for multilevel models. Organizational ' +
        'Research Methods, 21(1), 111–149: the imputation model must include the multilevel structure',
      'Agresti, A. (2013). Categorical Data Analysis (3rd ed.), §3.2: Pearson chi-square test; upper tail from ' +
        '@stdlib/stats-base-dists-chisquare-cdf',
      'alpha 0.01 and the test itself: common practice (no published threshold for concentrated missingness)',
    ],
  },
  check({ profile, roles, params }) {
    const findings: FindingDraft[] = [];
    const ids = groupIds(profile.groups);
    const sizes = groupSizes(profile.groups);
    const columns = [...roles.outcomes, ...roles.level1, ...roles.level2];
    for (const column of columns) {
      const nn = groupStat(profile.groups, column, 'nonMissing');
      const missing = sizes.map((n, i) => n - nn[i]);
      const total = missing.reduce((a, b) => a + b, 0);
      if (total === 0) continue;
      const empty = ids.map((_, i) => i).filter((i) => nn[i] === 0);
      if (empty.length) {
        findings.push({
          messageId: 'allMissing',
          column,
          count: empty.length,
          groups: empty.map((i) => ids[i]),
          data: {
            column,
            count: empty.length,
            records: empty.reduce((s, i) => s + sizes[i], 0),
            ids:
              empty
                .slice(0, 10)
                .map((i) => ids[i])
                .join(', ') + (empty.length > 10 ? ', …' : ''),
          },
        });
      }
      // a level-2 variable is missing for whole groups by nature; the test speaks of records
      if (roles.level2.includes(column)) continue;
      const test = chiSquareHomogeneity(sizes.map((n, i) => ({ n, events: missing[i] })));
      if (!(test.p < params.alpha)) continue;
      const rates = sizes.map((n, i) => missing[i] / n);
      const order = ids.map((_, i) => i).sort((a, b) => rates[b] - rates[a] || missing[b] - missing[a]);
      const records = sizes.reduce((a, b) => a + b, 0);
      const share = total / records;
      // Cochran's rule: the chi-square approximation is rough when many expected counts are below 5
      const smallExpected = sizes.filter((n) => n * Math.min(share, 1 - share) < 5).length / sizes.length;
      findings.push({
        messageId: 'uneven',
        column,
        count: order.filter((i) => missing[i] > 0).length,
        groups: order.filter((i) => rates[i] > share).map((i) => ids[i]),
        data: {
          column,
          missing: total,
          records,
          share: percent(share),
          chi2: formatNumber(test.statistic, 1),
          df: test.df,
          p: pClause(test.p),
          rough: smallExpected > 0.2 ? '; rough: many small expected counts' : '',
          // reduce, not Math.min(...rates): a million groups overflow the call stack as arguments
          low: percent(rates.reduce((a, b) => Math.min(a, b), Infinity)),
          high: percent(rates.reduce((a, b) => Math.max(a, b), -Infinity)),
          worst: order
            .slice(0, 5)
            .map((i) => `${ids[i]} (${missing[i]} of ${sizes[i]})`)
            .join(', '),
        },
      });
    }
    return findings;
  },
});
