/**
 * Gauss–Legendre rules on [0, 1], computed once at load by Newton iteration on P_n
 * (Abramowitz & Stegun §25.4.29; Golub–Welsch would do as well). Nodes and weights sum to 1.
 */

export interface Rule {
  n: number;
  /** Nodes in (0, 1). */
  u: Float64Array;
  /** Weights, summing to 1. */
  w: Float64Array;
}

function legendreRule(n: number): Rule {
  const u = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    // Initial guess (Tricomi) then Newton on P_n(x).
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      const pn = n === 1 ? x : p1;
      const pnm1 = n === 1 ? 1 : p0;
      dp = (n * (x * pn - pnm1)) / (x * x - 1);
      const dx = pn / dp;
      x -= dx;
      if (Math.abs(dx) < 1e-16) break;
    }
    // Recompute derivative at the converged node for the weight.
    let p0 = 1;
    let p1 = x;
    for (let k = 2; k <= n; k++) {
      const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
      p0 = p1;
      p1 = p2;
    }
    dp = n === 1 ? 1 : (n * (x * p1 - p0)) / (x * x - 1);
    u[i] = (1 - x) / 2;
    w[i] = 1 / ((1 - x * x) * dp * dp); // 2/((1−x²)P'²) on [−1,1], halved for [0,1]
  }
  return { n, u, w };
}

const cache = new Map<number, Rule>();

export function gaussRule(n: number): Rule {
  let r = cache.get(n);
  if (!r) {
    r = legendreRule(n);
    cache.set(n, r);
  }
  return r;
}

/**
 * Gauss rule pushed toward both ends by the smoothstep map u = 3t² − 2t³ (Jacobian 6t(1−t)).
 * WHY: the analytic inner integral of 1/R has log-like behaviour at the ends of a self or touching
 * segment; the vanishing Jacobian tames it so a modest order integrates it accurately.
 */
export function endClusteredRule(n: number): Rule {
  const g = gaussRule(n);
  const u = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = g.u[i];
    u[i] = t * t * (3 - 2 * t);
    w[i] = g.w[i] * 6 * t * (1 - t);
  }
  return { n, u, w };
}
