import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll } from 'vitest';

export interface Run {
  code: number | null;
  stdout: string;
  stderr: string;
}

/** Run the built CLI (bin/nestready.js → dist/bundle/cli.js) with NO_COLOR set, `stdin` (if given) on its standard input. */
function run(args: string[], stdin?: string | Uint8Array): Promise<Run> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['bin/nestready.js', ...args], {
      env: { ...process.env, NO_COLOR: '1', FORCE_COLOR: undefined },
      stdio: [stdin === undefined ? 'ignore' : 'pipe', 'pipe', 'pipe'],
    });
    let stdout = '';
    let stderr = '';
    child.stdout?.setEncoding('utf8').on('data', (s: string) => (stdout += s));
    child.stderr?.setEncoding('utf8').on('data', (s: string) => (stderr += s));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code, stdout, stderr }));
    if (stdin !== undefined) child.stdin?.end(stdin);
  });
}

/** Run the built CLI with NO_COLOR set. */
export function nestready(...args: string[]): Promise<Run> {
  return run(args);
}

/** Run the built CLI with `input` on its standard input. */
export function nestreadyWithStdin(input: string | Uint8Array, ...args: string[]): Promise<Run> {
  return run(args, input);
}

/**
 * A temp folder for a CLI test file, made before its tests (which need the built CLI) and removed
 * after them; `file(name, text)` writes a file into it and returns its path.
 */
export function cliScratch(prefix: string): { dir: () => string; file: (name: string, text: string) => string } {
  let dir = '';
  beforeAll(() => {
    if (!existsSync('dist/bundle/cli.js')) throw new Error('dist/bundle/cli.js is missing: run `npm run build` first (npm test does)');
    dir = mkdtempSync(join(tmpdir(), prefix));
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  return {
    dir: () => dir,
    file: (name, text) => {
      const path = join(dir, name);
      writeFileSync(path, text);
      return path;
    },
  };
}
