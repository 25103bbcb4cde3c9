import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import type { TwoRatioEdges } from './minimize-two-ratios.js';
import { minimizeTwoRatios } from './minimize-two-ratios.js';
import { mlComponents } from './ml-components.js';
import { remlComponents } from './reml-components.js';
import { threeLevelCriterion } from './three-level-deviance.js';
import type { ParentBlocks } from './three-level-terms.js';
import type { GroupMoments, VarianceComponents } from './types.js';

/** Variance components of the three-level null model and each level's share of their sum. */
export interface ThreeLevelComponents {
  tau2Parent: number;
  tau2Group: number;
  sigma2: number;
  mean: number;
  logLik: number;
  shares: { parent: number; group: number; residual: number };
}

/** The three-level null model fitted to one outcome. */
export interface ThreeLevelModel {
  parents: number;
  groups: number;
  n: number;
  reml: ThreeLevelComponents;
  ml: ThreeLevelComponents;
  /** REML two-level fit on the same groups (τ²_parent = 0): what ignoring the parent level gives */
  groupsOnly: { tau2: number; sigma2: number; logLik: number };
  /** REML likelihood-ratio test of τ²_parent = 0 against the 50:50 mixture of χ²₀ and χ²₁ */
  parentTest: { statistic: number; p: number };
}

interface Optimum {
  lg: number;
  lp: number;
  deviance: number;
  sigma2: number;
  mu: number;
}

/**
 * Fit the three-level null model y_ijk = μ + v_k + u_jk + e_ijk by REML and ML, exact for
 * unbalanced data, with either variance at zero a legitimate (boundary) answer.
 *
 * σ² is profiled out and the criterion minimised over the two variance ratios (minimizeTwoRatios:
 * each edge by a 1-D search, the interior by damped Newton steps on the analytic gradient).
 * The edge λ_p = 0 is the two-level model on the same groups, which gives the likelihood-ratio
 * test of the parent variance; on the boundary its statistic follows ½χ²₀ + ½χ²₁.
 * Sources: Searle, Casella & McCulloch (1992), *Variance Components*, ch. 6; Self & Liang
 * (1987), *JASA* 82(398), 605–610 and Stram &
 * Lee (1994), *Biometrics* 50(4), 1171–1177 (the mixture reference).
 *
 * @param blocks groups by parent (every group with n ≥ 1)
 * @returns the fits, or null when the levels are not identifiable (fewer than two parents, no
 *   parent with two groups, no group with two values) or the outcome does not vary
 */
export function threeLevelModel(blocks: ParentBlocks): ThreeLevelModel | null {
  const parents = blocks.start.length - 1;
  const groups = blocks.n.length;
  let n = 0;
  let sum = 0;
  for (let j = 0; j < groups; j++) {
    n += blocks.n[j];
    sum += blocks.n[j] * blocks.mean[j];
  }
  if (parents < 2 || groups <= parents || n <= groups) return null;
  // centred at the grand mean: the quadratic forms then carry no large common offset
  const centre = sum / n;
  const centred: ParentBlocks = { ...blocks, mean: blocks.mean.map((m) => m - centre) };
  if (threeLevelCriterion(centred, 0, 0, false).sigma2 === 0) return null;
  const { best: reml, groupsOnly } = fitCriterion(centred, true);
  // the ML optimum lies near the REML one: started there, it rarely needs the edge searches
  const ml = fitCriterion(centred, false, reml).best;
  const flat = groupsOnly as Optimum;
  const statistic = Math.max(0, flat.deviance - reml.deviance);
  return {
    parents,
    groups,
    n,
    reml: components(reml, centre),
    ml: components(ml, centre),
    groupsOnly: { tau2: flat.lg * flat.sigma2, sigma2: flat.sigma2, logLik: -flat.deviance / 2 },
    parentTest: { statistic, p: statistic === 0 ? 1 : 0.5 * (1 - chisquareCdf(statistic, 1)) },
  };
}

function fitCriterion(blocks: ParentBlocks, reml: boolean, warm?: Optimum): { best: Optimum; groupsOnly?: Optimum } {
  const at = (lg: number, lp: number): Optimum => {
    const c = threeLevelCriterion(blocks, lg, lp, reml);
    return { lg, lp, deviance: c.deviance, sigma2: c.sigma2, mu: c.mu };
  };
  const o = minimizeTwoRatios(
    (lg, lp) => {
      const c = threeLevelCriterion(blocks, lg, lp, reml);
      return { value: c.deviance, da: c.dGroup, db: c.dParent };
    },
    warm && { a: warm.lg, b: warm.lp },
    oneWayEdges(blocks, reml),
  );
  return { best: at(o.a, o.b), groupsOnly: o.edgeB && at(o.edgeB.a, 0) };
}

/**
 * Each edge of the three-level model is a one-way model: τ²_parent = 0 leaves the groups'
 * random intercepts, τ²_group = 0 the parents' (over the records of each parent pooled). Their
 * exact one-way fits (size classes make them cheap) replace two 1-D searches of the full criterion.
 */
function oneWayEdges(blocks: ParentBlocks, reml: boolean): TwoRatioEdges {
  const fitOneWay = reml ? remlComponents : mlComponents;
  const edge = (c: VarianceComponents) => ({ ratio: c.tau2 / c.sigma2, value: -2 * c.logLik });
  return {
    bZero() {
      const groups: GroupMoments[] = Array.from(blocks.n, (n, j) => ({ n, mean: blocks.mean[j], ss: blocks.ss[j] }));
      const e = edge(fitOneWay(groups));
      return { a: e.ratio, value: e.value };
    },
    aZero() {
      const e = edge(fitOneWay(pooledByParent(blocks)));
      return { b: e.ratio, value: e.value };
    },
  };
}

/** Each parent's records as one group: n_k, mean_k and ss_k = Σ ss_j + Σ n_j (ȳ_j − mean_k)². */
function pooledByParent(blocks: ParentBlocks): GroupMoments[] {
  const out: GroupMoments[] = [];
  for (let k = 0; k + 1 < blocks.start.length; k++) {
    let n = 0;
    let sum = 0;
    for (let j = blocks.start[k]; j < blocks.start[k + 1]; j++) {
      n += blocks.n[j];
      sum += blocks.n[j] * blocks.mean[j];
    }
    const mean = sum / n;
    let ss = 0;
    for (let j = blocks.start[k]; j < blocks.start[k + 1]; j++) ss += blocks.ss[j] + blocks.n[j] * (blocks.mean[j] - mean) ** 2;
    out.push({ n, mean, ss });
  }
  return out;
}

function components(o: Optimum, centre: number): ThreeLevelComponents {
  const tau2Parent = o.lp * o.sigma2;
  const tau2Group = o.lg * o.sigma2;
  const total = tau2Parent + tau2Group + o.sigma2;
  return {
    tau2Parent,
    tau2Group,
    sigma2: o.sigma2,
    mean: o.mu + centre,
    logLik: -o.deviance / 2,
    shares: { parent: tau2Parent / total, group: tau2Group / total, residual: o.sigma2 / total },
  };
}
