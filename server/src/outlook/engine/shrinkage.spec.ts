import { describe, expect, it } from 'vitest';
import { fitBetaPrior, shrunkRate } from './shrinkage.js';

describe('empirical-Bayes beta prior by moments', () => {
  it('fits the prior a hand calculation from the moment equations gives', () => {
    // Worked by hand (method of moments for the beta-binomial, common practice): rates 0.1, 0.5, 0.9
    // on 20 days each; m = 30/60 = 0.5; mean squared spread = (0.16 + 0 + 0.16)/3 = 0.106667;
    // binomial part 0.25/20 = 0.0125; τ² = 0.094167; α + β = 0.25/τ² − 1 = 1.654867; α = β = 0.827434.
    const prior = fitBetaPrior([2, 10, 18], [20, 20, 20]);
    expect(prior.pooling).toBe('partial');
    expect(prior.mean).toBeCloseTo(0.5, 12);
    expect(prior.strength).toBeCloseTo(0.25 / (0.32 / 3 - 0.0125) - 1, 10);
    expect(prior.alpha).toBeCloseTo(0.827434, 5);
    // Posterior mean (x + α)/(n + α + β) of the first block: (2 + 0.827434)/(21.654867) = 0.130567.
    expect(shrunkRate(2, 20, prior)).toBeCloseTo(0.130567, 5);
  });

  it('moves every estimate toward the all-block rate and keeps the order of the blocks', () => {
    const x = [1, 4, 9, 0, 12];
    const n = [30, 25, 30, 10, 28];
    const prior = fitBetaPrior(x, n);
    const pooled = 26 / 123;
    expect(prior.mean).toBeCloseTo(pooled, 12);
    const shrunk = x.map((xi, i) => shrunkRate(xi, n[i], prior) as number);
    shrunk.forEach((s, i) => {
      const raw = x[i] / n[i];
      expect(Math.abs(s - pooled)).toBeLessThanOrEqual(Math.abs(raw - pooled) + 1e-12);
      expect(Math.sign(s - pooled)).toBe(Math.sign(raw - pooled) || Math.sign(s - pooled));
    });
    expect(shrunk[4]).toBeGreaterThan(shrunk[2]);
  });

  it('pools fully when the blocks differ no more than chance would make them', () => {
    // Identical rates: the spread (0) is below the binomial variance.
    const prior = fitBetaPrior([3, 3, 3], [10, 10, 10]);
    expect(prior.pooling).toBe('full');
    expect(shrunkRate(3, 10, prior)).toBeCloseTo(0.3, 12);
  });

  it('skips blocks without days, and gives no estimate where n is 0', () => {
    const prior = fitBetaPrior([0, 5, 0], [0, 10, 0]);
    expect(prior).toMatchObject({ mean: 0.5, pooling: 'none' });
    expect(shrunkRate(5, 10, prior)).toBe(0.5);
    expect(shrunkRate(0, 0, prior)).toBeNull();
    expect(fitBetaPrior([], []).mean).toBeNull();
  });
});
