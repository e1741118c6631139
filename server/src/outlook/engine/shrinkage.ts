/**
 * Empirical-Bayes shrinkage of block rates toward the all-block rate of the same bin (DESIGN §3.5).
 * The beta prior is fitted by the method of moments: its mean is the pooled rate m = Σx / Σn; its
 * variance τ² is the spread of the block rates around m beyond what binomial sampling alone gives,
 * τ² = mean((pᵢ − m)²) − m(1 − m)·mean(1/nᵢ). For a beta prior τ² = m(1 − m)/(α + β + 1), so
 * α + β = m(1 − m)/τ² − 1. Guard: when τ² ≤ 0 the blocks differ no more than chance would make them,
 * and every estimate is the pooled rate (full pooling); when α + β ≤ 0 nothing is borrowed.
 */
export interface BetaPrior {
  mean: number | null;
  /** α + β, or null with full or no pooling. */
  strength: number | null;
  alpha: number | null;
  beta: number | null;
  pooling: 'partial' | 'full' | 'none';
}

/** Fits the prior to blocks with n > 0 (the others carry no information). */
export function fitBetaPrior(x: ArrayLike<number>, n: ArrayLike<number>): BetaPrior {
  let sumX = 0;
  let sumN = 0;
  let blocks = 0;
  for (let i = 0; i < n.length; i++) {
    if (!(n[i] > 0)) continue;
    sumX += x[i];
    sumN += n[i];
    blocks++;
  }
  if (blocks === 0) return { mean: null, strength: null, alpha: null, beta: null, pooling: 'none' };
  const m = sumX / sumN;
  if (blocks < 2) return { mean: m, strength: null, alpha: null, beta: null, pooling: 'none' };
  if (m === 0 || m === 1) return { mean: m, strength: null, alpha: null, beta: null, pooling: 'full' };
  let spread = 0;
  let inverseN = 0;
  for (let i = 0; i < n.length; i++) {
    if (!(n[i] > 0)) continue;
    spread += (x[i] / n[i] - m) ** 2;
    inverseN += 1 / n[i];
  }
  const tau2 = spread / blocks - (m * (1 - m) * inverseN) / blocks;
  if (tau2 <= 0) return { mean: m, strength: null, alpha: null, beta: null, pooling: 'full' };
  const strength = (m * (1 - m)) / tau2 - 1;
  if (strength <= 0) return { mean: m, strength: null, alpha: null, beta: null, pooling: 'none' };
  return { mean: m, strength, alpha: m * strength, beta: (1 - m) * strength, pooling: 'partial' };
}

/** Posterior mean (x + α)/(n + α + β); the pooled rate under full pooling; the raw rate without pooling. */
export function shrunkRate(x: number, n: number, prior: BetaPrior): number | null {
  if (!(n > 0)) return null;
  if (prior.pooling === 'full') return prior.mean;
  if (prior.pooling === 'none' || prior.alpha === null || prior.beta === null) return x / n;
  return (x + prior.alpha) / (n + prior.alpha + prior.beta);
}
