import type { AnyRule } from '../src/rules/define.js';
import fewGroups from './few-groups.js';
import level2Varies from './level2-varies.js';
import lowIcc from './low-icc.js';
import missingGroupId from './missing-group-id.js';
import singletonGroups from './singleton-groups.js';
import unreadableLines from './unreadable-lines.js';

/** The built-in catalogue, alphabetical by id (a test checks it against the files in rules/). */
export const catalogue: readonly AnyRule[] = [
  fewGroups,
  level2Varies,
  lowIcc,
  missingGroupId,
  singletonGroups,
  unreadableLines,
];
