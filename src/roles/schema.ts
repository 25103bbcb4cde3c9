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
    missing: {
      type: 'array',
      items: { type: ['string', 'number'] },
      description: `tokens read as missing; default ${JSON.stringify(DEFAULT_MISSING)}`,
    },
    types: {
      type: 'object',
      additionalProperties: {
        anyOf: [
          { enum: ['numeric', 'categorical', 'binary'] },
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
      description: 'type overrides per column; a binary variable written in words may name the word read as 1: `{ binary: { one: "No" } }`',
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
