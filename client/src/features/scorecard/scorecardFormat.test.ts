import { describe, expect, it } from 'vitest';
import {
  agreementSummary,
  binLabel,
  formatNumber,
  formatScore,
  murphyTerms,
  proposedSeason,
  rocCurve,
  scorecardFileName,
  skillVerdict,
} from './scorecardFormat';

describe('formatScore', () => {
  it('gives a score with its 90 % interval as the issue asks', () => {
    expect(formatScore(0.1823, { lower: 0.16, upper: 0.2051 })).toBe('0.182 (90 % interval 0.160–0.205)');
  });

  it('leaves the interval out when none was resampled, and says "–" for no score', () => {
    expect(formatScore(0.17, null)).toBe('0.170');
    expect(formatScore(null, { lower: 0, upper: 1 })).toBe('–');
  });

  it('writes negative skill with a minus sign, and never "−0.000"', () => {
    expect(formatScore(-0.052, { lower: -0.11, upper: 0.004 })).toBe(
      '\u22120.052 (90 % interval \u22120.110–0.004)',
    );
    expect(formatNumber(-0.0001)).toBe('0.000');
  });
});

describe('binLabel', () => {
  it.each([
    [0, 0.1, '0–10 %'],
    [0.7, 0.8, '70–80 %'],
    [0.9, 1, '90–100 %'],
  ])('%f–%f → %s', (lower, upper, label) => expect(binLabel({ lower, upper })).toBe(label));
});

describe('murphyTerms', () => {
  // Worked example, REFERENCES §5 (computed from Murphy 1973's definitions, exact): five forecasts of 0.1
  // (one storm) and five of 0.7 (four storms) → REL 0.01, RES 0.09, UNC 0.25, BS 0.17.
  it('adds up to the Brier score: BS = REL − RES + UNC', () => {
    const { terms, sum } = murphyTerms({
      reliability: 0.01,
      resolution: 0.09,
      uncertainty: 0.25,
      withinBin: 0,
    });
    expect(sum).toBeCloseTo(0.17, 12);
    expect(terms.map((t) => [t.name, t.sign])).toEqual([
      ['Reliability', 1],
      ['Resolution', -1],
      ['Uncertainty', 1],
    ]);
  });

  it('lists the within-bin rest only when binning left something out, and always counts it', () => {
    const { terms, sum } = murphyTerms({
      reliability: 0.01,
      resolution: 0.09,
      uncertainty: 0.25,
      withinBin: 0.004,
    });
    expect(terms.map((t) => t.key)).toContain('withinBin');
    expect(sum).toBeCloseTo(0.174, 12);
  });
});

describe('rocCurve', () => {
  // scikit-learn roc_curve documentation example (from memory): y = [1, 1, 2, 2] with 2 the event,
  // scores [0.1, 0.4, 0.35, 0.8] → fpr [0, 0, 0.5, 0.5, 1], tpr [0, 0.5, 0.5, 1, 1], thresholds
  // [inf, 0.8, 0.4, 0.35, 0.1]. The server lists the finite thresholds; here in shuffled order.
  it('starts at (0, 0), runs from the highest chance down and ends at (1, 1)', () => {
    const curve = rocCurve([
      { threshold: 0.35, hitRate: 1, falseAlarmRate: 0.5 },
      { threshold: 0.1, hitRate: 1, falseAlarmRate: 1 },
      { threshold: 0.8, hitRate: 0.5, falseAlarmRate: 0 },
      { threshold: 0.4, hitRate: 0.5, falseAlarmRate: 0.5 },
    ]);
    expect(curve.map((p) => p.falseAlarmRate)).toEqual([0, 0, 0.5, 0.5, 1]);
    expect(curve.map((p) => p.hitRate)).toEqual([0, 0.5, 0.5, 1, 1]);
    expect(curve.map((p) => p.threshold)).toEqual([null, 0.8, 0.4, 0.35, 0.1]);
  });

  it('adds (1, 1) when the lowest chance issued does not reach it, and draws the diagonal alone for no points', () => {
    const curve = rocCurve([{ threshold: 0.5, hitRate: 0.6, falseAlarmRate: 0.2 }]);
    expect(curve.at(-1)).toEqual({ falseAlarmRate: 1, hitRate: 1, threshold: null });
    expect(rocCurve([]).map((p) => [p.falseAlarmRate, p.hitRate])).toEqual([
      [0, 0],
      [1, 1],
    ]);
  });
});

