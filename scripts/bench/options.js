// @ts-check
// The bench's command line: which (rows, groups) cases, rule sets and repeats to run.
import { parseArgs } from 'node:util';
import { TARGET_RATIO } from './config.js';

/** @typedef {{ rows: number, groups: number }} Case */

/** A usage error: one line on stderr, exit 2. @param {string} message @returns {never} */
function usage(message) {
  process.stderr.write(`bench: ${message}\n`);
  process.exit(2);
}

/** @param {string} name @param {string} s @param {number} [min] */
function count(name, s, min = 1) {
  const n = Number(String(s).replace(/_/g, ''));
  if (!Number.isFinite(n) || !Number.isInteger(n) || n < min) usage(`--${name} must be an integer >= ${min} (got "${s}")`);
  return n;
}
/** @param {string} s */
const items = (s) =>
  String(s)
    .split(',')
    .map((x) => x.trim())
    .filter(Boolean);
/** @param {string} name @param {string} s */
const list = (name, s) => items(s).map((x) => count(name, x));

/** @param {string[]} args */
export function benchOptions(args) {
  const { values: opt } = parseArgs({
    args,
    options: {
      rows: { type: 'string', default: '1000000' },
      groups: { type: 'string', default: '5000' },
      seed: { type: 'string', default: '1' },
      repeat: { type: 'string', default: '3' },
      sizes: { type: 'string' },
      'groups-list': { type: 'string' },
      cases: { type: 'string' },
      batch: { type: 'string' },
      compare: { type: 'string' },
      draft: { type: 'string' },
      'batch-groups': { type: 'string', default: '500' },
      'memory-limit': { type: 'string' },
      'rule-sets': { type: 'string', default: 'core,full' },
      keep: { type: 'boolean', default: false },
      help: { type: 'boolean', short: 'h', default: false },
    },
    strict: true,
  });
  if (opt.help) return { help: /** @type {const} */ (true) };

  const seed = count('seed', opt.seed, 0);
  const repeat = count('repeat', opt.repeat);
  const rowsList = opt.sizes ? list('sizes', opt.sizes) : [count('rows', opt.rows, 0)];
  const groupsList = opt['groups-list'] ? list('groups-list', opt['groups-list']) : [count('groups', opt.groups)];
  /** @type {Case[]} */
  const cases = opt.cases
    ? items(opt.cases === 'none' ? '' : opt.cases).map((x) => {
        const [r, g] = x.split('x');
        return { rows: count('cases', r, 0), groups: count('cases', g ?? '') };
      })
    : rowsList.flatMap((rows) => groupsList.map((groups) => ({ rows, groups })));

  const ruleSets = items(opt['rule-sets']);
  if (!ruleSets.length || ruleSets.some((x) => !(x in TARGET_RATIO))) {
    usage(`--rule-sets takes ${Object.keys(TARGET_RATIO).join(', ')} (got "${opt['rule-sets']}")`);
  }
  const [batchDeliveries, batchRows] = opt.batch ? opt.batch.split('x') : [];
  const batch = opt.batch
    ? {
        deliveries: count('batch', batchDeliveries),
        rows: count('batch', batchRows ?? ''),
        groups: count('batch-groups', opt['batch-groups']),
      }
    : null;
  return {
    help: /** @type {const} */ (false),
    batch,
    compare: opt.compare ? count('compare', opt.compare) : null,
    draft: opt.draft ? count('draft', opt.draft) : null,
    seed,
    repeat,
    cases,
    ruleSets,
    memoryLimit: opt['memory-limit'],
    keep: opt.keep,
  };
}
