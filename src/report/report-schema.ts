import { changesSchema, snapshotSchema } from './snapshot-schema.js';
import { threeLevelSchema } from './three-level-schema.js';
import { REPORT_SCHEMA } from './types.js';

// a statistic the data leave undefined (NaN, ±Infinity) is written as null
const stat = { type: ['number', 'null'] } as const;
const count = { type: 'integer', minimum: 0 } as const;
const text = { type: 'string' } as const;
const texts = { type: 'array', items: text } as const;
const components = {
  type: 'object',
  additionalProperties: false,
  required: ['tau2', 'sigma2', 'icc', 'mean', 'logLik'],
  properties: { tau2: stat, sigma2: stat, icc: stat, mean: stat, logLik: stat },
} as const;

/** outcomes.<name>.precision: the MDES (and power) for the planned level-2 predictor */
const precision = {
  type: 'object',
  additionalProperties: false,
  required: [
    'predictor',
    'kind',
    'groups',
    'meanSize',
    'sizeCv',
    'icc',
    'alpha',
    'targetPower',
    'df',
    'multiplier',
    'designEffect',
    'mdesEqual',
    'mdes',
  ],
  properties: {
    predictor: text,
    kind: { enum: ['binary', 'continuous'] },
    category: text,
    share: stat,
    groups: count,
    meanSize: stat,
    sizeCv: stat,
    icc: stat,
    alpha: stat,
    targetPower: stat,
    df: stat,
    multiplier: stat,
    designEffect: stat,
    mdesEqual: stat,
    mdes: stat,
    effectSize: stat,
    power: stat,
  },
} as const;

/** the "how to fit" section */
const fitAdvice = {
  type: 'object',
  additionalProperties: false,
  required: ['note', 'items'],
  properties: {
    note: text,
    items: {
      type: 'array',
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['topic', 'advice', 'because', 'source'],
        properties: { topic: text, advice: text, because: text, source: text, rules: texts },
      },
    },
  },
} as const;

const groupList = { ...texts, description: 'group IDs (all of them)' } as const;

/** one group's level-1 weights and the factors of the two usual scalings */
const groupWeights = {
  type: 'object',
  additionalProperties: false,
  required: ['group', 'n', 'sum', 'effectiveSize', 'sizeScale', 'effectiveScale'],
  properties: { group: text, n: count, sum: stat, effectiveSize: stat, sizeScale: stat, effectiveScale: stat },
} as const;

/** min, quartiles (Hyndman & Fan definition 7) and max of one scaling's factors over the groups */
const factorSpread = {
  type: 'object',
  additionalProperties: false,
  required: ['min', 'q1', 'median', 'q3', 'max'],
  properties: { min: stat, q1: stat, median: stat, q3: stat, max: stat },
} as const;

/** weights: Kish figures and, bounded, how the factors of the two usual scalings of level-1 weights spread over the groups */
const weights = {
  type: 'object',
  additionalProperties: false,
  properties: {
    level1: {
      type: 'object',
      additionalProperties: false,
      required: ['column', 'records', 'missing', 'nonPositiveGroups', 'designEffect', 'effectiveN', 'scaling'],
      properties: {
        column: text,
        records: count,
        missing: count,
        nonPositiveGroups: groupList,
        min: stat,
        designEffect: stat,
        effectiveN: stat,
        scaling: {
          type: 'object',
          additionalProperties: false,
          required: ['groups', 'size', 'effective', 'extreme'],
          properties: {
            groups: count,
            size: factorSpread,
            effective: factorSpread,
            extreme: {
              type: 'array',
              items: groupWeights,
              maxItems: 20,
              description: 'the groups whose factors are furthest from the median',
            },
          },
        },
      },
    },
    level2: {
      type: 'object',
      additionalProperties: false,
      required: ['column', 'groups', 'missing', 'varyingGroups', 'nonPositiveGroups', 'designEffect', 'effectiveGroups'],
      properties: {
        column: text,
        groups: count,
        missing: count,
        varyingGroups: groupList,
        nonPositiveGroups: groupList,
        min: stat,
        designEffect: stat,
        effectiveGroups: stat,
      },
    },
    form: {
      type: 'object',
      additionalProperties: false,
      required: ['form', 'correlation', 'atLeastGroupWeight', 'groups'],
      properties: { form: { enum: ['conditional', 'total', 'unclear'] }, correlation: stat, atLeastGroupWeight: stat, groups: count },
    },
  },
} as const;

