/**
 * How a variable's values are read. `count` (0, 1, 2, …), `ordinal` (ordered codes) and `bounded`
 * (a scale with a floor and a ceiling) are numbers too; they tell the model-readiness rules which
 * model the analyst will fit (see isNumberKind).
 */
export type ValueType = 'numeric' | 'categorical' | 'binary' | 'count' | 'ordinal' | 'bounded';

/** Types whose values are read as numbers (all but categorical; binary is 0/1). */
export const NUMBER_KINDS: readonly ValueType[] = ['numeric', 'count', 'ordinal', 'bounded'];

/** A type read as numbers other than 0/1: numeric, count, ordinal or bounded. */
export function isNumberKind(type: ValueType | undefined): boolean {
  return type !== undefined && NUMBER_KINDS.includes(type);
}
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
  /** Bounded variables' floor and ceiling (from `types: { x: { bounded: { lower, upper } } }`). */
  bounds?: Record<string, { lower?: number; upper?: number }>;
  /** level-1 variables the analyst plans to give random slopes (each also in level1) */
  slopes?: string[];
  /** the occasion of longitudinal data (measurements nested in persons; also in level1) */
  time?: string;
  /** sampling weights: of the records (level 1) and of the groups (level 2) */
  weights?: { level1?: string; level2?: string };
  /**
   * The planned level-2 predictor of main interest (also in level2) and, optionally, the
   * standardised effect size the study must detect (for the precision section).
   */
  detect?: { predictor: string; effectSize?: number };
  rules: Record<string, RuleSetting>;
}
