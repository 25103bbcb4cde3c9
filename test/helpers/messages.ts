import { expect } from 'vitest';
import { catalogue } from '../../rules/index.js';
import type { Finding } from '../../src/rules/types.js';

/** The `{name}` placeholders of a message template, each once, in order of appearance. */
export function placeholders(template: string): string[] {
  return [...new Set([...template.matchAll(/\{(\w+)\}/g)].map((m) => m[1]))];
}

/**
 * Assert that a finding is its rule's message `messageId`, with at least the given `data` (the
 * values the rule filled the template with). Rule tests check which message and which values,
 * not the wording: that is checked once per message by test/rules/catalogue.test.ts. A messageId
 * the rule does not declare fails with the ones it does.
 */
export function expectMessage(finding: Finding, messageId: string, data?: Record<string, string | number>): void {
  const rule = catalogue.find((r) => r.meta.id === finding.rule);
  if (!rule) throw new Error(`no rule "${finding.rule}" in the catalogue`);
  const declared = Object.keys(rule.meta.messages);
  if (!declared.includes(messageId)) {
    throw new Error(`${finding.rule}: undeclared messageId "${messageId}" (declared: ${declared.join(', ')})`);
  }
  expect(finding.messageId, `${finding.rule}: messageId`).toBe(messageId);
  if (data) expect(finding.data, `${finding.rule}/${messageId}: data`).toMatchObject(data);
}
