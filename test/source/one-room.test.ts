import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

/** Every .ts file under `dir` (tests left out). */
function sources(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return sources(path);
    return path.endsWith('.ts') && !path.endsWith('.test.ts') ? [path] : [];
  });
}

describe('delivery access in one room', () => {
  it('no SQL is written outside src/source', () => {
    const outside = [...sources('src'), ...sources('rules')].filter((p) => !p.startsWith(join('src', 'source')));
    const sql = /\b(SELECT|CREATE|DROP)\s+[\w*"(]|\bread_(csv|parquet|json)\(|TRY_CAST\(/;
    expect(outside.filter((p) => sql.test(readFileSync(p, 'utf8')))).toEqual([]);
  });

  it('the problem-rows stage neither imports the rule catalogue nor names a rule', () => {
    const stage = sources(join('src', 'problems'))
      .map((p) => readFileSync(p, 'utf8'))
      .join('\n');
    expect(stage).not.toMatch(/rules\/index/);
    const ids = readdirSync('rules')
      .filter((n) => n.endsWith('.ts') && !n.endsWith('.test.ts') && n !== 'index.ts')
      .map((n) => n.slice(0, -3));
    expect(ids.length).toBeGreaterThan(10);
    expect(ids.filter((id) => stage.includes(`'${id}'`))).toEqual([]);
  });

  it('an engine is chosen only by the registry: audit and cli test no input kinds themselves', () => {
    for (const file of ['src/audit.ts', 'src/cli.ts']) {
      const text = readFileSync(file, 'utf8');
      expect(text).not.toMatch(/typeof input|postgres\(ql\)\?|engines\/(duckdb|postgres)\//);
    }
  });
});
