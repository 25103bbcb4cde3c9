import type { Preset } from './types.js';

/** A first look at a delivery: what to send back to the sender, with modelling advice kept quiet. */
export const intake: Preset = {
  description:
    'First look at a new delivery: data and structure defects keep their severity, so the gate is ' +
    'about what to send back to the sender; modelling questions (numbers of groups, clustering, ' +
    'centering) become notes or are left out, and missing-value codes are looked for harder.',
  rules: {
    'few-groups': { severity: 'note' },
    'low-icc': { severity: 'note' },
    'groups-per-level2-predictor': { severity: 'note' },
    'small-groups': { severity: 'note' },
    'unbalanced-groups': { severity: 'note' },
    'predictor-between-share': 'off',
    'low-group-mean-reliability': 'off',
    'sentinel-values': { min_count: 1 },
    'missing-by-group': { alpha: 0.05 },
  },
};
