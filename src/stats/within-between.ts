import { minimizeOverLambda } from './minimize-over-lambda.js';
import type { PairMoments } from './pair-moments.js';

/** The within-group and between-group slopes of y on x, and their gap. */
export interface WithinBetween {
  /** slope of y on x − x̄_j (pooled within groups) */
  within: number;
  seWithin: number;
  /** slope of y on x̄_j (between groups, weighted as the model weights the group means) */
  between: number;
  seBetween: number;
  /** between − within: the contextual effect, the coefficient of x̄_j when x itself is in the model */
  gap: number;
  seGap: number;
  /** variance components of the random-intercept model with both terms (τ² = 0 for the OLS fit) */
  tau2: number;
  sigma2: number;
  /** records and groups that entered */
  n: number;
  groups: number;
}

/** Sums of one fit at a fixed variance ratio λ = τ²/σ². */
interface MundlakTerms {
  within: number;
  between: number;
  sxxWithin: number;
  sxxBetween: number;
  sumW: number;
  /** residual quadratic form σ²·r′V⁻¹r */
  q: number;
  /** dQ/dλ, d/dλ Σ log(1 + n_j λ), d/dλ log det of the between information */
  dq: number;
  dLogDet: number;
  dLogInfo: number;
  logDet: number;
  n: number;
}

/**
 * The Mundlak-type regression y_ij = β0 + β_W (x_ij − x̄_j) + β_B x̄_j + u_j + e_ij at a fixed
 * λ = τ²/σ², by generalised least squares from the per-group pair moments. The centred term is
 * orthogonal to anything constant within groups, so the fit splits: β_W is the pooled within-group
 * slope S_xy,W/S_xx,W at every λ, and β_B the regression of the group means ȳ_j on x̄_j with weights
 * w_j = n_j/(1 + n_j λ); the residual form is Q = (S_yy,W − S_xy,W²/S_xx,W) + the weighted residual
 * sum of squares of the means, and Cov(β_W, β_B) = 0. Sources: Mundlak, Y. (1978), On the pooling of
 * time series and cross section data, *Econometrica* 46(1), 69–85; Raudenbush & Bryk (2002), ch. 5
 * (group-mean centring); Searle, Casella & McCulloch (1992), ch. 3 (the weights w_j).
 */
function mundlakTerms(groups: readonly PairMoments[], lambda: number): MundlakTerms {
  let n = 0;
  let sxxW = 0;
  let sxyW = 0;
  let syyW = 0;
  let sumW = 0;
  let sumWx = 0;
  let sumWy = 0;
  let logDet = 0;
  for (const g of groups) {
    n += g.n;
    sxxW += g.sxx;
    sxyW += g.sxy;
    syyW += g.syy;
    const w = g.n / (1 + g.n * lambda);
    sumW += w;
    sumWx += w * g.meanX;
    sumWy += w * g.meanY;
    logDet += Math.log1p(g.n * lambda);
  }
  const mx = sumWx / sumW;
  const my = sumWy / sumW;
  let sxxB = 0;
  let sxyB = 0;
  let syyB = 0;
  for (const g of groups) {
    const w = g.n / (1 + g.n * lambda);
    sxxB += w * (g.meanX - mx) ** 2;
    sxyB += w * (g.meanX - mx) * (g.meanY - my);
    syyB += w * (g.meanY - my) ** 2;
  }
  const within = sxyW / sxxW;
  const between = sxyB / sxxB;
  const intercept = my - between * mx;
  // derivatives: dw_j/dλ = −w_j²; Q is minimal in the coefficients, so only the weights move it
  // (envelope theorem); the between information [[Σw, Σw x̄], [Σw x̄, Σw x̄²]] moves by −Σw² of the same
  let dq = 0;
  let d00 = 0;
  let d01 = 0;
  let d11 = 0;
  for (const g of groups) {
    const w = g.n / (1 + g.n * lambda);
    const w2 = w * w;
    dq -= w2 * (g.meanY - intercept - between * g.meanX) ** 2;
    d00 += w2;
    d01 += w2 * g.meanX;
    d11 += w2 * g.meanX * g.meanX;
  }
  const m00 = sumW;
  const m01 = sumWx;
  const m11 = sxxB + sumWx * mx;
  const det = m00 * m11 - m01 * m01;
  const dLogInfo = -(m11 * d00 - 2 * m01 * d01 + m00 * d11) / det;
  return {
    within,
    between,
    sxxWithin: sxxW,
    sxxBetween: sxxB,
    sumW,
    q: syyW - (sxyW * sxyW) / sxxW + (syyB - (sxyB * sxyB) / sxxB),
    dq,
    dLogDet: sumW,
    dLogInfo,
    logDet,
    n,
  };
}

