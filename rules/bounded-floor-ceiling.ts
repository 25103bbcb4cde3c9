import { defineRule } from '../src/rules/define.js';
import { listSome, percent } from '../src/rules/describe.js';
import type { FindingDraft } from '../src/rules/types.js';
import type { ExtremeShares } from '../src/source/lookups/types.js';

interface Params {
  max_share: number;
}

/** Groups named per side: the ones where the share at the floor (ceiling) is largest. */
const TOP_GROUPS = 5;

/** A bounded or ordinal outcome piled up at an end of its scale: a linear model misleads there. */
export default defineRule<Params>({
  meta: {
    id: 'bounded-floor-ceiling',
    title: 'Bounded or ordinal outcome: records at the floor and at the ceiling',
    level: 'variance',
    defaultSeverity: 'warning',
    description:
      'For an outcome declared `bounded` (its floor and ceiling from `{ bounded: { lower, upper } }`, else the lowest and highest ' +
      'value seen) or `ordinal` (its lowest and highest category seen), the share of records at the floor and at the ceiling, ' +
      'over the delivery and in the groups where it is largest (one query). With many records at an end, a linear model predicts ' +
      'values beyond the scale and understates effects near it: a censored, ordinal or beta model suits it better. Guidance: the ' +
      'analysis plan decides.',
    params: {
      type: 'object',
      properties: {
        max_share: {
          type: 'number',
          exclusiveMinimum: 0,
          maximum: 1,
          default: 0.15,
          description:
            'share of records at the floor or at the ceiling above which the outcome is said to pile up there (Terwee et al. ' +
            '2007: 15%, a common threshold in the measurement literature)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      piled: {
        message:
          '{column}: {floorShare} of {records} records at the floor ({floor}) and {ceilingShare} at the ceiling ({ceiling}), above ' +
          'the {maxShare} that makes a floor or ceiling effect; most in {list}: a linear model of {column} misleads near the ends ' +
          'of its scale (guidance)',
        fix: 'No change to the delivery; tell the analyst to consider {model} for {column}',
      },
    },
    sources: [
      'Terwee, C. B., Bot, S. D. M., de Boer, M. R., et al. (2007). Quality criteria were proposed for measurement properties of ' +
        'health status questionnaires. Journal of Clinical Epidemiology, 60(1), 34–42: floor or ceiling effects when more than 15% ' +
        'of respondents score the lowest or highest possible value',
      'The model advice (censored/tobit, ordinal, beta): common practice',
    ],
  },
  async check({ profile, roles, params, lookup }) {
    const findings: FindingDraft[] = [];
    for (const column of roles.outcomes) {
      const type = roles.types[column];
      if (type !== 'bounded' && type !== 'ordinal') continue;
      const col = profile.column(column);
      const declared = type === 'bounded' ? roles.bounds?.[column] : undefined;
      const lower = declared?.lower ?? col.numMin;
      const upper = declared?.upper ?? col.numMax;
      if (lower === null || upper === null || lower === undefined || upper === undefined || !(upper > lower)) continue;
      const shares = await lookup.extremeShares(column, { lower, upper }, TOP_GROUPS);
      if (!shares.records) continue;
      const floorShare = shares.floor.count / shares.records;
      const ceilingShare = shares.ceiling.count / shares.records;
      if (floorShare <= params.max_share && ceilingShare <= params.max_share) continue;
      const side = floorShare >= ceilingShare ? shares.floor : shares.ceiling;
      findings.push({
        messageId: 'piled',
        column,
        count: floorShare >= ceilingShare ? shares.floor.count : shares.ceiling.count,
        groups: side.groups.map((g) => g.group),
        data: {
          column,
          records: shares.records,
          floor: lower,
          ceiling: upper,
          floorShare: percent(floorShare),
          ceilingShare: percent(ceilingShare),
          maxShare: percent(params.max_share),
          list: groupList(side),
          model: type === 'ordinal' ? 'an ordinal (cumulative logit) model' : 'a censored (tobit) or beta model',
        },
      });
    }
    return findings;
  },
});

/** The groups where the larger end's share is largest, each with its share and size. */
function groupList(side: ExtremeShares['floor']): string {
  return listSome(side.groups.map((g) => `${g.group} (${percent(g.count / g.records)} of ${g.records})`));
}
