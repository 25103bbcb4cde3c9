// @ts-check
// Timing a spawned process the same way for every side: wall clock from spawn to exit, and CPU
// time through GNU time when the system has it.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { loadavg } from 'node:os';
import { ROOT } from './config.js';

// CPU seconds (user+sys) of a spawned process, via GNU time when the system has it: less
// sensitive than wall time to other load on the machine, and taken the same way for both sides
const GNU_TIME = existsSync('/usr/bin/time') ? '/usr/bin/time' : null;
const TIME_TAG = 'NRBENCH_TIME';

/**
 * @typedef {object} Timed
 * @property {number} wallMs
 * @property {number | null} cpuMs
 * @property {number | null} maxRssMB peak RSS of the process (GNU time), null without it
 * @property {number | null} code
 * @property {NodeJS.Signals | null} signal
 * @property {string} stdout
 * @property {string} stderr
 * @property {number} load1 1-minute load average when the process started
 */

/**
 * Spawn `node args…`, time it from spawn to exit, collect its output (and CPU time if we can).
 * @param {string[]} args
 * @param {Record<string, string>} [env]
 * @returns {Promise<Timed>}
 */
export function timed(args, env = {}) {
  return new Promise((resolvePromise) => {
    const load1 = loadavg()[0];
    const [cmd, argv] = GNU_TIME ? [GNU_TIME, ['-f', `${TIME_TAG} %U %S %M`, process.execPath, ...args]] : [process.execPath, args];
    const t0 = performance.now();
    const child = spawn(cmd, argv, { cwd: ROOT, env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d) => {
      stdout += d;
    });
    child.stderr.on('data', (d) => {
      stderr += d;
    });
    child.on('error', (e) =>
      resolvePromise({
        wallMs: performance.now() - t0,
        cpuMs: null,
        maxRssMB: null,
        code: null,
        signal: null,
        stdout,
        stderr: String(e),
        load1,
      }),
    );
    child.on('close', (code, signal) => {
      const wallMs = performance.now() - t0;
      let cpuMs = null;
      let maxRssMB = null;
      const m = new RegExp(`^${TIME_TAG} ([\\d.]+) ([\\d.]+) (\\d+)$`, 'm').exec(stderr);
      if (m) {
        cpuMs = (Number(m[1]) + Number(m[2])) * 1000;
        maxRssMB = Number(m[3]) / 1024;
        stderr = stderr
          .replace(m[0], '')
          .replace(/^Command exited with non-zero status \d+$/m, '')
          .trim();
      }
      resolvePromise({ wallMs, cpuMs, maxRssMB, code, signal, stdout, stderr, load1 });
    });
  });
}

/** The code being measured: src/ may change between runs, so every result names its commit. */
export function codeVersion() {
  /** @param {string[]} a */
  const git = (...a) => spawnSync('git', a, { cwd: ROOT, encoding: 'utf8' });
  const head = git('rev-parse', '--short', 'HEAD');
  if (head.status !== 0) return { commit: null, dirty: null };
  const st = git('status', '--porcelain', '--', 'src', 'rules');
  return { commit: head.stdout.trim(), dirty: st.stdout.trim() ? st.stdout.trim().split('\n').length : 0 };
}