/** The fit's estimates and standard errors at λ, σ̂² = Q/(N − 3) as for REML (and for OLS at λ = 0). */
function estimates(groups: readonly PairMoments[], lambda: number): WithinBetween {
  const t = mundlakTerms(groups, lambda);
  const sigma2 = t.q / (t.n - 3);
  const seWithin = Math.sqrt(sigma2 / t.sxxWithin);
  const seBetween = Math.sqrt(sigma2 / t.sxxBetween);
  return {
    within: t.within,
    seWithin,
    between: t.between,
    seBetween,
    gap: t.between - t.within,
    seGap: Math.hypot(seWithin, seBetween),
    tau2: lambda * sigma2,
    sigma2,
    n: t.n,
    groups: groups.length,
  };
}

/** Whether the regression has what it needs: within- and between-group spread of x, a residual df. */
function estimable(groups: readonly PairMoments[]): boolean {
  if (groups.length < 3 || groups.reduce((a, g) => a + g.n, 0) <= 3) return false;
  if (!groups.some((g) => g.sxx > 0)) return false;
  const x0 = groups[0].meanX;
  return groups.some((g) => g.meanX !== x0);
}

/**
 * The same regression by ordinary least squares on the records (λ = 0): what a single-level fit
 * of y on x − x̄_j and x̄_j gives, standard errors ignoring the clustering.
 *
 * @param groups per-group pair moments (groups with n ≥ 1)
 * @returns the fit, or null without within- or between-group spread of x or with fewer than 3 groups
 */
export function withinBetweenOls(groups: readonly PairMoments[]): WithinBetween | null {
  return estimable(groups) ? estimates(groups, 0) : null;
}

/**
 * The Mundlak-type regression with a random intercept, fitted by REML (exact for unbalanced
 * groups; λ on the boundary 0 allowed): the within and between slopes, their difference (the
 * contextual effect) and its standard error σ̂·√(1/S_xx,W + 1/S_xx,B(λ̂)), conditional on λ̂ as
 * mixed-model software reports it. −2ℓ_R(λ) = (N − 3) log Q + Σ log(1 + n_j λ) + log det(X′V⁻¹X)
 * up to constants, the last term log S_xx,W + log(Σ w_j · S_xx,B(λ)). Sources: Patterson & Thompson
 * (1971), *Biometrika* 58(3) (REML); Mundlak (1978); Bell & Jones (2015), Explaining fixed effects,
 * *Political Science Research and Methods* 3(1), 133–153 (the within-between random-effects model).
 *
 * @param groups per-group pair moments (groups with n ≥ 1)
 * @returns the fit, or null when it cannot be estimated (see withinBetweenOls)
 */
export function withinBetweenReml(groups: readonly PairMoments[]): WithinBetween | null {
  if (!estimable(groups)) return null;
  const fixed = 3;
  const deviance = (lambda: number) => {
    const t = mundlakTerms(groups, lambda);
    return (t.n - fixed) * Math.log(t.q) + t.logDet + Math.log(t.sumW * t.sxxBetween);
  };
  const derivative = (lambda: number) => {
    const t = mundlakTerms(groups, lambda);
    return ((t.n - fixed) * t.dq) / t.q + t.dLogDet + t.dLogInfo;
  };
  return estimates(groups, minimizeOverLambda(deviance, derivative).lambda);
}
