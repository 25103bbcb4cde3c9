import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { InputError } from '../../src/errors.js';
import { parseRoles } from '../../src/roles/load.js';
import { loadRoles } from '../../src/roles/load-file.js';
import { ROLE_MAP_LIMITS } from '../../src/roles/yaml-guards.js';

/** The one-line InputError parseRoles throws for `text`. */
function errorOf(text: string): string {
  try {
    parseRoles(text, 'roles.yaml', catalogue);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    const { message } = e as InputError;
    expect(message).not.toContain('\n');
    return message;
  }
  throw new Error(`expected an InputError for ${JSON.stringify(text.slice(0, 80))}`);
}

const dir = mkdtempSync(join(tmpdir(), 'nestready-hostile-roles-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('hostile role maps: refused at line:column, in the user words', () => {
  it('a key that is a list or a map, with no library warning', () => {
    const warnings: string[] = [];
    const onWarning = (w: Error) => warnings.push(w.message);
    process.on('warning', onWarning);
    try {
      expect(errorOf('? [complex, key]\n: v\ngroup: g\noutcome: y\n')).toBe('roles.yaml:1:3: a key that is a list; keys are names');
      expect(errorOf('group: g\n? { a: 1 }\n: v\n')).toBe('roles.yaml:2:3: a key that is a map; keys are names');
    } finally {
      process.off('warning', onWarning);
    }
    expect(warnings).toEqual([]);
  });

  it('a duplicate key and a second document', () => {
    expect(errorOf('group: g\noutcome: y\ngroup: h\n')).toMatch(/^roles\.yaml:3:1: invalid YAML: Map keys must be unique/);
    expect(errorOf('group: g\noutcome: y\n---\ngroup: h\n')).toBe('roles.yaml:3:1: a second YAML document; a role map is one document');
  });

  it('20,000 nested brackets and 300 nested block maps: nested deeper than 64 levels, no stack overflow', () => {
    const flow = `group: ${'['.repeat(20_000)}${']'.repeat(20_000)}\n`;
    // the map is level 1; the 64th bracket, at offset 7 + 63, is level 65
    expect(errorOf(flow)).toBe('roles.yaml:1:71: nested deeper than 64 levels');
    const block = Array.from({ length: 300 }, (_, i) => `${' '.repeat(i)}k:\n`).join('');
    expect(errorOf(block)).toBe('roles.yaml:65:65: nested deeper than 64 levels');
    // 64 levels are within the limit (and refused for what they say, not for their depth)
    expect(errorOf(`group: ${'['.repeat(63)}${']'.repeat(63)}\n`)).not.toMatch(/nested/);
  });

  it('more missing tokens, list names or YAML tokens than the limits', () => {
    const tokens = (n: number) => Array.from({ length: n }, (_, i) => `t${i}`).join(', ');
    expect(() => parseRoles(`group: g\noutcome: y\nmissing: [${tokens(1_000)}]\n`, 'roles.yaml', catalogue)).not.toThrow();
    expect(errorOf(`group: g\noutcome: y\nmissing: [${tokens(1_001)}]\n`)).toBe('roles.yaml:3:1: 1,001 missing tokens; at most 1,000');
    expect(errorOf(`group: g\nlevel1: [${tokens(10_001)}]\n`)).toBe('roles.yaml:2:1: 10,001 names; at most 10,000');
    expect(errorOf(`group: g\nmissing: [${'a,'.repeat(80_000)}]\n`)).toBe(
      'roles.yaml: the role map has more than 150,000 YAML tokens, the limit',
    );
  });

  it('a 10 MB map of 750,000 missing tokens fails fast and small, unread', () => {
    const file = join(dir, 'big.yaml');
    const lines = Array.from({ length: 750_000 }, (_, i) => `  - t${i}`).join('\n');
    writeFileSync(file, `group: g\noutcome: y\nmissing:\n${lines}\n`);
    const heap = process.memoryUsage().heapUsed;
    const t0 = performance.now();
    expect(() => loadRoles(file, catalogue)).toThrow(/big\.yaml: the role map is [\d,]+ bytes; the limit is 1 MiB \(1048576 bytes\)$/);
    expect(performance.now() - t0).toBeLessThan(1000);
    expect(process.memoryUsage().heapUsed - heap).toBeLessThan(50 * 2 ** 20);
    // the same text given as text (the page) is refused by its size too
    expect(errorOf(`group: g\nmissing:\n${'  - x\n'.repeat(ROLE_MAP_LIMITS.bytes / 6 + 1)}`)).toMatch(/the limit is 1 MiB/);
  });
});
