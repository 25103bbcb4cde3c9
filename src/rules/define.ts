import type { Rule } from './types.js';

// eslint-style identity helper: it exists so each rule module gets its params type inferred
export function defineRule<P>(rule: Rule<P>): Rule<P> {
  return rule;
}

// the catalogue holds rules of different param types
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type AnyRule = Rule<any>;
