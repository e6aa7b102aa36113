/**
 * One-dimensional Gauss–Legendre nodes and weights on [−1, 1], shared by every
 * module that integrates along a line (wire currents, cuts) — and by the sphere
 * rules built on top of them.
 *
 * @remarks
 * Newton iteration on the three-term Legendre recurrence, started from the
 * Tricomi asymptotic guess cos(π(i − ¼)/(n + ½)); the weight is
 * 2 / ((1 − x²) P′ₙ(x)²). Nodes are returned ascending and symmetric.
 * Results are cached per order (the arrays are frozen copies; do not mutate).
 * Reference: G. H. Golub and J. H. Welsch, "Calculation of Gauss quadrature
 * rules", Math. Comp. 23(106), 1969 (the rule); W. H. Press et al., Numerical
 * Recipes, 3rd ed., 2007, §4.6 (the Newton iteration) (from memory).
 * @internal
 * @module
 */

/** Nodes (ascending) and weights of an n-point Gauss–Legendre rule on [−1, 1]. */
export interface GaussLegendreRule {
  /** Nodes in (−1, 1), ascending. */
  readonly nodes: Float64Array;
  /** Positive weights, summing to 2. */
  readonly weights: Float64Array;
}

const cache = new Map<number, GaussLegendreRule>();

/** n-point Gauss–Legendre rule on [−1, 1] (n ≥ 1 integer; not validated: internal). */
export function gaussLegendreRule(n: number): GaussLegendreRule {
  const hit = cache.get(n);
  if (hit) return hit;
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  const m = (n + 1) >> 1;
  for (let i = 0; i < m; i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let iter = 0; iter < 100; iter++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      if (n === 1) { p1 = x; p0 = 1; }
      dp = (n * (x * p1 - p0)) / (x * x - 1);
      const dx = p1 / dp;
      x -= dx;
      if (Math.abs(dx) <= 1e-16 * Math.max(1, Math.abs(x))) break;
    }
    // recompute the derivative at the converged node
    let p0 = 1;
    let p1 = x;
    for (let k = 2; k <= n; k++) {
      const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
      p0 = p1;
      p1 = p2;
    }
    dp = n === 1 ? 1 : (n * (x * p1 - p0)) / (x * x - 1);
    const w = 2 / ((1 - x * x) * dp * dp);
    nodes[i] = -x;
    nodes[n - 1 - i] = x;
    weights[i] = w;
    weights[n - 1 - i] = w;
  }
  if (n % 2 === 1) nodes[m - 1] = 0;
  const rule = { nodes, weights };
  cache.set(n, rule);
  return rule;
}
