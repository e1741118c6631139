import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import {
  fitLogNormal,
  kolmogorovCdf,
  kolmogorovQuantile,
  ksCriticalValue,
  ksExactCdf,
  ksStatistic,
  logHistogram,
  logNormalCdf,
} from './lognormal.js';

const sample = Float64Array.from([1, 2, 4, 8, 16]);

describe('log-normal fit by maximum likelihood', () => {
  it('gives the REFERENCES §9 values for x = {1, 2, 4, 8, 16}', () => {
    const fit = fitLogNormal(sample);
    // REFERENCES.md §9 (computed; scipy lognorm.fit with floc = 0 agrees): μ̂ = 2 ln 2, σ̂ = 0.9802581.
    expect(fit?.mu).toBeCloseTo(1.3862944, 7);
    expect(fit?.sigma).toBeCloseTo(0.9802581, 7);
    // Median e^μ̂ = 4, mean e^(μ + σ²/2) = 6.467227 (REFERENCES.md §9).
    const { mu, sigma } = fit as { mu: number; sigma: number };
    expect(Math.exp(mu)).toBeCloseTo(4, 9);
    expect(Math.exp(mu + (sigma * sigma) / 2)).toBeCloseTo(6.467227, 6);
  });

  it('gives the KS distance of that sample from its own fit, 0.160250 (REFERENCES §9)', () => {
    const fit = fitLogNormal(sample);
    if (!fit) throw new Error('no fit');
    expect(ksStatistic(sample, (x) => logNormalCdf(x, fit))).toBeCloseTo(0.16025, 6);
  });

  it('uses a CDF that agrees with jStat’s own log-normal distribution', () => {
    // jStat.lognormal is a second, independent implementation of the same CDF (general-purpose library).
    for (const x of [0.3, 1, 4, 9.5, 40]) {
      expect(logNormalCdf(x, { mu: 1.2, sigma: 0.7 })).toBeCloseTo(jStat.lognormal.cdf(x, 1.2, 0.7), 12);
    }
  });

  it('refuses to fit fewer than two values or values without spread', () => {
    expect(fitLogNormal(Float64Array.from([3]))).toBeNull();
    expect(fitLogNormal(Float64Array.from([3, 3, 3]))).toBeNull();
  });
});

describe('Kolmogorov–Smirnov critical values', () => {
  it('gives the asymptotic c(α) of REFERENCES §9 (scipy kstwobign; Massey 1951: 1.22 / 1.36 / 1.63)', () => {
    expect(kolmogorovQuantile(0.1)).toBeCloseTo(1.22385, 5);
    expect(kolmogorovQuantile(0.05)).toBeCloseTo(1.3581, 5);
    expect(kolmogorovQuantile(0.01)).toBeCloseTo(1.62762, 5);
    expect(kolmogorovCdf(1.3581)).toBeCloseTo(0.95, 5);
  });

  it('gives the exact 5 % values of REFERENCES §9 for n = 10, 20, 50, 100 (Marsaglia, Tsang & Wang 2003)', () => {
    expect(ksCriticalValue(10)).toEqual({ value: expect.closeTo(0.40925, 5), method: 'exact' });
    expect(ksCriticalValue(20).value).toBeCloseTo(0.29408, 5);
    expect(ksCriticalValue(50).value).toBeCloseTo(0.18841, 5);
    expect(ksCriticalValue(100).value).toBeCloseTo(0.13403, 5);
  });

  it('has the exact distribution’s known closed forms at its ends', () => {
    // P(Dₙ < 1/(2n)) = 0 and P(Dₙ < d) = n! (2d − 1/n)ⁿ for 1/(2n) ≤ d ≤ 1/n (Marsaglia et al. 2003, §1).
    expect(ksExactCdf(5, 0.09)).toBeCloseTo(0, 12);
    expect(ksExactCdf(5, 0.15)).toBeCloseTo(120 * (0.3 - 0.2) ** 5, 12);
    // For d ≥ 1/2 the two one-sided events cannot both happen, so P(Dₙ ≥ d) = 2 P(Dₙ⁺ ≥ d), with the
    // one-sided tail of Birnbaum & Tingey (1951): d Σⱼ C(n, j) (1 − d − j/n)^(n−j) (d + j/n)^(j−1),
    // j = 0 … ⌊n(1 − d)⌋ (from memory). n = 4, d = 0.7: 0.7 (0.3⁴/0.7 + 4 · 0.05³) = 0.00845.
    const oneSided = (n: number, d: number) => {
      let sum = 0;
      for (let j = 0, c = 1; j <= Math.floor(n * (1 - d)); c = (c * (n - j)) / (j + 1), j++)
        sum += c * (1 - d - j / n) ** (n - j) * (d + j / n) ** (j - 1);
      return d * sum;
    };
    expect(oneSided(4, 0.7)).toBeCloseTo(0.00845, 12);
    expect(1 - ksExactCdf(4, 0.7)).toBeCloseTo(2 * oneSided(4, 0.7), 12);
    expect(1 - ksExactCdf(7, 0.55)).toBeCloseTo(2 * oneSided(7, 0.55), 12);
  });

  it('switches to c(α)/√n above n = 100', () => {
    const big = ksCriticalValue(400);
    expect(big.method).toBe('asymptotic');
    expect(big.value).toBeCloseTo(1.3581 / 20, 5);
  });
});

describe('histogram on a log axis', () => {
  it('counts every value once and expects n in total over a wide range', () => {
    const values = Float64Array.from({ length: 400 }, (_, i) =>
      Math.exp(jStat.normal.inv((i + 0.5) / 400, 2, 0.5)),
    );
    const fit = fitLogNormal(values);
    const h = logHistogram(values, fit);
    expect(h.counts.reduce((a, b) => a + b, 0)).toBe(400);
    expect(h.edges).toHaveLength(h.counts.length + 1);
    // The bins span the sample: the fit's mass outside them is the two tails beyond min and max.
    const inside = h.expected.reduce((a, b) => a + b, 0);
    expect(inside).toBeGreaterThan(398);
    expect(inside).toBeLessThanOrEqual(400);
  });
});
