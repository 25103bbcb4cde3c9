import type { Roles } from '../roles/types.js';
import type { Finding } from '../rules/types.js';
import type { OutcomeStats } from '../stats/types.js';
import { formatNumber } from '../util/format.js';

/** One piece of estimation advice, with what prompted it and its source. */
export interface FitAdviceItem {
  /** stable key of the advice */
  topic: string;
  advice: string;
  /** why it applies to this delivery */
  because: string;
  source: string;
  /** the rules whose findings prompted it, if any */
  rules?: string[];
}

/** The "how to fit" section: guidance, never a decision (the report's `fitAdvice`). */
export interface FitAdvice {
  note: string;
  items: FitAdviceItem[];
}

/** What the advice is drawn from: the report's parts before it is graded. */
export interface FitAdviceInput {
  roles: Roles;
  groups: number;
  meanSize: number;
  outcomes: Record<string, OutcomeStats>;
  findings: readonly Pick<Finding, 'rule' | 'messageId'>[];
}

/** Below about this many groups small-sample corrections matter (McNeish & Stapleton 2016). */
export const FEW_GROUPS = 50;
/** Mean group size below which Laplace/PQL fits of binary or count outcomes are biased (common practice; Moineddin et al. 2007). */
const SMALL_GROUPS = 10;

const NOTE = 'Guidance drawn from the delivery and its findings, with sources: the study’s analysis plan decides how the model is fitted.';

const SOURCES = {
  mcneish:
    'McNeish, D. M., & Stapleton, L. M. (2016). The effect of small sample size on two-level model estimates: a review and ' +
    'illustration. Educational Psychology Review, 28(2), 295–314',
  cameron:
    'Cameron, A. C., & Miller, D. L. (2015). A practitioner’s guide to cluster-robust inference. Journal of Human Resources, ' +
    '50(2), 317–372',
  quadrature:
    'Rodríguez, G., & Goldman, N. (1995). An assessment of estimation procedures for multilevel models with binary responses. ' +
    'Journal of the Royal Statistical Society A, 158(1), 73–89; Moineddin, R., Matheson, F. I., & Glazier, R. H. (2007). BMC ' +
    'Medical Research Methodology, 7, 34',
  bates: 'Bates, D., Kliegl, R., Vasishth, S., & Baayen, H. (2015). Parsimonious mixed models. arXiv:1506.04967',
  levels:
    'Opdenakker, M.-C., & Van Damme, J. (1998). The importance of identifying levels in multilevel analysis: an illustration of ' +
    'the effects of ignoring the top or intermediate levels in school effectiveness research. AERA annual meeting, San Diego ' +
    '(ERIC ED422400)',
  enders:
    'Enders, C. K., & Tofighi, D. (2007). Centering predictor variables in cross-sectional multilevel models. Psychological ' +
    'Methods, 12(2), 121–138',
  rb: 'Raudenbush, S. W., & Bryk, A. S. (2002). Hierarchical Linear Models (2nd ed.). Sage, ch. 9',
  weights:
    'Pfeffermann, D., et al. (1998). Journal of the Royal Statistical Society B, 60(1), 23–40; Carle, A. C. (2009). BMC Medical ' +
    'Research Methodology, 9, 49',
  singer: 'Singer, J. D., & Willett, J. B. (2003). Applied Longitudinal Data Analysis. Oxford University Press',
};

/** Findings that say the random part may not be estimable as planned (rule ids of the catalogue). */
const SINGULAR = ['intercept-variance-at-zero', 'slope-support', 'low-icc'];

/**
 * Estimation advice from the number and sizes of groups, the outcomes' kinds and the findings,
 * read by rule id (a rule that did not run or found nothing adds nothing). Each item names its
 * source; none is a rule's verdict.
 */
