import { minimizeOverLambda } from './minimize-over-lambda.js';

/** A criterion of two variance ratios with its gradient. */
export type TwoRatioCriterion = (a: number, b: number) => { value: number; da: number; db: number };

/** The best point on each edge, when the caller has a cheaper way to find them than a 1-D search of f. */
export interface TwoRatioEdges {
  /** on b = 0: the best a and the criterion there */
  bZero(): { a: number; value: number };
  /** on a = 0: the best b and the criterion there */
  aZero(): { b: number; value: number };
}

/** Where a criterion of two ratios is smallest over a, b ≥ 0. */
export interface TwoRatioOptimum {
  a: number;
  b: number;
  value: number;
  /** the best point on the edge b = 0 (a 1-D fit of a alone); absent when a warm start sufficed */
  edgeB?: { a: number; value: number };
}

// the same span of log ratios as minimizeOverLambda: below it a ratio is taken as the boundary 0
const LOG_MIN = -25;
const LOG_MAX = 12;
const MAX_ITERATIONS = 200;
// a warm-started answer this far inside the span is interior: no edge can be lower nearby
const WELL_INSIDE = LOG_MIN + 5;
// forward-difference step of the gradient on the log scale (the Hessian needs no more accuracy:
// it shapes the steps, the analytic gradient decides where they stop)
const HESSIAN_STEP = 1e-5;

/**
 * Minimise a criterion over two non-negative ratios: each edge (a = 0, b = 0) by the 1-D search
 * of minimizeOverLambda, the interior by a damped Newton method on (log a, log b) from a start
 * derived from the edges, and the lowest of the three answers kept, so that either ratio at zero
 * is a legitimate answer. The gradient is analytic; the Hessian is a forward difference of it,
 * damped (Levenberg–Marquardt) until a step lowers the criterion.
 * Sources: Nocedal & Wright (2006), *Numerical Optimization* (2nd ed.), §3.4 and §10.3 (damped
 * Newton and Levenberg–Marquardt steps); boundary handling as in lme4 (Bates et al. 2015), which
 * bounds the relative covariance factors at zero.
 *
 * A warm start (e.g. the REML optimum for the ML fit) is tried first; when Newton steps from it
 * settle well inside the region, the edges are not searched.
 *
 * @param f the criterion and its partial derivatives in a and b
 * @param warm ratios to start from, when close to the optimum
 * @param edges the edge optima, when the caller can find them more cheaply (else 1-D searches of f)
 * @returns the minimising ratios (exactly 0 on an edge) and the criterion there
 */
export function minimizeTwoRatios(f: TwoRatioCriterion, warm?: { a: number; b: number }, edges = searchEdges(f)): TwoRatioOptimum {
  if (warm && warm.a > 0 && warm.b > 0) {
    const near = dampedNewton(f, [Math.log(warm.a), Math.log(warm.b)]);
    if (near && Math.log(near.a) > WELL_INSIDE && Math.log(near.b) > WELL_INSIDE) return near;
  }
  const onEdgeB = edges.bZero();
  const onEdgeA = edges.aZero();
  let best: TwoRatioOptimum =
    onEdgeB.value <= onEdgeA.value
      ? { a: onEdgeB.a, b: 0, value: onEdgeB.value, edgeB: onEdgeB }
      : { a: 0, b: onEdgeA.b, value: onEdgeA.value, edgeB: onEdgeB };
  // each edge fit puts the other level's variance into its own ratio: half of each is a start
  // inside the region, near the interior optimum when there is one
  const start: [number, number] = [Math.log(Math.max(onEdgeB.a / 2, 1e-3)), Math.log(Math.max(onEdgeA.b / 2, 1e-3))];
  const inner = dampedNewton(f, start);
  if (inner && inner.value < best.value) best = { ...inner, edgeB: onEdgeB };
  return best;
}

/** Each edge by the 1-D search of minimizeOverLambda over f itself. */
function searchEdges(f: TwoRatioCriterion): TwoRatioEdges {
  return {
    bZero() {
      const o = minimizeOverLambda(
        (a) => f(a, 0).value,
        (a) => f(a, 0).da,
      );
      return { a: o.lambda, value: o.deviance };
    },
    aZero() {
      const o = minimizeOverLambda(
        (b) => f(0, b).value,
        (b) => f(0, b).db,
      );
      return { b: o.lambda, value: o.deviance };
    },
  };
}

/** Gradient of f on the log scale (chain rule: ∂/∂log a = a ∂/∂a). */
function logScale(f: TwoRatioCriterion, x: readonly [number, number]): { value: number; g: [number, number] } {
  const a = Math.exp(x[0]);
  const b = Math.exp(x[1]);
  const r = f(a, b);
  return { value: r.value, g: [a * r.da, b * r.db] };
}

type Point = Omit<TwoRatioOptimum, 'edgeB'>;

function dampedNewton(f: TwoRatioCriterion, start: [number, number]): Point | null {
  let x = start;
  let here = logScale(f, x);
  let damping = 0;
  for (let iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
    const ga = logScale(f, [x[0] + HESSIAN_STEP, x[1]]).g;
    const gb = logScale(f, [x[0], x[1] + HESSIAN_STEP]).g;
    const haa = (ga[0] - here.g[0]) / HESSIAN_STEP;
    const hbb = (gb[1] - here.g[1]) / HESSIAN_STEP;
    const hab = (ga[1] - here.g[1] + gb[0] - here.g[0]) / (2 * HESSIAN_STEP);
    let moved = false;
    for (let tries = 0; tries < 60; tries++) {
      const [da, db] = solve(haa + damping, hab, hbb + damping, -here.g[0], -here.g[1]);
      const next: [number, number] = [x[0] + da, x[1] + db];
      if (Math.abs(da) + Math.abs(db) < 1e-12) return finish(x, here.value);
      // leaving the searched span means the optimum is on an edge: the edge searches have it
      if (!(next[0] > LOG_MIN && next[1] > LOG_MIN && next[0] < LOG_MAX && next[1] < LOG_MAX)) {
        if (damping === 0 && next.every(Number.isFinite)) damping = 1e-3 * (Math.abs(haa) + Math.abs(hbb) + 1);
        else damping *= 4;
        if (tries > 40) return null;
        continue;
      }
      const there = logScale(f, next);
      if (there.value <= here.value) {
        x = next;
        here = there;
        damping /= 4;
        moved = true;
        break;
      }
      damping = damping === 0 ? 1e-3 * (Math.abs(haa) + Math.abs(hbb) + 1) : damping * 4;
    }
    if (!moved) return finish(x, here.value);
  }
  return finish(x, here.value);
}

function finish(x: readonly [number, number], value: number): Point {
  return { a: Math.exp(x[0]), b: Math.exp(x[1]), value };
}

/** The solution of [[p, q], [q, r]] · d = (u, v); a singular or indefinite system gives a gradient step. */
function solve(p: number, q: number, r: number, u: number, v: number): [number, number] {
  const det = p * r - q * q;
  if (!(p > 0 && det > 0)) {
    const scale = 1 / (Math.abs(p) + Math.abs(r) + 1);
    return [u * scale, v * scale];
  }
  return [(r * u - q * v) / det, (p * v - q * u) / det];
}