/**
 * JSON Schema of the report `--format json` writes (its stable fields; `--with-plot-data` adds
 * `plots` and `rulesRun`, which it leaves open). In a finding, `rule`, `messageId` and the keys of
 * `data` are stable: a messageId never changes meaning once released, so a consumer can tell a
 * rule's messages apart without reading their text.
 */
export const reportSchema = {
  $schema: 'http://json-schema.org/draft-07/schema#',
  $id: 'https://nestready.dev/schema/report-1.json',
  title: 'nestready report',
  type: 'object',
  additionalProperties: false,
  required: ['schema', 'tool', 'input', 'roles', 'groups', 'outcomes', 'findings', 'score', 'grade', 'verdict'],
  properties: {
    schema: { const: REPORT_SCHEMA },
    tool: { type: 'object', additionalProperties: false, required: ['name', 'version'], properties: { name: text, version: text } },
    input: {
      type: 'object',
      additionalProperties: false,
      required: ['path', 'rows', 'rowsRejected', 'columns'],
      properties: {
        path: text,
        rows: count,
        rowsRejected: count,
        columns: texts,
        notes: texts,
        reading: {
          description: "how values were read where the delivery's writing asked for it; absent when plainly",
          type: 'object',
          additionalProperties: false,
          properties: {
            decimalComma: { const: true },
            binary: {
              description: 'per column: the word read as 1 and the word read as 0 (lower case; `written`: as the delivery writes them)',
              type: 'object',
              additionalProperties: {
                type: 'object',
                additionalProperties: false,
                required: ['one', 'zero'],
                properties: {
                  one: text,
                  zero: text,
                  written: {
                    type: 'object',
                    additionalProperties: false,
                    required: ['one', 'zero'],
                    properties: { one: text, zero: text },
                  },
                },
              },
            },
          },
        },
      },
    },
    roles: {
      description: 'the normalised role map',
      type: 'object',
      required: ['group', 'outcomes', 'level1', 'level2', 'missing', 'types', 'rules'],
      properties: {
        group: text,
        unit: text,
        parent: text,
        outcomes: texts,
        level1: texts,
        level2: texts,
        missing: texts,
        types: { type: 'object', additionalProperties: { enum: ['numeric', 'categorical', 'binary', 'count', 'ordinal', 'bounded'] } },
        binaryOne: { type: 'object', additionalProperties: text },
        bounds: {
          type: 'object',
          additionalProperties: { type: 'object', additionalProperties: false, properties: { lower: stat, upper: stat } },
        },
        slopes: texts,
        time: text,
        weights: { type: 'object', additionalProperties: false, properties: { level1: text, level2: text } },
        detect: {
          type: 'object',
          additionalProperties: false,
          required: ['predictor'],
          properties: { predictor: text, effectSize: stat },
        },
        rules: { type: 'object' },
      },
    },
    groups: {
      type: 'object',
      additionalProperties: false,
      required: ['count', 'singletons', 'sizes'],
      properties: {
        count,
        singletons: count,
        sizes: {
          type: 'object',
          additionalProperties: false,
          required: ['min', 'median', 'mean', 'max'],
          properties: { min: stat, median: stat, mean: stat, max: stat },
        },
      },
    },
    outcomes: {
      type: 'object',
      additionalProperties: {
        type: 'object',
        additionalProperties: false,
        required: ['n', 'groups', 'mean', 'reml', 'ml', 'anova', 'designEffect', 'effectiveN', 'meanReliability'],
        properties: {
          n: count,
          groups: count,
          mean: stat,
          reml: components,
          ml: components,
          anova: {
            type: 'object',
            additionalProperties: false,
            required: ['msb', 'msw', 'f', 'df1', 'df2', 'p', 'n0', 'icc', 'icc2', 'ci95'],
            properties: {
              msb: stat,
              msw: stat,
              f: stat,
              df1: stat,
              df2: stat,
              p: stat,
              n0: stat,
              icc: stat,
              icc2: stat,
              ci95: { type: 'array', items: stat, minItems: 2, maxItems: 2 },
            },
          },
          designEffect: stat,
          effectiveN: stat,
          meanReliability: stat,
          precision,
          logistic: {
            type: 'object',
            additionalProperties: false,
            required: ['tau2', 'icc', 'mor', 'logLik', 'intercept', 'quadraturePoints', 'converged'],
            properties: {
              tau2: stat,
              icc: stat,
              mor: stat,
              logLik: stat,
              intercept: stat,
              quadraturePoints: count,
              converged: { type: 'boolean' },
            },
          },
          slopes: {
            type: 'object',
            description: 'per planned random slope: the moment estimate of its variance from per-group OLS slopes',
            additionalProperties: {
              type: 'object',
              additionalProperties: false,
              required: ['groups', 'meanSlope', 'observedVariance', 'meanSamplingVariance', 'sigma2', 'tau11', 'reliability'],
              properties: {
                groups: count,
                meanSlope: stat,
                observedVariance: stat,
                meanSamplingVariance: stat,
                sigma2: stat,
                tau11: stat,
                reliability: stat,
              },
            },
          },
          poisson: {
            description: 'outcomes declared count: the random-intercept Poisson null model (ML, adaptive Gauss–Hermite) and its checks',
            type: 'object',
            additionalProperties: false,
            required: ['intercept', 'tau2', 'logLik', 'quadraturePoints', 'converged', 'latentIcc', 'dispersion', 'zeros', 'nonCounts'],
            properties: {
              intercept: stat,
              tau2: stat,
              logLik: stat,
              quadraturePoints: count,
              converged: { type: 'boolean' },
              latentIcc: stat,
              dispersion: {
                type: 'object',
                additionalProperties: false,
                required: ['statistic', 'df', 'ratio', 'p'],
                properties: { statistic: stat, df: count, ratio: stat, p: stat },
              },
              zeros: {
                type: 'object',
                additionalProperties: false,
                required: ['observed', 'expected'],
                properties: { observed: count, expected: stat },
              },
              nonCounts: count,
            },
          },
          threeLevel: threeLevelSchema,
        },
      },
    },
    findings: {
      type: 'array',
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['rule', 'severity', 'messageId', 'data', 'message', 'fix'],
        properties: {
          rule: { ...text, pattern: '^[a-z0-9]+(-[a-z0-9]+)*$', description: 'the rule id (stable)' },
          severity: { enum: ['blocker', 'warning', 'note'] },
          column: text,
          messageId: { ...text, pattern: '^[a-zA-Z][a-zA-Z0-9]*$', description: "which of the rule's messages (stable)" },
          data: {
            description: "the message's placeholders (stable keys); {values} is filled from `values`",
            type: 'object',
            additionalProperties: { type: ['string', 'number', 'null'] },
          },
          message: text,
          fix: text,
          count,
          groups: { ...texts, maxItems: 20, description: 'the first 20 group IDs' },
          rows: {
            type: 'array',
            items: { type: 'integer', minimum: 1 },
            maxItems: 20,
            description: 'the first 20 record numbers, 1-based',
          },
          values: { ...texts, maxItems: 20, description: 'raw values seen; absent with --no-values' },
          change: { const: true, description: 'a change since the previous delivery (compare, audit --baseline)' },
        },
      },
    },
    fitAdvice,
    weights,
    score: { type: 'integer', minimum: 0, maximum: 100 },
    grade: { enum: ['A', 'B', 'C', 'D', 'F'] },
    verdict: { enum: ['ready', 'caveats', 'not-ready'] },
    snapshot: snapshotSchema,
    changes: changesSchema,
    plots: { type: 'object', description: 'with --with-plot-data only; not a stable field' },
    rulesRun: { type: 'array', description: 'with --with-plot-data only; not a stable field' },
    weightFactors: { type: 'array', items: groupWeights, description: 'with --with-plot-data and weight factors asked for only' },
  },
} as const;
