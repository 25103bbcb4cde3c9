// JSON Schema of an outcome's `threeLevel` (with a parent declared): the three-level null model

const stat = { type: ['number', 'null'] } as const;
const count = { type: 'integer', minimum: 0 } as const;

const levelComponents = {
  type: 'object',
  additionalProperties: false,
  required: ['tau2Parent', 'tau2Group', 'sigma2', 'mean', 'logLik', 'shares'],
  properties: {
    tau2Parent: stat,
    tau2Group: stat,
    sigma2: stat,
    mean: stat,
    logLik: stat,
    shares: {
      type: 'object',
      additionalProperties: false,
      required: ['parent', 'group', 'residual'],
      properties: { parent: stat, group: stat, residual: stat },
    },
  },
} as const;

export const threeLevelSchema = {
  description: 'with a parent declared: the three-level null model (REML and ML), groups under several parents or none left out',
  type: 'object',
  additionalProperties: false,
  required: ['parents', 'groups', 'n', 'reml', 'ml', 'groupsOnly', 'parentTest', 'excludedGroups'],
  properties: {
    parents: count,
    groups: count,
    n: count,
    reml: levelComponents,
    ml: levelComponents,
    groupsOnly: {
      type: 'object',
      additionalProperties: false,
      required: ['tau2', 'sigma2', 'logLik'],
      properties: { tau2: stat, sigma2: stat, logLik: stat },
    },
    parentTest: {
      type: 'object',
      additionalProperties: false,
      required: ['statistic', 'p'],
      properties: { statistic: stat, p: stat },
    },
    excludedGroups: count,
  },
} as const;
