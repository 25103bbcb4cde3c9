import type { GroupMoments } from './types.js';

/**
 * Groups of one size taken together: the one-way likelihood depends on group j only through
 * n_j, ȳ_j and its within sum of squares, so the c groups of size n enter every sum over groups
 * as c terms in n, and Σ_j w (ȳ_j − μ)² over them is w · (M2 + c (m − μ)²), with m the mean and
 * M2 the sum of squares about m of their means (the parallel-axis identity). `mean` is m, `ss`
 * the groups' summed within sums of squares.
 */
export interface SizeClass extends GroupMoments {
  /** groups in the class */
  count: number;
  /** Σ (ȳ_j − m)² over the class's group means */
  spread: number;
}

/**
 * Below this many groups the fit runs over the groups themselves: 5,000 groups of up to a thousand
 * records have a few hundred sizes, so from here on classes are the cheaper sum.
 */
export const SIZE_CLASSES_FROM = 2_000;

/**
 * Every term in one shape (a group is a class of one, with no spread): the likelihood sums run
 * a hundred times per fit, and over objects of one shape they are several times faster than
 * over frozen moments mixed with classes.
 *
 * @param groups per-group moments or size classes
 * @returns one SizeClass per term, in the same order
 */
export function asClasses(groups: readonly GroupMoments[]): SizeClass[] {
  return groups.map((g) => ({ n: g.n, mean: g.mean, ss: g.ss, count: multiplicity(g), spread: spreadOf(g) }));
}

/** How many groups a term stands for (1 for a group, c for a size class). */
export function multiplicity(g: GroupMoments): number {
  return (g as Partial<SizeClass>).count ?? 1;
}

/** The spread of the means a term stands for (0 for a group). */
export function spreadOf(g: GroupMoments): number {
  return (g as Partial<SizeClass>).spread ?? 0;
}

/**
 * Take many groups together by size, so that each evaluation of the profiled likelihood costs
 * the number of distinct sizes rather than the number of groups (a million groups of a few
 * records each have a few dozen sizes). The class means and spreads are accumulated with
 * Welford's update (Welford 1962, Technometrics 4(3), 419–420), which is stable. Few groups are
 * returned as they are.
 *
 * @param groups per-group moments (n > 0)
 * @returns the groups, or one SizeClass per distinct n in increasing n
 */
export function bySize(groups: readonly GroupMoments[]): readonly GroupMoments[] {
  if (groups.length < SIZE_CLASSES_FROM) return groups;
  const classes = new Map<number, SizeClass>();
  for (const g of groups) {
    let c = classes.get(g.n);
    if (!c) {
      c = { n: g.n, mean: 0, ss: 0, count: 0, spread: 0 };
      classes.set(g.n, c);
    }
    c.count++;
    const delta = g.mean - c.mean;
    c.mean += delta / c.count;
    c.spread += delta * (g.mean - c.mean);
    c.ss += g.ss;
  }
  if (classes.size > groups.length / 2) return groups;
  return [...classes.values()].sort((a, b) => a.n - b.n);
}
