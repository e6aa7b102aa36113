/**
 * Gauss–Legendre nodes and weights on [−1, 1] by Newton iteration on P_n.
 * Reference: G. H. Golub and J. H. Welsch, "Calculation of Gauss quadrature rules",
 * Math. Comp. 23, 1969 (the rule); Newton on the Legendre recurrence (from memory).
 * @internal
 * @module
 */

/** @internal */
export interface GaussRule {
  readonly x: Float64Array;
  readonly w: Float64Array;
}

const cache = new Map<number, GaussRule>();

/** n-point Gauss–Legendre rule on [−1, 1]. @internal */
export function gaussLegendreRule(n: number): GaussRule {
  const hit = cache.get(n);
  if (hit) return hit;
  const x = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1, p1 = z;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1; p1 = p2;
      }
      const pn = n === 1 ? z : p1;
      const pm = n === 1 ? 1 : p0;
      dp = (n * (z * pn - pm)) / (z * z - 1);
      const dz = pn / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-15) break;
    }
    x[i] = z;
    w[i] = 2 / ((1 - z * z) * dp * dp);
  }
  const rule = { x, w };
  cache.set(n, rule);
  return rule;
}
