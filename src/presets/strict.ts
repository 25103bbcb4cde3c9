import type { Preset } from './types.js';

/** Gating model runs: whatever would make a model run misleading blocks it. */
export const strict: Preset = {
  description:
    'Gate before a model run: every defect that would make the model misleading blocks (repeated or ' +
    'mobile units, unreadable numbers, missing-value codes read as numbers, level-2 values missing ' +
    'or level-1 variables without within-group variation), and fewer groups are tolerated: block ' +
    'below 30 (Kreft 1996, as cited in Hox 2010), warn below 50 (Maas & Hox 2005), note below 100 ' +
    '(Maas & Hox 2004: robust standard errors).',
  rules: {
    'few-groups': { block_below: 30, warn_below: 50, note_below: 100 },
    'duplicate-unit-id': { severity: 'blocker' },
    'unit-in-several-groups': { block_share: 0 },
    'group-in-several-parents': { severity: 'blocker' },
    'non-numeric-values': { block_share: 0 },
    'sentinel-values': { severity: 'blocker' },
    'level2-partly-missing': { severity: 'blocker' },
    'level1-constant-within': { severity: 'blocker' },
    'singleton-groups': { warn_share: 0.05, block_share: 0.3 },
    'small-groups': { warn_share: 0.25 },
    'outcome-constant-within': { warn_share: 0.05 },
  },
};
