import { roleOf } from '../src/profile/role-of.js';
import type { ColumnRelation } from '../src/rules/column-relation.js';
import { columnRelation } from '../src/rules/column-relation.js';
import { defineRule } from '../src/rules/define.js';
import { percent } from '../src/rules/describe.js';
import type { FindingDraft } from '../src/rules/types.js';
import { remlComponents } from '../src/stats/reml-components.js';

interface Params {
  share_at_least: number;
  columns: number;
  min_values: number;
  max_values: number;
}

// how many columns outside the role map the first aggregate looks at (one count-distinct each)
const SCREENED_AT_MOST = 24;

/** The message for each relation a flagged column can have. */
const MESSAGE: Record<Exclude<ColumnRelation, 'alias'>, string> = {
  contains: 'levelAbove',
  nested: 'levelBelow',
  crossed: 'crossed',
  partlyCrossed: 'crossed',
};

/** An ID-like column outside the role map that structures the outcome like a level. */
export default defineRule<Params>({
  meta: {
    id: 'hidden-level',
    title: 'Undeclared level or cross-classification',
    level: 'structure',
    defaultSeverity: 'warning',
    description:
      'Columns the role map does not name and whose values look like codes (text, or whole numbers, each value repeated) ' +
      'are set against the groups in one bounded look-up: nested in them, containing them, crossed or partly crossed with ' +
      'them, with the share of each numeric outcome’s variance between their values (one-way REML). A large share says the ' +
      'column is a level the role map leaves out, or a cross-classification; for a column nested in the groups the share ' +
      'beyond the groups’ own ICC counts.',
    params: {
      type: 'object',
      properties: {
        share_at_least: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.05,
          description: 'variance share counted as large (LeBreton & Senter 2008: an ICC of .05 is small to medium)',
        },
        columns: {
          type: 'integer',
          minimum: 1,
          maximum: 16,
          default: 8,
          description: 'at most this many code-like columns are set against the groups, in header order (common practice)',
        },
        min_values: {
          type: 'integer',
          minimum: 2,
          default: 3,
          description: 'fewer distinct values than this is a category, not a level (common practice)',
        },
        max_values: {
          type: 'integer',
          minimum: 3,
          default: 5000,
          description: 'more distinct values than this is not examined (bounds the look-up)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      levelAbove: {
        message:
          '{column} holds each {group} within one of its {valueCount} values and {share} of the {outcome} variance lies between ' +
          'them (one-way REML): a level above the groups that the role map does not declare',
        fix:
          'Declare {column} as the parent in the role map if it is a level of the design, and ask the analyst whether ' +
          'the model needs it',
      },
      levelBelow: {
        message:
          '{column} has {valueCount} values, each within one {group}, and {share} of the {outcome} variance lies between them ' +
          '(one-way REML) against {groupShare} between the groups: a level below the groups that the role map does not declare',
        fix:
          'Ask the analyst whether {column} is a level of the design (records within {column} within {group}); if so the model ' +
          'needs three levels (guidance, not a verdict)',
      },
      crossed: {
        message:
          '{column} is {relation} with {group} ({pairs} of the {cells} {group} × {column} pairs occur) and {share} of the ' +
          '{outcome} variance lies between its {valueCount} values (one-way REML): a cross-classification the role map does not declare',
        fix:
          'Ask the analyst whether {column} is a second classification of the records; if so a cross-classified model may ' +
          'be needed (guidance, not a verdict)',
      },
    },
    sources: [
      'Rasbash, J., & Goldstein, H. (1994). Efficient analysis of mixed hierarchical and cross-classified random structures ' +
        'using a multilevel model. Journal of Educational and Behavioral Statistics, 19(4), 337–350',
      'Opdenakker, M.-C., & Van Damme, J. (1998). The importance of identifying levels in multilevel analysis: an illustration of ' +
        'the effects of ignoring the top or intermediate levels in school effectiveness research. Paper presented at the annual ' +
        'meeting of the American Educational Research Association, San Diego (ERIC ED422400): ignoring the top level overstates ' +
        'the variance of the highest level kept, ignoring an intermediate level that of the levels just above and below it',
      'LeBreton, J. M., & Senter, J. L. (2008). Organizational Research Methods, 11(4), 815–852: ICC(1) of .05 is small to medium',
    ],
  },
  async check({ profile, roles, outcomes, params, lookup }) {
    const outcomeNames = Object.keys(outcomes).filter((o) => Number.isFinite(outcomes[o].reml.icc));
    if (!outcomeNames.length) return [];
    const others = profile.header.filter((c) => roleOf(c, roles) === 'other' && roles.types[c] === undefined).slice(0, SCREENED_AT_MOST);
    if (!others.length) return [];
    const screens = await lookup.screenColumns(others);
    const candidates = screens
      .filter((s) => s.values >= params.min_values && s.values <= params.max_values && 2 * s.values <= s.nonMissing && s.fractional === 0)
      .slice(0, params.columns);
    if (!candidates.length) return [];
    const valueStats = await lookup.columnValueStats(
      candidates.map((c) => c.column),
      outcomeNames,
    );
    const findings: FindingDraft[] = [];
    for (const screen of candidates) {
      const values = valueStats.filter((v) => v.column === screen.column);
      const relation = columnRelation(
        values.map((v) => v.groups),
        screen.groups,
      );
      if (relation === 'alias') continue;
      let best: { outcome: string; share: number; signal: number } | undefined;
      outcomeNames.forEach((outcome, k) => {
        const moments = values.map((v) => v.outcomes[k]).filter((m) => m.n > 0);
        const share = remlComponents(moments).icc;
        // a column nested in the groups also carries the groups' own variance: only the excess is its own
        const signal = relation === 'nested' ? share - outcomes[outcome].reml.icc : share;
        if (Number.isFinite(signal) && (!best || signal > best.signal)) best = { outcome, share, signal };
      });
      if (!best || best.signal < params.share_at_least) continue;
      const pairs = values.reduce((s, v) => s + v.groups, 0);
      findings.push({
        messageId: MESSAGE[relation],
        column: screen.column,
        data: {
          column: screen.column,
          group: roles.group,
          relation: relation === 'crossed' ? 'crossed' : 'partly crossed',
          valueCount: screen.values,
          pairs,
          cells: screen.groups * screen.values,
          outcome: best.outcome,
          share: percent(best.share),
          groupShare: percent(outcomes[best.outcome].reml.icc),
        },
      });
    }
    return findings;
  },
});
