import { groupIds, groupStat } from '../src/profile/group-stats.js';
import { readsAsNumbers } from '../src/profile/reads-as-numbers.js';
import type { Profile } from '../src/profile/types.js';
import type { Roles } from '../src/roles/types.js';
import { defineRule } from '../src/rules/define.js';
import { listSome, percent } from '../src/rules/describe.js';
import type { FindingDraft } from '../src/rules/types.js';
import type { CrossTabCell } from '../src/source/lookups/types.js';
import { formatNumber } from '../src/util/format.js';

interface Params {
  max_levels: number;
  min_cell: number;
  min_epv: number;
  quadrature_below_size: number;
}

/** A 0/1 outcome: what makes a logistic model's estimates run off or rest on few records. */
export default defineRule<Params>({
  meta: {
    id: 'binary-separation',
    title: 'Binary outcome: separation, sparse cells and events per parameter',
    level: 'variance',
    defaultSeverity: 'note',
    description:
      'For a 0/1 outcome (the binary-outcome rule gives its fit): the groups whose outcome never varies, with their sizes; the ' +
      'outcome against each categorical or binary predictor at level 1 and level 2 (one query), where a level with no 0 or no 1 ' +
      'means (quasi-)complete separation and a logistic estimate that runs off to infinity, and a level with few of either ' +
      'rests on a handful of records; the events per parameter of the model the role map implies; and, for small groups, the ' +
      'advice to fit by adaptive quadrature rather than the Laplace approximation or PQL. Rules of thumb, not law: the analysis ' +
      'plan decides.',
    params: {
      type: 'object',
      properties: {
        max_levels: {
          type: 'integer',
          minimum: 2,
          default: 20,
          description: 'predictors with more levels are not cross-tabulated (bounds the query; common practice)',
        },
        min_cell: {
          type: 'integer',
          minimum: 1,
          default: 5,
          description: 'fewer 0s or 1s than this at a level make a sparse cell (common practice, after the expected-count-of-5 rule)',
        },
        min_epv: {
          type: 'number',
          exclusiveMinimum: 0,
          default: 10,
          description: 'events per parameter below which estimates are unreliable (Peduzzi et al. 1996: 10, as guidance)',
        },
        quadrature_below_size: {
          type: 'number',
          exclusiveMinimum: 0,
          default: 10,
          description:
            'mean records per group below which adaptive quadrature is advised over Laplace/PQL (common practice; Rodríguez & ' +
            'Goldman 1995 on the bias of PQL/MQL in small groups)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      constantGroups: {
        message:
          '{count} of {groups} groups ({share}) have {column} all 0 ({allZero}) or all 1 ({allOne}), of {sizes} records: they hold ' +
          'no contrast within the group; many of them inflate τ² and leave group fixed effects inestimable: {list}',
        fix: 'No change to the delivery; tell the analyst, who may pool these groups or use a random rather than fixed group effect',
      },
      separation: {
        message:
          '{column} is {value} on every record at {levelCount} level(s) of {predictor} ({records} records): (quasi-)complete ' +
          'separation, the logistic estimate for {predictor} has no finite maximum: {values}',
        fix:
          'Ask the sender whether {predictor} and {column} are coded as intended; otherwise tell the analyst to merge levels or ' +
          'use a penalised (Firth-type) or Bayesian fit',
      },
      sparseCells: {
        message:
          '{predictor} has {levelCount} level(s) with fewer than {minCell} records of {column} = 0 or = 1: estimates for them rest ' +
          'on a handful of records (guidance): {values}',
        fix: 'No change to the delivery; tell the analyst, who may merge sparse levels of {predictor}',
      },
      fewEvents: {
        message:
          '{events} events ({column} = {rare}, the rarer value) for {parameters} parameters ({fixed} fixed effects, {variances} ' +
          'variance components): {epv} events per parameter, below the {minEpv} suggested as guidance (Peduzzi et al. 1996)',
        fix: 'No change to the delivery; tell the analyst to plan fewer predictors or expect unstable estimates',
      },
      quadrature: {
        message:
          '{column}: {groups} groups of {size} records on average: the Laplace approximation and PQL underestimate τ² with groups ' +
          'this small; fit by adaptive Gauss–Hermite quadrature (as the binary-outcome rule does) (guidance)',
        fix: 'No change to the delivery; tell the analyst to fit the logistic model by adaptive quadrature',
      },
    },
    sources: [
      'Albert, A., & Anderson, J. A. (1984). On the existence of maximum likelihood estimates in logistic regression models. ' +
        'Biometrika, 71(1), 1–10: complete and quasi-complete separation',
      'Peduzzi, P., Concato, J., Kemper, E., Holford, T. R., & Feinstein, A. R. (1996). A simulation study of the number of events ' +
        'per variable in logistic regression analysis. Journal of Clinical Epidemiology, 49(12), 1373–1379: 10 events per variable',
      'Rodríguez, G., & Goldman, N. (1995). An assessment of estimation procedures for multilevel models with binary responses. ' +
        'Journal of the Royal Statistical Society A, 158(1), 73–89: PQL/MQL bias with small groups',
      'Austin, P. C. (2010). Estimating multilevel logistic regression models when the number of clusters is low: a comparison of ' +
        'different statistical software procedures. The International Journal of Biostatistics, 6(1), Article 16',
      'Moineddin, R., Matheson, F. I., & Glazier, R. H. (2007). A simulation study of sample size for multilevel logistic regression ' +
        'models. BMC Medical Research Methodology, 7, 34',
      'Sparse-cell and level-count thresholds: common practice',
    ],
  },
  async check({ profile, roles, outcomes, params, lookup }) {
    const findings: FindingDraft[] = [];
    for (const column of roles.outcomes) {
      const fit = outcomes[column]?.logistic;
      if (!fit || !Number.isFinite(fit.intercept)) continue;
      const { groups, n, ones, constant } = constantGroups(profile, column);
      if (constant.length) findings.push(constantFinding(column, groups, constant));

      const predictors = [...roles.level1, ...roles.level2].filter((p) => isCategorical(profile, roles, p));
      const cells = await lookup.crossTabs(column, predictors, params.max_levels);
      findings.push(...cellFindings(column, cells, params.min_cell));

      const events = Math.min(ones, n - ones);
      const fixed = 1 + fixedEffects(roles, cells);
      const q = 1 + (roles.slopes?.length ?? 0);
      const variances = (q * (q + 1)) / 2;
      const epv = events / (fixed + variances);
      if (epv < params.min_epv) {
        findings.push({
          messageId: 'fewEvents',
          severity: 'warning',
          column,
          data: {
            column,
            events,
            rare: ones <= n - ones ? 1 : 0,
            parameters: fixed + variances,
            fixed,
            variances,
            epv: formatNumber(epv, 1),
            minEpv: params.min_epv,
          },
        });
      }
      const size = n / groups;
      if (size < params.quadrature_below_size) {
        findings.push({ messageId: 'quadrature', column, data: { column, groups, size: formatNumber(size, 1) } });
      }
    }
    return findings;
  },
});

/** Categorical or binary (0/1 or two words) predictors: the ones a cross-tabulation can show separation for. */
function isCategorical(profile: Profile, roles: Roles, column: string): boolean {
  const type = roles.types[column] ?? profile.column(column).type;
  return type === 'categorical' || type === 'binary' || !readsAsNumbers(profile.column(column));
}

/** Fixed effects the role map implies besides the intercept: one per numeric predictor, levels − 1 per categorical one. */
function fixedEffects(roles: Roles, cells: readonly CrossTabCell[]): number {
  const levels = new Map(cells.map((c) => [c.predictor, c.levels]));
  return [...roles.level1, ...roles.level2].reduce((s, p) => s + Math.max(1, (levels.get(p) ?? 2) - 1), 0);
}

interface ConstantGroup {
  id: string;
  n: number;
  ones: number;
}

function constantGroups(profile: Profile, column: string) {
  const ids = groupIds(profile.groups);
  const counts = groupStat(profile.groups, column, 'numericCount');
  const means = groupStat(profile.groups, column, 'mean');
  const constant: ConstantGroup[] = [];
  let groups = 0;
  let n = 0;
  let ones = 0;
  for (let j = 0; j < ids.length; j++) {
    if (!(counts[j] > 0)) continue;
    const k = Math.round(counts[j] * (means[j] ?? 0));
    groups++;
    n += counts[j];
    ones += k;
    if (k === 0 || k === counts[j]) constant.push({ id: ids[j], n: counts[j], ones: k });
  }
  return { groups, n, ones, constant };
}

function constantFinding(column: string, groups: number, constant: readonly ConstantGroup[]): FindingDraft {
  const sizes = constant.map((g) => g.n).sort((a, b) => a - b);
  const allZero = constant.filter((g) => g.ones === 0).length;
  return {
    messageId: 'constantGroups',
    // more than half the groups: the between-group variance rests on very little
    severity: constant.length * 2 > groups ? 'warning' : 'note',
    column,
    count: constant.length,
    groups: constant.slice(0, 20).map((g) => g.id),
    data: {
      column,
      count: constant.length,
      groups,
      share: percent(constant.length / groups),
      allZero,
      allOne: constant.length - allZero,
      sizes: sizes[0] === sizes[sizes.length - 1] ? String(sizes[0]) : `${sizes[0]} to ${sizes[sizes.length - 1]}`,
      list: listSome(constant.map((g) => `${g.id} (${g.n}, all ${g.ones === 0 ? 0 : 1})`)),
    },
  };
}

/** Per predictor: the levels where the outcome never varies (separation), else those with few 0s or 1s. */
function cellFindings(column: string, cells: readonly CrossTabCell[], minCell: number): FindingDraft[] {
  const out: FindingDraft[] = [];
  const byPredictor = new Map<string, CrossTabCell[]>();
  for (const c of cells) if (c.level !== null) byPredictor.set(c.predictor, [...(byPredictor.get(c.predictor) ?? []), c]);
  for (const [predictor, levels] of byPredictor) {
    for (const value of [0, 1]) {
      const empty = levels.filter((c) => (value === 0 ? c.ones === 0 : c.ones === c.records));
      if (!empty.length) continue;
      out.push({
        messageId: 'separation',
        severity: 'warning',
        column,
        count: empty.reduce((s, c) => s + c.records, 0),
        data: { column, predictor, value, levelCount: empty.length, records: empty.reduce((s, c) => s + c.records, 0) },
        values: empty.slice(0, 20).map((c) => `${c.level} (${c.records})`),
      });
    }
    if (out.some((f) => f.data?.predictor === predictor)) continue;
    const sparse = levels.filter((c) => Math.min(c.ones, c.records - c.ones) < minCell);
    if (sparse.length) {
      out.push({
        messageId: 'sparseCells',
        column,
        count: sparse.length,
        data: { column, predictor, minCell, levelCount: sparse.length },
        values: sparse.slice(0, 20).map((c) => `${c.level}: ${c.records - c.ones} × 0, ${c.ones} × 1`),
      });
    }
  }
  return out;
}
