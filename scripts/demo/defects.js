// @ts-check
// The machine-readable record of the planted defects (repairs-delivery.defects.json): where each
// one landed in the final file, and the totals an audit of the delivery should see.

/** @typedef {import('./design.js').Row} Row */
/**
 * A record of the delivery: a clean row (`src`), a re-sent copy of one (`dupOf`) or a singleton workshop's job.
 * @typedef {{ r: Row, src?: number, dupOf?: number, singleton?: boolean }} Tagged
 */
/**
 * What delivery.js planted, by clean row index.
 * @typedef {object} Plan
 * @property {string} target the workshop whose ID gets variants
 * @property {Map<string, number[]>} byWs clean row indices per workshop
 * @property {{ variant: string, canonical: string, idx: number[], note: string }[]} variants
 * @property {{ workshop: string, column: string, expected: string | number, planted: string | number, k: number, idx: number[] }[]} level2
 * @property {number[]} blankIdx
 * @property {number[]} naIdx
 * @property {number[]} m999Idx
 * @property {number[]} naTokIdx
 * @property {number[]} dupIdx
 * @property {Row[]} singletons
 */

/**
 * @param {Row[]} clean
 * @param {Tagged[]} tagged the delivery's records in file order
 * @param {Plan} plan
 */
export function describeDefects(clean, tagged, plan) {
  const { byWs, variants, level2, blankIdx, naIdx, m999Idx, naTokIdx, dupIdx, singletons } = plan;
  // 1-based data record numbers in the final file
  /** @type {Map<number, number>} */
  const rowOfSrc = new Map();
  /** @type {Map<number, number>} */
  const rowOfDup = new Map();
  /** @type {Map<string | number, number>} */
  const rowOfJobSingleton = new Map();
  for (const [k, t] of tagged.entries()) {
    if (t.src !== undefined) rowOfSrc.set(t.src, k + 1);
    else if (t.dupOf !== undefined) rowOfDup.set(t.dupOf, k + 1);
    else rowOfJobSingleton.set(t.r.job_id, k + 1);
  }
  /** @param {number} i */
  const ref = (i) => ({ row: rowOfSrc.get(i), job_id: clean[i].job_id });

  const defects = {
    file: 'repairs-delivery.csv',
    rowNumbering: '1-based data record number, header excluded',
    dataRows: tagged.length,
    cleanRows: clean.length,
    missingGroup: {
      count: blankIdx.length + naIdx.length,
      blank: blankIdx.map((i) => ({ ...ref(i), originalWorkshop: clean[i].workshop })),
      NA: naIdx.map((i) => ({ ...ref(i), originalWorkshop: clean[i].workshop })),
    },
    inconsistentLevel2: level2.map((d) => ({
      workshop: d.workshop,
      column: d.column,
      expected: d.expected,
      planted: d.planted,
      workshopRows: (byWs.get(d.workshop) ?? []).length,
      rows: d.idx.map((i) => ref(i)),
    })),
    singletonGroups: singletons.map((r) => ({
      workshop: r.workshop,
      network: r.network,
      row: rowOfJobSingleton.get(r.job_id),
      job_id: r.job_id,
    })),
    outcome: {
      column: 'repair_minutes',
      missingCode: { value: '-999', rows: m999Idx.map((i) => ({ ...ref(i), workshop: clean[i].workshop })) },
      nonNumeric: { value: 'n/a', rows: naTokIdx.map((i) => ({ ...ref(i), workshop: clean[i].workshop })) },
    },
    groupIdVariants: variants.map((v) => ({
      variant: v.variant,
      canonical: v.canonical,
      note: v.note,
      rows: v.idx.map((i) => ref(i)),
    })),
    duplicateUnitIds: dupIdx.map((i) => ({
      job_id: clean[i].job_id,
      workshop: clean[i].workshop,
      rows: [rowOfSrc.get(i) ?? 0, rowOfDup.get(i) ?? 0].sort((a, b) => a - b),
      exactCopy: true,
    })),
    expected: expectedTotals(tagged, plan),
  };
  return defects;
}

/**
 * Derived expectations: what an audit of the delivery should count.
 * @param {Tagged[]} tagged
 * @param {Plan} plan
 */
function expectedTotals(tagged, { target, variants, level2, blankIdx, naIdx, m999Idx, naTokIdx, dupIdx }) {
  /** @type {Map<string | number, number>} */
  const wsCounts = new Map();
  for (const t of tagged) wsCounts.set(t.r.workshop, (wsCounts.get(t.r.workshop) ?? 0) + 1);
  const nonMissing = [...wsCounts.keys()].map(String).filter((w) => w !== '' && w !== 'NA');
  const sizes = nonMissing.map((w) => wsCounts.get(w) ?? 0);
  return {
    dataRows: tagged.length,
    rowsMissingGroup: blankIdx.length + naIdx.length,
    distinctWorkshopValues: nonMissing.length,
    distinctWorkshopsAfterTrimAndUpper: new Set(nonMissing.map((w) => w.trim().toUpperCase())).size,
    singletonGroups: sizes.filter((s) => s === 1).length,
    smallestNonSingletonGroup: Math.min(...sizes.filter((s) => s > 1)),
    /** @type {Record<string, number | undefined>} */
    groupSizes: Object.fromEntries(
      [target, ...variants.map((v) => v.variant), ...level2.map((d) => d.workshop)].map((w) => [w, wsCounts.get(w)]),
    ),
    distinctJobIds: new Set(tagged.map((t) => t.r.job_id)).size,
    duplicatedJobIdValues: dupIdx.length,
    repairMinutesMissingCode: m999Idx.length,
    repairMinutesNonNumeric: naTokIdx.length,
    workshopsWithInconsistentLevel2: level2.length,
  };
}
