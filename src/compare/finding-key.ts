import type { Finding } from '../rules/types.js';

/** A finding's identity across deliveries: its rule, message and column (counts and groups may change). */
export function findingKey(f: Pick<Finding, 'rule' | 'messageId' | 'column'>): string {
  return JSON.stringify([f.rule, f.messageId, f.column ?? null]);
}
