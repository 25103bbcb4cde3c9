import type { AnyRule } from '../src/rules/define.js';
import binaryOutcome from './binary-outcome.js';
import binarySeparation from './binary-separation.js';
import boundedFloorCeiling from './bounded-floor-ceiling.js';
import countOutcome from './count-outcome.js';
import duplicateUnitId from './duplicate-unit-id.js';
import fewGroups from './few-groups.js';
import groupCodeReused from './group-code-reused.js';
import groupInSeveralParents from './group-in-several-parents.js';
import groupsPerLevel2Predictor from './groups-per-level2-predictor.js';
import hiddenLevel from './hidden-level.js';
import idVariants from './id-variants.js';
import informativeGroupSize from './informative-group-size.js';
import interceptVarianceAtZero from './intercept-variance-at-zero.js';
import level1ConstantWithin from './level1-constant-within.js';
import level1VarianceHeterogeneity from './level1-variance-heterogeneity.js';
import level2Collinearity from './level2-collinearity.js';
import level2PartlyMissing from './level2-partly-missing.js';
import level2Varies from './level2-varies.js';
import lowGroupMeanReliability from './low-group-mean-reliability.js';
import lowIcc from './low-icc.js';
import missingByGroup from './missing-by-group.js';
import missingGroupId from './missing-group-id.js';
import missingUnitId from './missing-unit-id.js';
import nonNumericValues from './non-numeric-values.js';
import occasionsPerPerson from './occasions-per-person.js';
import outcomeConstantWithin from './outcome-constant-within.js';
import outlyingGroups from './outlying-groups.js';
import plannedEffectPrecision from './planned-effect-precision.js';
import predictorBetweenShare from './predictor-between-share.js';
import sentinelValues from './sentinel-values.js';
import singletonGroups from './singleton-groups.js';
import slopeSupport from './slope-support.js';
import smallGroups from './small-groups.js';
import threeLevelShares from './three-level-shares.js';
import unbalancedGroups from './unbalanced-groups.js';
import undeclaredLevel2 from './undeclared-level2.js';
import unitInSeveralGroups from './unit-in-several-groups.js';
import unreadableLines from './unreadable-lines.js';
import variableWithoutStatistics from './variable-without-statistics.js';
import weightsAudit from './weights-audit.js';
import withinBetweenGap from './within-between-gap.js';

/** The built-in catalogue, alphabetical by id (a test checks it against the files in rules/). */
export const catalogue: readonly AnyRule[] = [
  binaryOutcome,
  binarySeparation,
  boundedFloorCeiling,
  countOutcome,
  duplicateUnitId,
  fewGroups,
  groupCodeReused,
  groupInSeveralParents,
  groupsPerLevel2Predictor,
  hiddenLevel,
  idVariants,
  informativeGroupSize,
  interceptVarianceAtZero,
  level1ConstantWithin,
  level1VarianceHeterogeneity,
  level2Collinearity,
  level2PartlyMissing,
  level2Varies,
  lowGroupMeanReliability,
  lowIcc,
  missingByGroup,
  missingGroupId,
  missingUnitId,
  nonNumericValues,
  occasionsPerPerson,
  outcomeConstantWithin,
  outlyingGroups,
  plannedEffectPrecision,
  predictorBetweenShare,
  sentinelValues,
  singletonGroups,
  slopeSupport,
  smallGroups,
  threeLevelShares,
  unbalancedGroups,
  undeclaredLevel2,
  unitInSeveralGroups,
  unreadableLines,
  variableWithoutStatistics,
  weightsAudit,
  withinBetweenGap,
];
