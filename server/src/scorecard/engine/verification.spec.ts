import { randomLcg } from 'd3-random';
import { describe, expect, it } from 'vitest';
import { pythonWithScipy, runPython } from '../../testing/scipy.js';
import {
  bootstrapInterval,
  bootstrapIntervalByCounts,
  brierScore,
  brierSkill,
  contingency,
  murphyDecomposition,
  reliabilityTable,
  roc,
} from './verification.js';

describe('Brier score', () => {
  it.each([
    // scikit-learn documentation, brier_score_loss example (REFERENCES.md §5).
    [[0.1, 0.9, 0.8, 0.3], 0.0375],
    [[0.1, 0.9, 0.8, 0.4], 0.055],
  ])('forecasts %j against outcomes 0,1,1,0 score %f', (f, expected) => {
    expect(brierScore(f, [0, 1, 1, 0])).toBeCloseTo(expected, 12);
  });

  it('refuses forecasts and outcomes of different lengths', () => {
    expect(() => brierScore([0.1], [0, 1])).toThrow(/1 forecasts but 2 outcomes/);
  });
});

describe('Murphy (1973) decomposition', () => {
  // Worked from the definitions (REFERENCES.md §5, exact): five forecasts of 0.1 with outcomes 0,0,0,1,0
  // and five of 0.7 with outcomes 1,1,0,1,1.
  const f = [0.1, 0.1, 0.1, 0.1, 0.1, 0.7, 0.7, 0.7, 0.7, 0.7];
  const o = [0, 0, 0, 1, 0, 1, 1, 0, 1, 1];

  it('splits the worked example into reliability 0.01, resolution 0.09, uncertainty 0.25', () => {
    const d = murphyDecomposition(f, o);
    expect(d.brier).toBeCloseTo(0.17, 12);
    expect(d.reliability).toBeCloseTo(0.01, 12);
    expect(d.resolution).toBeCloseTo(0.09, 12);
    expect(d.uncertainty).toBeCloseTo(0.25, 12);
    // Skill against the base rate 0.5, whose Brier score is 0.25.
    expect(brierSkill(d.brier, brierScore(Array(10).fill(0.5), o))).toBeCloseTo(0.32, 12);
  });

  it('holds BS = REL − RES + UNC to 1e-12 when chances take a few discrete values (Murphy 1973)', () => {
    const rand = randomLcg(7);
    const values = [0, 0.1, 0.25, 0.4, 0.7, 0.9];
    const fs: number[] = [];
    const os: number[] = [];
    for (let i = 0; i < 5000; i++) {
      const p = values[Math.floor(rand() * values.length)];
      fs.push(p);
      os.push(rand() < p * 0.8 + 0.05 ? 1 : 0);
    }
    const d = murphyDecomposition(fs, os);
    expect(Math.abs(d.brier - (d.reliability - d.resolution + d.uncertainty))).toBeLessThan(1e-12);
    expect(Math.abs(d.withinBin)).toBeLessThan(1e-12);
    // With bins wider than the values, the within-bin term is what the identity then lacks.
    const binned = murphyDecomposition(fs, os, [0, 0.5, 1]);
    expect(binned.brier - (binned.reliability - binned.resolution + binned.uncertainty)).toBeCloseTo(
      binned.withinBin,
      12,
    );
    expect(Math.abs(binned.withinBin)).toBeGreaterThan(1e-6);
  });
});

describe('reliability table', () => {
  it('counts cases and events per bin of issued chance, by hand', () => {
    const bins = reliabilityTable([0.05, 0.15, 0.12, 0.95, 1], [0, 1, 0, 1, 1], [0, 0.1, 0.5, 1]);
    expect(bins.map((b) => [b.count, b.events])).toEqual([
      [1, 0],
      [2, 1],
      [2, 2],
    ]);
    expect(bins[1].meanForecast).toBeCloseTo(0.135, 12);
    expect(bins[1].observedFrequency).toBe(0.5);
    // A chance of exactly 1 belongs to the last bin.
    expect(bins[2].meanForecast).toBeCloseTo(0.975, 12);
  });
});

