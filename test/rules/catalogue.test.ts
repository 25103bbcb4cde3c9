import { readdirSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import type { Roles } from '../../src/roles/types.js';
import type { AnyRule } from '../../src/rules/define.js';
import { fill, resolveParams } from '../../src/rules/engine.js';
import type { Finding } from '../../src/rules/types.js';
import { createAjv } from '../../src/util/ajv.js';
import { expectMessage, placeholders } from '../helpers/messages.js';

const rulesDir = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'rules');
const ruleFiles = readdirSync(rulesDir)
  .filter((f) => f.endsWith('.ts') && !f.endsWith('.test.ts') && f !== 'index.ts')
  .sort();
const ids = ruleFiles.map((f) => basename(f, '.ts'));

describe('rule catalogue', () => {
  it('has the foundation rules', () => {
    expect(ids).toEqual(expect.arrayContaining(['few-groups', 'level2-varies', 'low-icc', 'missing-group-id', 'singleton-groups']));
  });

  it('holds every rules/<id>.ts, in alphabetical order, each once', () => {
    const listed = catalogue.map((r) => r.meta.id);
    expect(listed).toEqual(ids);
    expect([...listed].sort()).toEqual(listed);
    expect(new Set(listed).size).toBe(listed.length);
  });

  it.each(ruleFiles)("%s: the catalogue entry is the file's default export and meta.id is its basename", async (file) => {
    const mod = (await import(pathToFileURL(join(rulesDir, file)).href)) as { default: AnyRule };
    const id = basename(file, '.ts');
    expect(mod.default.meta.id).toBe(id);
    expect(catalogue.find((r) => r.meta.id === id)).toBe(mod.default);
    expect(typeof mod.default.check).toBe('function');
  });

  describe.each(catalogue.map((r) => [r.meta.id, r] as const))('%s', (id, rule) => {
    const { meta } = rule;

    it('is kebab-case with a title, level, default severity and description', () => {
      expect(id).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/);
      expect(meta.title.trim()).not.toBe('');
      expect(['data', 'structure', 'variance']).toContain(meta.level);
      expect(['blocker', 'warning', 'note']).toContain(meta.defaultSeverity);
      expect(meta.description.trim().length).toBeGreaterThan(20);
    });

    it('params: an object schema that the project ajv compiles, closed, every property with default and description', () => {
      const schema = meta.params as { type?: string; properties?: Record<string, Record<string, unknown>>; additionalProperties?: unknown };
      expect(schema.type).toBe('object');
      expect(schema.additionalProperties).toBe(false);
      expect(schema.properties).toBeTypeOf('object');
      const validate = createAjv({ checkSchemas: true }).compile(schema);
      for (const [name, prop] of Object.entries(schema.properties ?? {})) {
        expect(prop, `${id}.${name} default`).toHaveProperty('default');
        expect(typeof prop.description, `${id}.${name} description`).toBe('string');
        expect((prop.description as string).trim(), `${id}.${name} description`).not.toBe('');
        // each default is itself a valid value of its property
        expect(validate({ [name]: prop.default }), `${id}.${name} default is valid`).toBe(true);
      }
      // an empty setting is valid and gets every default filled in
      const filled: Record<string, unknown> = {};
      expect(validate(filled)).toBe(true);
      expect(Object.keys(filled).sort()).toEqual(Object.keys(schema.properties ?? {}).sort());
      // the engine takes the same defaults straight from the schema when the role map sets nothing
      expect(resolveParams(rule, { rules: {} } as unknown as Roles)).toEqual(filled);
      // unknown params are refused
      expect(validate({ no_such_param: 1 })).toBe(false);
    });

    it('every message has a message and a fix', () => {
      const messages = Object.entries(meta.messages);
      expect(messages.length).toBeGreaterThan(0);
      for (const [messageId, m] of messages) {
        expect(typeof m.message, `${id}/${messageId}.message`).toBe('string');
        expect(m.message.trim(), `${id}/${messageId}.message`).not.toBe('');
        expect(typeof m.fix, `${id}/${messageId}.fix`).toBe('string');
        expect(m.fix.trim(), `${id}/${messageId}.fix`).not.toBe('');
      }
    });

    it('every message renders with sample data: all placeholders filled, a lowercase fragment and a fix', () => {
      for (const [messageId, m] of Object.entries(meta.messages)) {
        const where = `${id}/${messageId}`;
        expect(messageId, where).toMatch(/^[a-z][a-zA-Z0-9]*$/);
        const names = placeholders(`${m.message} ${m.fix}`);
        const sample = Object.fromEntries(names.map((name) => [name, `<${name}>`]));
        const message = fill(m.message, sample, id);
        const fix = fill(m.fix, sample, id);
        for (const text of [message, fix]) {
          expect(text, where).not.toMatch(/\{\w+\}/);
          expect(text.trim(), where).toBe(text);
          expect(text, where).not.toMatch(/\.$/);
        }
        for (const name of placeholders(m.message)) expect(message, where).toContain(`<${name}>`);
        // a message is a lowercase fragment; a fix is an instruction, capitalised
        expect(message[0], where).not.toMatch(/[A-Z]/);
        expect(fix, where).toMatch(/^[A-Z]/);
        expect(fix.length, where).toBeGreaterThan(20);
      }
    });

    it('cites its sources', () => {
      expect(Array.isArray(meta.sources)).toBe(true);
      expect(meta.sources.length).toBeGreaterThan(0);
      for (const s of meta.sources) expect(s.trim()).not.toBe('');
    });
  });
});

describe("expectMessage, the rule tests' check of a finding's message", () => {
  const finding: Finding = {
    rule: 'few-groups',
    severity: 'warning',
    messageId: 'usual',
    data: { count: 12, limit: 30 },
    message: 'm',
    fix: 'f',
  };

  it('passes on the declared messageId and the data given', () => {
    expect(() => expectMessage(finding, 'usual', { count: 12 })).not.toThrow();
  });

  it('fails on an undeclared messageId and lists the declared ones', () => {
    expect(() => expectMessage(finding, 'tooFew')).toThrow('few-groups: undeclared messageId "tooFew" (declared: floor, usual, strict)');
  });

  it('fails on another declared message or other data', () => {
    expect(() => expectMessage(finding, 'floor')).toThrow();
    expect(() => expectMessage(finding, 'usual', { count: 13 })).toThrow();
  });
});
