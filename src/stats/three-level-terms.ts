/**
 * Groups taken together by parent, as flat arrays: group j has n[j] values with mean mean[j] and
 * within sum of squares ss[j]; parent k holds the groups start[k] … start[k + 1] − 1.
 */
export interface ParentBlocks {
  n: Float64Array;
  mean: Float64Array;
  ss: Float64Array;
  /** K + 1 offsets into the group arrays, the last one equal to J */
  start: Int32Array;
}

/** The sums the profiled three-level deviances and their two partial derivatives need. */
export interface ThreeLevelTerms {
  /** GLS grand mean μ̂ */
  mu: number;
  /** σ² × the residual quadratic form at μ̂ */
  q: number;
  /** ∂q/∂λ_g and ∂q/∂λ_p (μ̂ held fixed: it minimises q, so that is the total derivative) */
  dqGroup: number;
  dqParent: number;
  /** log|V/σ²| and its partial derivatives */
  logDet: number;
  dLogDetGroup: number;
  dLogDetParent: number;
  /** σ²·1′V⁻¹1 and its partial derivatives */
  sumW: number;
  dSumWGroup: number;
  dSumWParent: number;
  /** N = Σ n_j */
  total: number;
}

/**
 * The likelihood sums of the three-level null model y = μ + v_k + u_jk + e_ijk at the variance
 * ratios λ_g = τ²_group/σ² and λ_p = τ²_parent/σ², in O(J).
 *
 * Per parent, V/σ² = I + λ_g blockdiag(J_{n_j}) + λ_p J: two nested Sherman–Morrison steps give,
 * with w_j = n_j/(1 + n_j λ_g), s_k = Σ_{j∈k} w_j, b_k = 1 + λ_p s_k, W_k = s_k/b_k and
 * m_k = Σ w_j ȳ_j / s_k: log|V_k/σ²| = Σ log(1 + n_j λ_g) + log b_k, 1′V_k⁻¹1 = W_k/σ², and
 * σ²·r′V⁻¹r = Σ ss_j + Σ_k [Σ_j w_j (ȳ_j − m_k)² + W_k (m_k − μ)²] (a sum of non-negative
 * terms, so no cancellation). The derivatives follow from dw_j/dλ_g = −w_j².
 * Source: Searle, Casella & McCulloch (1992), *Variance Components*, ch. 6 (ML and REML of
 * nested classifications) and Appendix M (inverse and determinant of I + uu′, Sherman & Morrison
 * 1950); the same criterion as lme4 (Bates, Mächler, Bolker & Walker 2015, *J. Stat. Softw.* 67(1)).
 *
 * @param b the groups by parent (means best centred near the grand mean)
 * @param lg λ_g ≥ 0
 * @param lp λ_p ≥ 0
 * @returns the sums at (λ_g, λ_p)
 */
export function threeLevelTerms(b: ParentBlocks, lg: number, lp: number): ThreeLevelTerms {
  const parents = b.start.length - 1;
  const w = new Float64Array(b.n.length);
  let total = 0;
  let within = 0;
  let logDet = 0;
  let dLogDetGroup = 0;
  let sumW = 0;
  let sumWM = 0;
  let dSumWGroup = 0;
  let dSumWParent = 0;
  const blockMean = new Float64Array(parents);
  const blockS = new Float64Array(parents);
  const blockV = new Float64Array(parents);
  for (let k = 0; k < parents; k++) {
    let s = 0;
    let sy = 0;
    let v = 0;
    for (let j = b.start[k]; j < b.start[k + 1]; j++) {
      const n = b.n[j];
      const wj = n / (1 + n * lg);
      w[j] = wj;
      s += wj;
      sy += wj * b.mean[j];
      v += wj * wj;
      logDet += Math.log1p(n * lg);
      dLogDetGroup += wj;
      total += n;
      within += b.ss[j];
    }
    const bk = 1 + lp * s;
    const wk = s / bk;
    logDet += Math.log1p(lp * s);
    dLogDetGroup -= (lp * v) / bk;
    blockMean[k] = sy / s;
    blockS[k] = s;
    blockV[k] = v;
    sumW += wk;
    sumWM += wk * blockMean[k];
    dSumWGroup -= v / (bk * bk);
    dSumWParent -= wk * wk;
  }
  const mu = sumWM / sumW;
  let q = within;
  let dqGroup = 0;
  let dqParent = 0;
  for (let k = 0; k < parents; k++) {
    const s = blockS[k];
    const bk = 1 + lp * s;
    const m = blockMean[k];
    let spread = 0;
    let t = 0;
    let u = 0;
    let w2d2 = 0;
    for (let j = b.start[k]; j < b.start[k + 1]; j++) {
      const d = b.mean[j] - mu;
      const wj = w[j];
      spread += wj * (b.mean[j] - m) ** 2;
      t += wj * d;
      u += wj * wj * d;
      w2d2 += wj * wj * d * d;
    }
    q += spread + (s / bk) * (m - mu) ** 2;
    dqParent -= (t * t) / (bk * bk);
    dqGroup += -w2d2 + (2 * lp * t * u) / bk - (lp * lp * t * t * blockV[k]) / (bk * bk);
  }
  return {
    mu,
    q,
    dqGroup,
    dqParent,
    logDet,
    dLogDetGroup,
    dLogDetParent: sumW,
    sumW,
    dSumWGroup,
    dSumWParent,
    total,
  };
}