describe('ROC', () => {
  it('has area 1 for a perfect forecast and 0.5 for a forecast that never changes (definition)', () => {
    const o = [0, 1, 1, 0, 1, 0, 0];
    expect(roc(o, o).area).toBe(1);
    expect(roc(Array(o.length).fill(0.3), o).area).toBe(0.5);
  });

  it('runs from (0, 0) to (1, 1)', () => {
    const { points } = roc([0.2, 0.8, 0.5, 0.1], [0, 1, 1, 0]);
    expect(points[0]).toMatchObject({ hitRate: 1, falseAlarmRate: 1 });
    expect(points[points.length - 1]).toMatchObject({ hitRate: 0, falseAlarmRate: 0 });
  });

  const python = pythonWithScipy();
  it.skipIf(!python)('equals the Mann–Whitney U / (n₁ n₀) of scipy.stats.mannwhitneyu, ties included', () => {
    const rand = randomLcg(11);
    const f: number[] = [];
    const o: number[] = [];
    for (let i = 0; i < 400; i++) {
      const event = rand() < 0.3 ? 1 : 0;
      o.push(event);
      // Chances in steps of 0.1, so many ties, higher on event days.
      f.push(Math.min(10, Math.floor(rand() * 7 + event * 3)) / 10);
    }
    const u = runPython<number>(
      python as string,
      `import sys, json
from scipy.stats import mannwhitneyu
d = json.load(sys.stdin)
x = [p for p, e in zip(d["f"], d["o"]) if e == 1]
y = [p for p, e in zip(d["f"], d["o"]) if e == 0]
print(json.dumps(float(mannwhitneyu(x, y).statistic) / (len(x) * len(y))))`,
      { f, o },
    );
    expect(roc(f, o).area).toBeCloseTo(u, 12);
  });
});

describe('contingency at a threshold', () => {
  it('counts hits, misses, false alarms and correct negatives by hand', () => {
    const c = contingency([0.6, 0.4, 0.7, 0.2, 0.5], [1, 1, 0, 0, 1], 0.5);
    expect(c).toMatchObject({ hits: 2, misses: 1, falseAlarms: 1, correctNegatives: 1 });
    expect(c.hitRate).toBeCloseTo(2 / 3, 12);
    expect(c.falseAlarmRatio).toBeCloseTo(1 / 3, 12);
  });
});

describe('bootstrap over days', () => {
  // 300 days of one value each; the mean's 90 % percentile interval should be close to the normal
  // theory interval mean ± 1.645 s/√n (Efron & Tibshirani 1993, from memory), within 15 %.
  const rand = randomLcg(3);
  const values = Array.from({ length: 300 }, () => rand());
  const groups = values.map((_, i) => [i]);
  const mean = (idx: number[]) => idx.reduce((s, i) => s + values[i], 0) / idx.length;

  it('matches the normal-theory width for a mean of independent days', () => {
    const m = mean(groups.map(([i]) => i));
    const sd = Math.sqrt(values.reduce((s, v) => s + (v - m) ** 2, 0) / (values.length - 1));
    const expectedHalf = (1.6449 * sd) / Math.sqrt(values.length);
    const b = bootstrapInterval(groups, mean, { resamples: 2000, seed: 5 });
    expect(b.lower).toBeLessThan(m);
    expect(b.upper).toBeGreaterThan(m);
    expect((b.upper - b.lower) / 2 / expectedHalf).toBeGreaterThan(0.85);
    expect((b.upper - b.lower) / 2 / expectedHalf).toBeLessThan(1.15);
  });

  it('draws the same resamples when given as counts per day, so sums per day give the same interval', () => {
    const byIndices = bootstrapInterval(groups, mean, { resamples: 500, seed: 4 });
    const byCounts = bootstrapIntervalByCounts(
      groups.length,
      (times) => values.reduce((s, v, d) => s + times[d] * v, 0) / groups.length,
      { resamples: 500, seed: 4 },
    );
    expect(byCounts.lower).toBeCloseTo(byIndices.lower, 12);
    expect(byCounts.upper).toBeCloseTo(byIndices.upper, 12);
  });

  it('is repeatable with a seed and resamples whole days', () => {
    const a = bootstrapInterval(groups, mean, { resamples: 200, seed: 9 });
    expect(bootstrapInterval(groups, mean, { resamples: 200, seed: 9 })).toEqual(a);
    // Two cases per day that always agree: every resample keeps them together.
    const paired = [
      [0, 1],
      [2, 3],
    ];
    const same = (idx: number[]) => (idx.filter((i) => i < 2).length % 2 === 0 ? 1 : 0);
    expect(bootstrapInterval(paired, same, { resamples: 100, seed: 1 })).toMatchObject({
      lower: 1,
      upper: 1,
    });
  });
});
