import { commonGroups } from '../src/compare/group-index.js';
import { defineChange } from '../src/compare/types.js';
import type { FindingDraft } from '../src/rules/types.js';
import { twoProportionZ } from '../src/stats/two-proportion-z.js';

interface Params {
  alpha: number;
  min_difference: number;
}

/** A column's share of missing values changed, over the delivery or within groups in both deliveries. */
export default defineChange<Params>({
  meta: {
    id: 'missing-rate-changed',
    title: 'Missing rate changed',
    level: 'data',
    defaultSeverity: 'warning',
    description:
      "A column's share of missing values differs from the previous delivery's by more than sampling explains (two-proportion " +
      'z-test) and by at least a minimum difference, over the whole delivery and within each group present in both (the groups ' +
      'tested at alpha divided by their number, Bonferroni). A jump in missing values usually means a field was dropped from a form ' +
      'or an export.',
    params: {
      type: 'object',
      properties: {
        alpha: { type: 'number', exclusiveMinimum: 0, maximum: 1, default: 0.001, description: 'level of each test (common practice)' },
        min_difference: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.05,
          description:
            'smallest change of the share that is reported, so that large deliveries do not list trivial changes (common practice)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      column: {
        message: '{column} is missing in {now_percent}% of records now, {before_percent}% in the previous delivery (p = {p})',
        fix: 'Ask the sender why {column} is missing more (or less) often than before',
      },
      groups: {
        message: "{column}'s share of missing values changed in {count} groups since the previous delivery",
        fix: 'Ask the sender about {column} in these groups: a form or export may have changed there',
      },
    },
    sources: [
      'Fleiss, J. L., Levin, B. & Paik, M. C. (2003). Statistical Methods for Rates and Proportions (3rd ed.). Wiley, §2.5.',
      'Bonferroni correction for the per-group tests: common practice.',
    ],
  },
  check({ previous, current, params }) {
    const before = previous.report.snapshot;
    const now = current.snapshot;
    const common = commonGroups(before, now);
    const out: FindingDraft[] = [];
    const percent = (x: number) => Math.round(x * 1000) / 10;
    for (const [column, col] of Object.entries(now.columns)) {
      const old = before.columns[column];
      if (!old) continue;
      const test = twoProportionZ(old.missing, before.rows, col.missing, now.rows);
      const diff = Math.abs(col.missing / now.rows - old.missing / before.rows);
      if (test.p < params.alpha && diff >= params.min_difference) {
        const data = { column, now_percent: percent(col.missing / now.rows), before_percent: percent(old.missing / before.rows) };
        out.push({ messageId: 'column', column, data: { ...data, p: Number(test.p.toPrecision(2)) }, count: col.missing });
      }
      const m0 = before.groups.missing[column];
      const m1 = now.groups.missing[column];
      if (!m0 && !m1) continue;
      const alpha = params.alpha / Math.max(1, common.length);
      const changed = common.filter(({ before: b, now: n }) => {
        const x0 = m0?.[b] ?? 0;
        const x1 = m1?.[n] ?? 0;
        const n0 = before.groups.sizes[b];
        const n1 = now.groups.sizes[n];
        return Math.abs(x1 / n1 - x0 / n0) >= params.min_difference && twoProportionZ(x0, n0, x1, n1).p < alpha;
      });
      if (changed.length) {
        out.push({
          messageId: 'groups',
          column,
          data: { column, count: changed.length },
          count: changed.length,
          groups: changed.map((g) => g.id),
        });
      }
    }
    return out;
  },
});
