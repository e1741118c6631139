import { describe, expect, it } from 'vitest';
import { pythonWithScipy, runPython } from '../../testing/scipy.js';
import { binomialInterval, jeffreysInterval, wilsonInterval } from './intervals.js';

const z95 = 0.95;

describe('binomial intervals', () => {
  // R binom.confint results quoted in statsmodels' test data (REFERENCES.md §4, published, 1e-12 there).
  it.each([
    [18, 20, 0.6989663548, 0.9721335188, 0.7161467427, 0.978627512],
    [4, 20, 0.0806576626, 0.4160174323, 0.0715200525, 0.4082257625],
    [4, 200, 0.00780443, 0.05028709, 0.0067876, 0.04684657],
    [0, 30, 0, 0.1135134, 0, 0.0796782],
  ])('%i/%i matches the published Wilson and Jeffreys bounds', (x, n, wl, wu, jl, ju) => {
    const w = wilsonInterval(x, n, z95);
    const j = jeffreysInterval(x, n, z95);
    // The table gives 8–10 decimals: agree to the last one given.
    expect(w.lower).toBeCloseTo(wl, 7);
    expect(w.upper).toBeCloseTo(wu, 7);
    expect(j.lower).toBeCloseTo(jl, 7);
    expect(j.upper).toBeCloseTo(ju, 7);
  });

  // REFERENCES.md §4, computed rows; Wilson agrees with Newcombe 1998 (Stat. Med. 17, 857–872), from memory.
  it.each([
    [81, 263, 0.2553, 0.3662, 0.2545, 0.3656],
    [15, 148, 0.0624, 0.1605, 0.0604, 0.1576],
    [0, 20, 0, 0.1611, 0, 0.1166],
    [1, 29, 0.0061, 0.1718, 0.0037, 0.1501],
  ])(
    '%i/%i matches Newcombe’s Wilson bounds and the computed Jeffreys bounds to 1e-4',
    (x, n, wl, wu, jl, ju) => {
      const w = wilsonInterval(x, n, z95);
      const j = jeffreysInterval(x, n, z95);
      for (const [got, want] of [
        [w.lower, wl],
        [w.upper, wu],
        [j.lower, jl],
        [j.upper, ju],
      ])
        expect(Math.abs(got - want)).toBeLessThanOrEqual(0.5e-4 + 1e-12);
    },
  );

  it('closes the Jeffreys interval at 0 when x = 0 and at 1 when x = n (Brown, Cai & DasGupta 2001, §4.1.2)', () => {
    expect(jeffreysInterval(0, 12, 0.9).lower).toBe(0);
    expect(jeffreysInterval(12, 12, 0.9).upper).toBe(1);
    expect(jeffreysInterval(12, 12, 0.9).lower).toBeGreaterThan(0.7);
  });

  it('puts the Wilson bounds where the score statistic equals z (the interval’s definition, Wilson 1927)', () => {
    const z = 1.6448536269514722; // standard normal 95th percentile (published tables: 1.645)
    const { lower, upper } = wilsonInterval(7, 31, 0.9);
    for (const p of [lower, upper])
      expect(Math.abs(7 / 31 - p) / Math.sqrt((p * (1 - p)) / 31)).toBeCloseTo(z, 9);
  });

  it('has no interval without days', () => {
    expect(binomialInterval('jeffreys', 0, 0, 0.9)).toBeNull();
    expect(binomialInterval('wilson', 3, 10, 0.9)).toEqual(wilsonInterval(3, 10, 0.9));
  });

  const python = pythonWithScipy();
  it.skipIf(!python)('gives the 90 % Jeffreys bounds scipy.stats.beta.ppf gives (second reference)', () => {
    const cases = [
      [1, 10],
      [3, 41],
      [17, 40],
      [39, 40],
      [2.5, 7],
      [120, 1220],
    ];
    const want = runPython<[number, number][]>(
      python as string,
      `import json, sys
from scipy.stats import beta
out = [[beta.ppf(0.05, x + 0.5, n - x + 0.5), beta.ppf(0.95, x + 0.5, n - x + 0.5)] for x, n in json.load(sys.stdin)]
print(json.dumps(out))`,
      cases,
    );
    cases.forEach(([x, n], i) => {
      const got = jeffreysInterval(x, n, 0.9);
      expect(Math.abs(got.lower - want[i][0])).toBeLessThan(1e-7);
      expect(Math.abs(got.upper - want[i][1])).toBeLessThan(1e-7);
    });
  });
});
