import type { RuleSetting } from '../roles/types.js';

/** A named set of rule settings, merged under the role map's own `rules`. */
export interface Preset {
  /** one paragraph: what the preset is for */
  description: string;
  /** per rule id: `off`, or a severity and params, as in a role map */
  rules: Record<string, RuleSetting>;
}
