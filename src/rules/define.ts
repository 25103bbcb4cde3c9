import type { Rule } from './types.js';

// eslint-style identity helper: it exists so each rule module gets its params type inferred
export function defineRule<P>(rule: Rule<P>): Rule<P> {
  return rule;
}

// the catalogue holds rules of different param types
// biome-ignore lint/suspicious/noExplicitAny: each rule's params type differs; the catalogue is checked against its schemas
export type AnyRule = Rule<any>;
