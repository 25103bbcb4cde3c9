import { BATCH_SCHEMA } from '../batch/types.js';

const count = { type: 'integer', minimum: 0 } as const;
const text = { type: 'string' } as const;

/**
 * JSON Schema of the batch summary (`nestready audit` of several deliveries, `--format json`).
 * A row carries no raw data value: file, sender, standing, counts and the outcomes' REML ICC.
 */
export const batchSchema = {
  $schema: 'http://json-schema.org/draft-07/schema#',
  $id: 'https://nestready.dev/schema/batch-1.json',
  title: 'nestready batch summary',
  type: 'object',
  additionalProperties: false,
  required: ['schema', 'tool', 'roles', 'failOn', 'exitCode', 'counts', 'deliveries', 'skipped'],
  properties: {
    schema: { const: BATCH_SCHEMA },
    tool: { type: 'object', additionalProperties: false, required: ['name', 'version'], properties: { name: text, version: text } },
    roles: { description: 'the role map every delivery was audited against', ...text },
    failOn: { enum: ['blocker', 'warning', 'never'] },
    exitCode: {
      description: '3 nestready failed on a delivery, 2 a delivery could not be read, 1 one failed the gate, 0 all passed',
      enum: [0, 1, 2, 3],
    },
    counts: {
      type: 'object',
      additionalProperties: false,
      required: ['deliveries', 'unreadable', 'notReady', 'caveats', 'ready', 'skipped'],
      properties: { deliveries: count, unreadable: count, notReady: count, caveats: count, ready: count, skipped: count },
    },
    deliveries: {
      description: 'worst first: unreadable, not ready, caveats, ready; then most blockers, most warnings, file name',
      type: 'array',
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['file', 'sender', 'status', 'gate'],
        properties: {
          file: text,
          sender: text,
          folder: { description: 'its folder under --reports-dir', ...text },
          status: { enum: ['audited', 'unreadable', 'error'] },
          error: { description: 'the one-line error of a delivery that was not audited', ...text },
          gate: { enum: ['pass', 'fail'] },
          verdict: { enum: ['ready', 'caveats', 'not-ready'] },
          grade: { enum: ['A', 'B', 'C', 'D', 'F'] },
          score: { type: 'integer', minimum: 0, maximum: 100 },
          blockers: count,
          warnings: count,
          notes: count,
          records: count,
          groups: count,
          icc: {
            description: 'per outcome: the REML ICC of the null model',
            type: 'object',
            additionalProperties: { type: ['number', 'null'] },
          },
          files: {
            description: "the delivery's own files, relative to the summary's folder",
            type: 'object',
            additionalProperties: false,
            required: ['html', 'json', 'problems'],
            properties: { html: text, json: text, problems: text },
          },
        },
        // an audited delivery has its standing and counts; any other its error
        oneOf: [
          {
            properties: { status: { const: 'audited' } },
            required: ['verdict', 'grade', 'score', 'blockers', 'warnings', 'notes', 'records', 'groups', 'icc'],
          },
          { properties: { status: { enum: ['unreadable', 'error'] } }, required: ['error'] },
        ],
      },
    },
    skipped: {
      description: 'files met in a folder or by a pattern whose names name no delivery format',
      type: 'array',
      items: { type: 'object', additionalProperties: false, required: ['file', 'reason'], properties: { file: text, reason: text } },
    },
  },
} as const;
