import type { ReliabilityRow, ScorecardView } from '@stormhour/shared';

const EDGES = [0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1];

function emptyBin(lower: number, upper: number): ReliabilityRow {
  return {
    lower,
    upper,
    count: 0,
    meanChance: null,
    events: 0,
    observedFrequency: null,
    interval: null,
    few: true,
  };
}

/**
 * A scorecard of ten block-days built on the worked example of REFERENCES §5 (computed from the
 * definitions): five chances of 0.1 with one storm and five of 0.7 with four → BS 0.17, REL 0.01,
 * RES 0.09, UNC 0.25, skill 0.32 against the all-days chance 0.5, ROC area 0.8 (Mann–Whitney 20/25).
 * Reliability intervals: Wilson at 90 % (REFERENCES §4's formula, z = 1.644854). The bootstrap
 * intervals are invented for display. Blocks and bulletins belong to the invented demo province.
 */
export function aScorecardView(overrides: Partial<ScorecardView> = {}): ScorecardView {
  const reliability = EDGES.slice(0, -1).map((lower, k) => emptyBin(lower, EDGES[k + 1]));
  reliability[1] = {
    ...reliability[1],
    count: 5,
    meanChance: 0.1,
    events: 1,
    observedFrequency: 0.2,
    interval: { lower: 0.04596, upper: 0.56471 },
  };
  reliability[7] = {
    ...reliability[7],
    count: 5,
    meanChance: 0.7,
    events: 4,
    observedFrequency: 0.8,
    interval: { lower: 0.43529, upper: 0.95404 },
  };
  return {
    districtId: 1,
    districtName: 'Riverbend',
    from: '2025-06-30',
    to: '2025-07-13',
    source: 'combined',
    bulletins: 2,
    pairs: 10,
    days: 5,
    events: 5,
    brier: 0.17,
    brierInterval: { lower: 0.09, upper: 0.25 },
    climatologyBrier: 0.25,
    skill: 0.32,
    skillInterval: { lower: 0.05, upper: 0.61 },
    murphy: { reliability: 0.01, resolution: 0.09, uncertainty: 0.25, withinBin: 0 },
    reliability,
    fewCases: 10,
    // Listed from the highest chance down, as the contract says.
    roc: {
      points: [
        { threshold: 0.7, hitRate: 0.8, falseAlarmRate: 0.2 },
        { threshold: 0.1, hitRate: 1, falseAlarmRate: 1 },
      ],
      area: 0.8,
    },
    rocAreaInterval: { lower: 0.62, upper: 0.95 },
    thresholds: [
      {
        threshold: 0.4,
        hits: 4,
        misses: 1,
        falseAlarms: 1,
        correctNegatives: 4,
        hitRate: 0.8,
        falseAlarmRatio: 0.2,
      },
    ],
    agreement: { both: 3, radarOnly: 1, reportOnly: 0, neither: 4 },
    // Sallow Ford: (0.7,1) (0.7,1) (0.7,0) (0.1,0) (0.1,0) → 0.138; Umberlyn: (0.7,1) (0.7,1) (0.1,0)
    // (0.1,1) (0.1,0) → 0.202; together the ten pairs above.
    blocks: [
      {
        blockCode: 'RVB-02',
        blockName: 'Umberlyn',
        pairs: 5,
        events: 3,
        brier: 0.202,
        skill: 0.192,
        bulletins: [
          { id: 12, number: 'RB-2025-28' },
          { id: 11, number: 'RB-2025-27' },
        ],
      },
      {
        blockCode: 'RVB-01',
        blockName: 'Sallow Ford',
        pairs: 5,
        events: 2,
        brier: 0.138,
        skill: 0.448,
        bulletins: [{ id: 12, number: 'RB-2025-28' }],
      },
    ],
    resamples: 1000,
    ...overrides,
  };
}
