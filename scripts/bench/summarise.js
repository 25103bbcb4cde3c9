// @ts-check
// One (case, rule set) row of the results: medians, peaks, the ratio and the targets' verdicts.
import { JUDGED_AT_GROUPS, RATIO_AT_ROWS, TARGET_RATIO, TARGET_RSS_MB, TARGET_WALL_MS, WALL_AT_ROWS } from './config.js';

/** @typedef {import('./runs.js').BaselineRun} BaselineRun */
/** @typedef {import('./runs.js').AuditRun} AuditRun */
/** @typedef {{ path: string, generated: boolean, bytes: number, genMs: number }} Delivery */
/** @typedef {ReturnType<typeof summarise>} Result */

/** @param {(number | null | undefined)[]} xs */
const finite = (xs) => /** @type {number[]} */ (xs.filter((x) => Number.isFinite(x)));
/** @param {(number | null | undefined)[]} xs */
export const median = (xs) => {
  const s = finite(xs).sort((a, b) => a - b);
  if (!s.length) return null;
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};
/** @param {(number | null | undefined)[]} xs */
const max = (xs) => (finite(xs).length ? Math.max(...finite(xs)) : null);
/** @param {number | null | undefined} x */
const r1 = (x) => (x == null ? null : Math.round(x * 10) / 10);
/** @param {number | null | undefined} x */
const r2 = (x) => (x == null ? null : Math.round(x * 100) / 100);

/**
 * @param {number} rows
 * @param {number} groups
 * @param {Delivery} d
 * @param {BaselineRun[]} base
 * @param {AuditRun[]} aud
 * @param {string} ruleSet
 * @param {{ seed: number, repeat: number }} run
 */
export function summarise(rows, groups, d, base, aud, ruleSet, { seed, repeat }) {
  const okB = base.filter((x) => x.ok);
  const okA = aud.filter((x) => x.ok);
  const baseWall = median(okB.map((x) => x.wallMs));
  const auditWall = median(okA.map((x) => x.wallMs));
  const ratio = baseWall && auditWall ? auditWall / baseWall : null;
  const auditRss = max(okA.map((x) => x.maxRssMB));
  const timeJudged = rows === RATIO_AT_ROWS && groups === JUDGED_AT_GROUPS;
  const rssJudged = groups === JUDGED_AT_GROUPS;
  const auditFailed = aud.filter((x) => !x.ok && !x.harness);
  const phaseKeys = Object.keys(okA[0]?.timings ?? {});
  const phases = Object.fromEntries(phaseKeys.map((k) => [k, r1(median(okA.map((x) => x.timings?.[k])))]));
  const failure = auditFailed.length
    ? {
        runs: auditFailed.length,
        of: repeat,
        error: String(auditFailed[0].error).split('\n')[0],
        failedQuery: auditFailed[0].failedQuery ?? null,
        maxRssMB: r1(max(auditFailed.map((x) => x.maxRssMB))),
        medianWallMs: r1(median(auditFailed.map((x) => x.wallMs))),
        queries: auditFailed[0].queries ?? [],
      }
    : null;
  // a case where every audit run failed misses both targets: the audit did not complete
  /** @param {boolean} ok */
  const verdictOf = (ok) => (okA.length ? (ok ? 'ok' : 'MISSED') : auditFailed.length ? 'FAILED' : 'ERROR');
  return {
    rows,
    groups,
    ruleSet,
    seed,
    file: d.path,
    fileMB: r1(d.bytes / 2 ** 20),
    generated: d.generated,
    generateMs: d.genMs,
    baseline: {
      medianWallMs: r1(baseWall),
      medianInnerWallMs: r1(median(okB.map((x) => x.innerWallMs))),
      medianCpuMs: r1(median(okB.map((x) => x.cpuMs))),
      peakRssMB: r1(max(okB.map((x) => x.maxRssMB))),
      medianRssMB: r1(median(okB.map((x) => x.maxRssMB))),
      groupsSeen: okB[0]?.groups ?? null,
      runs: base.map(({ ok, wallMs, cpuMs, load1, maxRssMB, innerWallMs, error }) => ({
        ok,
        wallMs: r1(wallMs),
        cpuMs: r1(cpuMs),
        load1,
        maxRssMB,
        innerWallMs,
        error,
      })),
    },
    audit: {
      medianWallMs: r1(auditWall),
      peakRssMB: r1(auditRss),
      medianRssMB: r1(median(okA.map((x) => x.maxRssMB))),
      medianCpuMs: r1(median(okA.map((x) => x.cpuMs))),
      exitCode: okA[0]?.exitCode ?? null,
      report: okA[0]?.report ?? null,
      medianPhasesMs: phases,
      queriesOfMedianRun: okA.length ? [...okA].sort((x, y) => x.wallMs - y.wallMs)[okA.length >> 1].queries : [],
      failure,
      runs: aud.map(({ ok, wallMs, cpuMs, load1, maxRssMB, exitCode, error }) => ({
        ok,
        wallMs: r1(wallMs),
        cpuMs: r1(cpuMs),
        load1,
        maxRssMB,
        exitCode,
        error,
      })),
    },
    ratio: r2(ratio),
    cpuRatio: (() => {
      const b = median(okB.map((x) => x.cpuMs));
      const a = median(okA.map((x) => x.cpuMs));
      return b && a ? r2(a / b) : null;
    })(),
    load1: { min: Math.min(...[...base, ...aud].map((x) => x.load1)), max: Math.max(...[...base, ...aud].map((x) => x.load1)) },
    targets: {
      time: timeJudged ? (ratio == null ? verdictOf(false) : verdictOf(ratio <= TARGET_RATIO[ruleSet])) : 'n/a',
      wall: rows === WALL_AT_ROWS && groups === JUDGED_AT_GROUPS ? verdictOf(auditWall != null && auditWall <= TARGET_WALL_MS) : 'n/a',
      rss: rssJudged ? verdictOf(auditRss != null && auditRss <= TARGET_RSS_MB) : okA.length ? 'n/a' : verdictOf(false),
    },
  };
}