describe('agreementSummary', () => {
  // Cohen's kappa (Cohen 1960, Educ. Psychol. Meas. 20, 37–46): κ = (pₒ − pₑ) / (1 − pₑ). For 20 both,
  // 5 and 10 one only, 15 neither: pₒ = 0.7, pₑ = 0.5·0.6 + 0.5·0.4 = 0.5, κ = 0.4 (computed from the
  // definition, exact; the same table is the worked example of Wikipedia's "Cohen's kappa", from memory).
  it('gives the share agreeing and Cohen’s kappa', () => {
    const s = agreementSummary({ both: 20, radarOnly: 5, reportOnly: 10, neither: 15 });
    expect(s.total).toBe(50);
    expect(s.agreeing).toBe(35);
    expect(s.share).toBeCloseTo(0.7, 12);
    expect(s.kappa).toBeCloseTo(0.4, 12);
  });

  it('gives kappa 1 for perfect agreement and none when there is nothing to compare', () => {
    // Definition: pₒ = 1 makes κ = 1 whatever pₑ (Cohen 1960).
    expect(agreementSummary({ both: 3, radarOnly: 0, reportOnly: 0, neither: 7 }).kappa).toBeCloseTo(1, 12);
    expect(agreementSummary({ both: 0, radarOnly: 0, reportOnly: 0, neither: 0 })).toEqual({
      total: 0,
      agreeing: 0,
      share: null,
      kappa: null,
    });
    // Both sources always "no storm": pₑ = 1, kappa undefined (common practice: report none).
    expect(agreementSummary({ both: 0, radarOnly: 0, reportOnly: 0, neither: 9 }).kappa).toBeNull();
  });
});

describe('skillVerdict', () => {
  it.each([
    [0.2, { lower: 0.05, upper: 0.3 }, /^Better/],
    [-0.2, { lower: -0.3, upper: -0.05 }, /^Worse/],
    [0.05, { lower: -0.02, upper: 0.1 }, /includes 0/],
    [0.05, null, /no interval/],
    [null, null, /no usual chances/],
  ])('skill %s with interval %j', (skill, interval, verdict) => {
    expect(skillVerdict(skill, interval)).toMatch(verdict);
  });

  it('says so when the bulletins issued the usual chances themselves (skill 0 by definition)', () => {
    expect(skillVerdict(0, { lower: 0, upper: 0 }, true)).toMatch(/its usual chance/);
  });
});

describe('proposedSeason', () => {
  const week = (weekStart: string, weekEnd: string) => ({ weekStart, weekEnd });

  it('spans the sent bulletins’ weeks', () => {
    expect(
      proposedSeason([week('2025-07-07', '2025-07-13'), week('2025-06-02', '2025-06-08')], '2026-12-02'),
    ).toEqual({ from: '2025-06-02', to: '2025-07-13' });
  });

  it('stops at yesterday, since a day is scored once it has passed', () => {
    expect(proposedSeason([week('2026-11-30', '2026-12-06')], '2026-12-02')).toEqual({
      from: '2026-11-30',
      to: '2026-12-01',
    });
  });

  it('proposes nothing without sent bulletins', () => {
    expect(proposedSeason([], '2026-12-02')).toBeNull();
  });
});

describe('skill and file names', () => {
  it('names an export after the district, season and source', () => {
    expect(
      scorecardFileName(
        { districtName: 'River Bend', from: '2025-06-02', to: '2025-09-28', source: 'radar' },
        'csv',
      ),
    ).toBe('scorecard-river-bend-2025-06-02-to-2025-09-28-radar.csv');
  });
});
