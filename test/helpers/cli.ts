import { spawn } from 'node:child_process';

export interface Run {
  code: number | null;
  stdout: string;
  stderr: string;
}

/** Run the built CLI (bin/nestready.js → dist/bundle/cli.js) with NO_COLOR set. */
export function nestready(...args: string[]): Promise<Run> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['bin/nestready.js', ...args], {
      env: { ...process.env, NO_COLOR: '1', FORCE_COLOR: undefined },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let stdout = '';
    let stderr = '';
    child.stdout.setEncoding('utf8').on('data', (s: string) => (stdout += s));
    child.stderr.setEncoding('utf8').on('data', (s: string) => (stderr += s));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code, stdout, stderr }));
  });
}
