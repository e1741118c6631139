import type { ScorecardPair } from '@stormhour/shared';
import { describe, expect, it } from 'vitest';
import { chanceRanks, rocAreaByRank, scorePairs } from './scorecard.js';
import { roc } from './verification.js';

const pair = (
  date: string,
  blockCode: string,
  chance: number,
  observed: 0 | 1,
  climatologyChance: number | null = 0.5,
): ScorecardPair => ({
  bulletinId: 1,
  bulletinNumber: 'D-2025-32',
  blockCode,
  blockName: blockCode,
  date,
  chance,
  climatologyChance,
  observed,
  source: 'radar',
});

describe('scoring pairs', () => {
  it('gives the Brier score of the scikit-learn brier_score_loss example (0.0375)', () => {
    // scikit-learn documentation, sklearn.metrics.brier_score_loss: y_true [0, 1, 1, 0],
    // y_prob [0.1, 0.9, 0.8, 0.3] → 0.0375.
    const pairs = [
      pair('2025-08-04', 'A', 0.1, 0),
      pair('2025-08-05', 'A', 0.9, 1),
      pair('2025-08-06', 'A', 0.8, 1),
      pair('2025-08-07', 'A', 0.3, 0),
    ];
    const s = scorePairs(pairs, { resamples: 0, thresholds: [0.4] });
    expect(s.brier).toBeCloseTo(0.0375, 12);
    // Against a constant 0.5 the reference Brier score is 0.25, so the skill is 1 − 0.0375/0.25 = 0.85
    // (Brier skill score definition, Wilks 2011 §8.4.2).
    expect(s.climatologyBrier).toBeCloseTo(0.25, 12);
    expect(s.skill).toBeCloseTo(0.85, 12);
    // Every event had a higher chance than every non-event: ROC area 1 (Mason & Graham 2002).
    expect(s.roc.area).toBe(1);
    // At 0.4: two hits, no misses, no false alarms.
    expect(s.thresholds[0]).toMatchObject({
      hits: 2,
      misses: 0,
      falseAlarms: 0,
      correctNegatives: 2,
      hitRate: 1,
      falseAlarmRatio: 0,
    });
    expect(s.brierInterval).toBeNull();
  });

  it('splits the Brier score exactly into reliability − resolution + uncertainty for discrete chances', () => {
    // Murphy (1973): the identity is exact when each distinct issued chance is its own bin.
    const chances = [0.1, 0.3, 0.6];
    const pairs: ScorecardPair[] = [];
    for (let d = 0; d < 30; d++)
      for (const [b, chance] of chances.entries())
        pairs.push(
          pair(
            `2025-08-${String(d + 1).padStart(2, '0')}`,
            `B${b}`,
            chance,
            (d * 7 + b * 3) % 10 < chance * 12 ? 1 : 0,
          ),
        );
    const s = scorePairs(pairs, { resamples: 0, thresholds: [] });
    const m = s.murphy as NonNullable<typeof s.murphy>;
    expect(m.reliability - m.resolution + m.uncertainty).toBeCloseTo(s.brier as number, 12);
    expect(Math.abs(m.withinBin)).toBeLessThan(1e-12);
  });

  it('resamples whole days, repeatably, and the intervals hold the estimates', () => {
    const pairs: ScorecardPair[] = [];
    for (let d = 1; d <= 40; d++)
      for (const b of ['A', 'B', 'C']) {
        const chance = d % 3 === 0 ? 0.7 : 0.2;
        pairs.push(
          pair(
            `2025-07-${String(d).padStart(2, '0')}`,
            b,
            chance,
            (d + b.charCodeAt(0)) % 4 === 0 || (chance > 0.5 && b !== 'C') ? 1 : 0,
            0.35,
          ),
        );
      }
    const a = scorePairs(pairs, { resamples: 400, thresholds: [0.4], seed: 3 });
    const b = scorePairs(pairs, { resamples: 400, thresholds: [0.4], seed: 3 });
    expect(a.brierInterval).toEqual(b.brierInterval);
    const brier = a.brier as number;
    const bi = a.brierInterval as NonNullable<typeof a.brierInterval>;
    expect(bi.lower).toBeLessThan(brier);
    expect(bi.upper).toBeGreaterThan(brier);
    const si = a.skillInterval as NonNullable<typeof a.skillInterval>;
    expect(si.lower).toBeLessThan(a.skill as number);
    expect(si.upper).toBeGreaterThan(a.skill as number);
    expect(a.days).toBe(40);
  });

  it('lists blocks worst first, marks thin reliability bins and leaves empty ones without a frequency', () => {
    const pairs = [
      pair('2025-08-04', 'GOOD', 0.1, 0),
      pair('2025-08-05', 'GOOD', 0.9, 1),
      pair('2025-08-04', 'BAD', 0.9, 0),
      pair('2025-08-05', 'BAD', 0.1, 1, null),
    ];
    const s = scorePairs(pairs, { resamples: 0, thresholds: [], fewCases: 3 });
    expect(s.blocks.map((b) => [b.blockCode, b.brier])).toEqual(
      [
        ['BAD', 0.81],
        ['GOOD', 0.01],
      ].map(([c, v]) => [c, expect.closeTo(v as number, 12)]),
    );
    // BAD's skill rests on its one pair with a reference: 1 − 0.81 / 0.25.
    expect(s.blocks[0].skill).toBeCloseTo(1 - 0.81 / 0.25, 12);
    const top = s.reliability[s.reliability.length - 1];
    expect(top).toMatchObject({ count: 2, events: 1, few: true });
    expect(s.reliability[5]).toMatchObject({ count: 0, observedFrequency: null, interval: null });
  });

  it('has no scores, rather than zeros, without pairs', () => {
    const s = scorePairs([], { resamples: 100, thresholds: [0.4] });
    expect(s).toMatchObject({ pairs: 0, brier: null, skill: null, murphy: null, brierInterval: null });
    expect(s.thresholds[0].hitRate).toBeNull();
  });

  it('counts the ROC area by rank exactly as the trapezoid area of the full curve, ties and repeats included', () => {
    // roc() is checked against scipy.stats.mannwhitneyu in verification.spec.ts.
    let seed = 11;
    const random = () => {
      seed = (seed * 16807) % 2147483647;
      return seed / 2147483647;
    };
    const f = Float64Array.from({ length: 300 }, () => Math.round(random() * 10) / 10);
    const o = Float64Array.from(f, (p) => (random() < p ? 1 : 0));
    const ranks = chanceRanks(f);
    const all = Array.from(f, (_, i) => i);
    expect(rocAreaByRank(ranks, o, all)).toBeCloseTo(roc(f, o).area, 12);
    const resample = all.map(() => Math.floor(random() * 300));
    const picked = (a: Float64Array) => Float64Array.from(resample, (i) => a[i]);
    expect(rocAreaByRank(ranks, o, resample)).toBeCloseTo(roc(picked(f), picked(o)).area, 12);
  });
});
