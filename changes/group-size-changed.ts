import { commonGroups } from '../src/compare/group-index.js';
import { defineChange } from '../src/compare/types.js';
import type { FindingDraft } from '../src/rules/types.js';
import { ksTwoSample } from '../src/stats/ks-two-sample.js';

interface Params {
  share: number;
  min_records: number;
  alpha: number;
}

/** Groups whose size changed a lot, and the shift of the whole size distribution. */
export default defineChange<Params>({
  meta: {
    id: 'group-size-changed',
    title: 'Group sizes changed',
    level: 'structure',
    defaultSeverity: 'note',
    description:
      'Groups in both deliveries whose number of records changed by more than a share, and the shift of the whole ' +
      'distribution of group sizes (two-sample Kolmogorov–Smirnov test). A group that halves or doubles between ' +
      'deliveries was often cut or duplicated by the extract.',
    params: {
      type: 'object',
      properties: {
        share: {
          type: 'number',
          exclusiveMinimum: 0,
          default: 0.5,
          description: 'relative change of a group size that is listed (common practice)',
        },
        min_records: {
          type: 'integer',
          minimum: 1,
          default: 5,
          description: 'and by at least this many records, so that small groups are not listed for one record (common practice)',
        },
        alpha: {
          type: 'number',
          exclusiveMinimum: 0,
          maximum: 1,
          default: 0.01,
          description: 'level of the Kolmogorov–Smirnov test of the size distributions (common practice)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      groups: {
        message: '{count} groups changed size by more than {share_percent}% since the previous delivery',
        fix: 'Ask the sender whether records of these groups were left out of, or repeated in, one of the extracts',
      },
      distribution: {
        message: 'the distribution of group sizes shifted (Kolmogorov–Smirnov D = {d}, p = {p}; median size {before} before, {now} now)',
        fix: 'Ask the sender whether the extract was made the same way as the previous one',
      },
    },
    sources: [
      'Smirnov, N. (1948). Table for estimating the goodness of fit of empirical distributions. Annals of Mathematical Statistics, 19(2), 279–281.',
    ],
  },
  check({ previous, current, params }) {
    const before = previous.report.snapshot.groups.sizes;
    const now = current.snapshot.groups.sizes;
    const out: FindingDraft[] = [];
    const changed = commonGroups(previous.report.snapshot, current.snapshot).filter(({ before: b, now: n }) => {
      const diff = Math.abs(now[n] - before[b]);
      return diff >= params.min_records && diff > params.share * before[b];
    });
    if (changed.length) {
      const share_percent = Math.round(params.share * 100);
      out.push({
        messageId: 'groups',
        data: { count: changed.length, share_percent },
        count: changed.length,
        groups: changed.map((g) => g.id),
      });
    }
    const test = ksTwoSample(before, now);
    if (test.p < params.alpha) {
      const median = (xs: readonly number[]) => [...xs].sort((a, b) => a - b)[Math.floor((xs.length - 1) / 2)];
      out.push({
        messageId: 'distribution',
        data: { d: round(test.d), p: Number(test.p.toPrecision(2)), before: median(before), now: median(now) },
      });
    }
    return out;
  },
});

const round = (x: number) => Math.round(x * 1000) / 1000;