export function fitAdvice(input: FitAdviceInput): FitAdvice {
  const { roles, groups, meanSize, outcomes } = input;
  const fired = new Set(input.findings.map((f) => f.rule));
  const firedOf = (ids: readonly string[]) => ids.filter((id) => fired.has(id));
  const message = (rule: string, id: string) => input.findings.some((f) => f.rule === rule && f.messageId === id);
  const items: FitAdviceItem[] = [];
  const few = groups < FEW_GROUPS;
  items.push(
    few
      ? {
          topic: 'small-sample-inference',
          advice:
            'Estimate the variance components by REML and test fixed effects with a small-sample degrees-of-freedom correction ' +
            '(Kenward–Roger or Satterthwaite)',
          because: `${groups} groups, fewer than about ${FEW_GROUPS}: ML variance estimates and large-sample tests are biased`,
          source: SOURCES.mcneish,
        }
      : {
          topic: 'small-sample-inference',
          advice: 'REML for the variance components; large-sample tests of fixed effects are usually adequate',
          because: `${groups} groups, about ${FEW_GROUPS} or more`,
          source: SOURCES.mcneish,
        },
  );
  if (few) {
    items.push({
      topic: 'cluster-robust-errors',
      advice:
        'Do not rely on cluster-robust (sandwich) standard errors alone: with few groups they are too small; use model-based ' +
        'errors with a degrees-of-freedom correction, or a small-sample corrected sandwich',
      because: `${groups} groups`,
      source: SOURCES.cameron,
    });
  }
  const kinds = outcomeKinds(roles, outcomes);
  const nonLinear = kinds.filter((k) => k.kind === 'binary' || k.kind === 'count');
  const quadratureRules = firedOf(['binary-outcome', 'binary-separation', 'count-outcome']);
  if (nonLinear.length && (meanSize < SMALL_GROUPS || quadratureRules.length)) {
    items.push({
      topic: 'quadrature',
      advice:
        'Fit by adaptive Gauss–Hermite quadrature rather than the Laplace approximation or PQL, which underestimate the ' +
        'level-2 variance with small groups',
      because:
        `${nonLinear.map((k) => `${k.name} is ${k.kind}`).join(', ')}; mean group size ${formatNumber(meanSize, 1)}` +
        (quadratureRules.length ? '; see the findings of the rules listed' : ''),
      source: SOURCES.quadrature,
      ...(quadratureRules.length && { rules: quadratureRules }),
    });
  }
  const singular = firedOf(SINGULAR);
  if (singular.length) {
    items.push({
      topic: 'random-part',
      advice: 'Expect a singular (zero-variance) fit for the flagged random effects: start with the random part the data support',
      because: 'the findings of the rules listed',
      source: SOURCES.bates,
      rules: singular,
    });
  }
  const levels = firedOf(['three-level-shares', 'hidden-level']);
  if (levels.length) {
    items.push({
      topic: 'levels',
      advice: 'Give the level the findings name its own random effect rather than ignoring it',
      because: 'a level beyond the group holds a share of the outcome’s variance',
      source: SOURCES.levels,
      rules: levels,
    });
  }
  if (fired.has('within-between-gap')) {
    items.push({
      topic: 'centring',
      advice: 'Centre the flagged level-1 predictors within groups and add their group means as level-2 predictors',
      because: 'their within- and between-group slopes differ',
      source: SOURCES.enders,
      rules: ['within-between-gap'],
    });
  }
  if (fired.has('level1-variance-heterogeneity')) {
    items.push({
      topic: 'level1-variance',
      advice: 'Consider a model for the level-1 variance (by group or by a predictor) before trusting standard errors',
      because: 'residual variances differ between groups',
      source: SOURCES.rb,
      rules: ['level1-variance-heterogeneity'],
    });
  }
  if (roles.weights) {
    items.push({
      topic: 'weights',
      advice:
        'Use conditional level-1 weights scaled within groups, and compare the two scalings (to the group size and to the ' +
        'effective group size) in a weighted (pseudo-likelihood) fit',
      because: message('weights-audit', 'looksTotal')
        ? 'sampling weights are declared and the level-1 weights look total'
        : 'sampling weights are declared',
      source: SOURCES.weights,
      ...(fired.has('weights-audit') && { rules: ['weights-audit'] }),
    });
  }
  if (roles.time && (message('occasions-per-person', 'fewOccasions') || message('occasions-per-person', 'timeZero'))) {
    items.push({
      topic: 'time',
      advice: message('occasions-per-person', 'fewOccasions')
        ? 'Keep the slope on time fixed unless most persons have three or more occasions; centre time where zero means something'
        : 'Centre time where zero means something, so that the intercept and its variance describe an observed time',
      because: 'the occasions per person and where time zero sits',
      source: SOURCES.singer,
      rules: ['occasions-per-person'],
    });
  }
  return { note: NOTE, items };
}

/** Each outcome's kind as the model sees it: the role map's type, binary when the logistic null model was fitted. */
function outcomeKinds(roles: Roles, outcomes: Record<string, OutcomeStats>): { name: string; kind: string }[] {
  return Object.entries(outcomes).map(([name, o]) => ({ name, kind: o.logistic ? 'binary' : (roles.types[name] ?? 'numeric') }));
}
