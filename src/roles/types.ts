export type ValueType = 'numeric' | 'categorical' | 'binary';
export type Severity = 'blocker' | 'warning' | 'note';

/** Per-rule setting in the role map: `off`, or a severity override plus the rule's params. */
export type RuleSetting = 'off' | ({ severity?: Severity } & Record<string, unknown>);

/** The role map after validation and normalisation (shared/design.md, "Role map"). */
export interface Roles {
  group: string;
  unit?: string;
  parent?: string;
  outcomes: string[];
  level1: string[];
  level2: string[];
  missing: string[];
  types: Record<string, ValueType>;
  /**
   * Binary variables written in words: the word read as 1, per column (from
   * `types: { x: { binary: { one: … } } }`); absent when the role map names none.
   */
  binaryOne?: Record<string, string>;
  rules: Record<string, RuleSetting>;
}
