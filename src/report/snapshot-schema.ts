// JSON Schemas of the report's optional `snapshot` and `changes` (src/report/snapshot.ts)
const stat = { type: ['number', 'null'] } as const;
const count = { type: 'integer', minimum: 0 } as const;
const text = { type: 'string' } as const;
const counts = { type: 'array', items: count } as const;
const stats = { type: 'array', items: stat } as const;

const sketch = {
  type: 'object',
  additionalProperties: false,
  required: ['n', 'edges', 'atOrBelow'],
  properties: { n: count, edges: { type: 'array', items: { type: 'number' } }, atOrBelow: counts },
} as const;

export const snapshotSchema = {
  type: 'object',
  description: 'compact per-group summary for comparing the next delivery with this one (README: Snapshot); no record, no unit ID',
  additionalProperties: false,
  required: ['values', 'rows', 'missingGroupRows', 'groups', 'columns'],
  properties: {
    values: { enum: ['raw', 'hashed'] },
    rows: count,
    missingGroupRows: count,
    groups: {
      type: 'object',
      additionalProperties: false,
      required: ['ids', 'sizes', 'level2', 'outcomes', 'missing'],
      properties: {
        ids: { type: 'array', items: text },
        sizes: counts,
        level2: { type: 'object', additionalProperties: { type: 'array', items: { type: ['string', 'null', 'boolean'] } } },
        outcomes: {
          type: 'object',
          additionalProperties: {
            type: 'object',
            additionalProperties: false,
            required: ['n', 'mean', 'variance'],
            properties: { n: counts, mean: stats, variance: stats },
          },
        },
        missing: { type: 'object', additionalProperties: counts },
        bins: { type: 'object', additionalProperties: { type: 'array', items: counts } },
      },
    },
    columns: {
      type: 'object',
      additionalProperties: {
        type: 'object',
        additionalProperties: false,
        required: ['type', 'storage', 'missing'],
        properties: { type: { enum: ['numeric', 'categorical', 'binary'] }, storage: { enum: ['text', 'double'] }, missing: count, sketch },
      },
    },
  },
} as const;

const side = {
  type: 'object',
  additionalProperties: false,
  required: ['icc', 'ci95', 'tau2', 'sigma2'],
  properties: { icc: stat, ci95: { type: 'array', items: stat, minItems: 2, maxItems: 2 }, tau2: stat, sigma2: stat },
} as const;

export const changesSchema = {
  type: 'object',
  description: 'the comparison with the previous delivery (compare, audit --baseline); its findings are marked change: true',
  additionalProperties: false,
  required: ['previous', 'groups', 'findings', 'outcomes', 'skipped'],
  properties: {
    previous: {
      type: 'object',
      additionalProperties: false,
      required: ['path', 'rows', 'groups', 'from'],
      properties: { path: text, rows: count, groups: count, from: { enum: ['delivery', 'report'] } },
    },
    groups: {
      type: 'object',
      additionalProperties: false,
      required: ['both', 'appeared', 'vanished'],
      properties: { both: count, appeared: count, vanished: count },
    },
    findings: {
      type: 'object',
      additionalProperties: false,
      required: ['new', 'resolved', 'persisting'],
      properties: { new: count, resolved: count, persisting: count },
    },
    outcomes: {
      type: 'object',
      additionalProperties: {
        type: 'object',
        additionalProperties: false,
        required: ['previous', 'current', 'z', 'p'],
        properties: { previous: side, current: side, z: stat, p: stat },
      },
    },
    skipped: { type: 'array', items: text },
  },
} as const;
