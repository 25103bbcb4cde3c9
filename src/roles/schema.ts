/** Missing-value tokens used when the role map names none. */
export const DEFAULT_MISSING = ['', 'NA', 'N/A', 'NULL', 'null', '.'];

const columnName = { type: 'string', minLength: 1 } as const;
const columnList = {
  anyOf: [columnName, { type: 'array', items: columnName, uniqueItems: true }],
} as const;

/**
 * JSON Schema of the role map, printed by `nestready schema`. Singles and lists are both
 * accepted where a list is expected; normalisation turns them into lists.
 */
export const roleMapSchema = {
  $schema: 'http://json-schema.org/draft-07/schema#',
  $id: 'https://nestready.dev/schema/role-map-1.json',
  title: 'nestready role map',
  description: 'Which column of a delivery plays which part in a two-level design.',
  type: 'object',
  additionalProperties: false,
  required: ['group'],
  properties: {
    group: { ...columnName, description: 'level-2 identifier column (required)' },
    unit: { ...columnName, description: 'level-1 identifier column' },
    parent: { ...columnName, description: 'identifier of the level above the groups' },
    outcome: { ...columnName, description: 'a single outcome column (same as outcomes: [name])' },
    outcomes: { ...columnList, description: 'outcome columns' },
    level1: { ...columnList, description: 'level-1 variables' },
    level2: { ...columnList, description: 'level-2 variables: must be constant within each group' },
    slopes: { ...columnList, description: 'level-1 variables planned to get random slopes (read as level-1 variables too)' },
    time: { ...columnName, description: 'the occasion of longitudinal data: measurements nested in persons (a level-1 variable too)' },
    weights: {
      type: 'object',
      additionalProperties: false,
      description: 'sampling weights',
      properties: {
        level1: { ...columnName, description: 'weight of each record (level 1)' },
        level2: { ...columnName, description: 'weight of each group (level 2): constant within a group' },
      },
    },
    detect: {
      type: 'object',
      additionalProperties: false,
      required: ['predictor'],
      description: 'the planned level-2 predictor of main interest, and the standardised effect size the study must detect',
      properties: {
        predictor: { ...columnName, description: 'a level-2 variable (read as one too)' },
        effect_size: { type: 'number', exclusiveMinimum: 0, description: 'in standard deviations of the outcome' },
      },
    },
    missing: {
      type: 'array',
      items: { type: ['string', 'number'] },
      description: `tokens read as missing; default ${JSON.stringify(DEFAULT_MISSING)}`,
    },
    types: {
      type: 'object',
      additionalProperties: {
        anyOf: [
          { enum: ['numeric', 'categorical', 'binary', 'count', 'ordinal', 'bounded'] },
          {
            type: 'object',
            additionalProperties: false,
            required: ['bounded'],
            properties: {
              bounded: {
                type: 'object',
                additionalProperties: false,
                properties: {
                  lower: { type: 'number', description: 'the lowest value the scale allows (its floor)' },
                  upper: { type: 'number', description: 'the highest value the scale allows (its ceiling)' },
                },
              },
            },
          },
          {
            type: 'object',
            additionalProperties: false,
            required: ['binary'],
            properties: {
              binary: {
                type: 'object',
                additionalProperties: false,
                required: ['one'],
                properties: {
                  one: {
                    type: ['string', 'boolean'],
                    minLength: 1,
                    description: 'the word read as 1 (default: yes, true or y, whichever pair the column is written in)',
                  },
                },
              },
            },
          },
        ],
      },
      description:
        'type overrides per column; a binary variable written in words may name the word read as 1: `{ binary: { one: "No" } }`; ' +
        'a bounded scale may name its floor and ceiling: `{ bounded: { lower: 0, upper: 100 } }`',
    },
    rules: {
      type: 'object',
      description: 'per rule id: `off`, or an object with an optional severity and the rule params',
      additionalProperties: {
        anyOf: [
          { const: 'off' },
          {
            type: 'object',
            properties: { severity: { enum: ['blocker', 'warning', 'note'] } },
          },
        ],
      },
    },
  },
} as const;
