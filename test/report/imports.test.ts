import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = resolve('.');
const REPORT = join(ROOT, 'src/report');

function files(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((d) =>
    d.isDirectory() ? files(join(dir, d.name)) : d.name.endsWith('.ts') ? [join(dir, d.name)] : [],
  );
}

interface Import {
  file: string;
  target: string;
  typeOnly: boolean;
}

/** Every relative import of a file (static, re-export or dynamic), resolved to a path from the repository root. */
function importsOf(file: string): Import[] {
  const text = readFileSync(file, 'utf8');
  const found: Import[] = [];
  const patterns = [
    /^\s*(import|export)\s+(type\s+)?[^'";]*?\sfrom\s+'([^']+)'/gm,
    /^\s*import\s+'([^']+)'/gm,
    /import\(\s*'([^']+)'\s*\)/g,
  ];
  for (const [i, re] of patterns.entries()) {
    for (const m of text.matchAll(re)) {
      const spec = i === 0 ? m[3] : m[1];
      if (!spec.startsWith('.')) continue;
      const target = relative(ROOT, resolve(dirname(file), spec))
        .replace(/\\/g, '/')
        .replace(/\.js$/, '');
      found.push({ file: relative(ROOT, file), target, typeOnly: i === 0 && m[2] !== undefined });
    }
  }
  return found;
}

/** Why a renderer may not import this, or null: renderers draw the report, they compute nothing. */
function forbidden(imp: Import): string | null {
  if (/^rules\//.test(imp.target)) return 'the rule catalogue';
  if (imp.target === 'src/rules/engine') return 'the rule engine (resolveParams)';
  if (imp.target === 'src/rules/variable-stats') return 'a statistics fit';
  if (imp.typeOnly) return null;
  if (/^src\/stats\//.test(imp.target)) return 'a statistics function';
  if (/^src\/(analysis|profile|source|problems)\//.test(imp.target)) return 'analysis or delivery access';
  return null;
}

describe('src/report', () => {
  const all = files(REPORT).flatMap(importsOf);

  it('holds renderers only: no catalogue, no rule engine, no statistics fit, no analysis', () => {
    expect(all.length).toBeGreaterThan(20); // the scan sees the imports at all
    const bad = all.filter((imp) => forbidden(imp) !== null).map((imp) => `${imp.file} imports ${imp.target} (${forbidden(imp)})`);
    expect(bad).toEqual([]);
  });

  it('the scan catches what it is meant to catch', () => {
    const at = (target: string, typeOnly = false) => forbidden({ file: 'src/report/x.ts', target, typeOnly });
    expect(at('rules/index')).not.toBeNull();
    expect(at('src/rules/engine', true)).not.toBeNull();
    expect(at('src/rules/variable-stats')).not.toBeNull();
    expect(at('src/stats/reml-components')).not.toBeNull();
    expect(at('src/analysis/plot-data')).not.toBeNull();
    expect(at('src/stats/types', true)).toBeNull();
    expect(at('src/severity')).toBeNull();
  });
});
