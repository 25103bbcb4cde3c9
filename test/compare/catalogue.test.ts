import { readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { changeCatalogue } from '../../changes/index.js';
import { catalogue } from '../../rules/index.js';
import { fill, resolveParams } from '../../src/rules/engine.js';
import { createAjv } from '../../src/util/ajv.js';

describe('the change catalogue (changes/)', () => {
  it('lists every file once, alphabetically, each id its file name and no id of the audit rules', () => {
    const files = readdirSync('changes')
      .filter((f) => f.endsWith('.ts') && f !== 'index.ts' && !f.endsWith('.test.ts'))
      .map((f) => f.replace(/\.ts$/, ''));
    const ids = changeCatalogue.map((r) => r.meta.id);
    expect(ids).toEqual([...files].sort());
    const auditIds = new Set(catalogue.map((r) => r.meta.id));
    expect(ids.filter((id) => auditIds.has(id))).toEqual([]);
  });

  it('has valid params schemas with a default and a description for each, sources, and messages that render', () => {
    const ajv = createAjv({ checkSchemas: true });
    for (const rule of changeCatalogue) {
      const { params, messages, sources } = rule.meta;
      expect(ajv.validateSchema(params), rule.meta.id).toBe(true);
      expect(params.additionalProperties).toBe(false);
      for (const p of Object.values((params.properties ?? {}) as Record<string, { default?: unknown; description?: string }>)) {
        expect(p.default, rule.meta.id).toBeDefined();
        expect(p.description, rule.meta.id).toBeTruthy();
      }
      expect(sources.length).toBeGreaterThan(0);
      expect(resolveParams(rule, { rules: {} } as never)).not.toBe('off');
      for (const m of Object.values(messages)) {
        const names = [...`${m.message} ${m.fix}`.matchAll(/\{(\w+)\}/g)].map((x) => x[1]);
        const data = Object.fromEntries(names.map((n) => [n, 'x']));
        expect(fill(m.message, data, rule.meta.id)).not.toMatch(/\{\w+\}/);
      }
    }
  });
});
