import type {
  BlockScore,
  ReliabilityRow,
  ScorecardPair,
  ScorecardView,
  ScoreInterval,
  ThresholdScores,
} from '@stormhour/shared';
import { wilsonInterval } from '../../outlook/engine/intervals.js';
import {
  bootstrapInterval,
  brierScore,
  brierSkill,
  contingency,
  DEFAULT_EDGES,
  murphyDecomposition,
  reliabilityTable,
  roc,
} from './verification.js';

export interface ScoreOptions {
  /** Bootstrap resamples over days for the intervals; 0 leaves them out. */
  resamples: number;
  /** "Yes" thresholds to score hit rate and false-alarm ratio at (the advice rules' thresholds). */
  thresholds: readonly number[];
  /** Reliability bins with fewer pairs are marked as few. */
  fewCases?: number;
  seed?: number;
  level?: number;
}

export type PairScores = Omit<
  ScorecardView,
  'districtId' | 'districtName' | 'from' | 'to' | 'source' | 'bulletins' | 'agreement'
>;

function groupInto(groups: Map<string, number[]>, key: string, index: number): void {
  const group = groups.get(key);
  if (group) group.push(index);
  else groups.set(key, [index]);
}

const finite = (v: number): number | null => (Number.isFinite(v) ? v : null);

function interval(i: { lower: number; upper: number; resamples: number }): ScoreInterval | null {
  return i.resamples > 0 && Number.isFinite(i.lower) && Number.isFinite(i.upper)
    ? { lower: i.lower, upper: i.upper }
    : null;
}

/**
 * Scores issued chances against outcomes (DESIGN §3.8): Brier score and skill against the all-days
 * chances, the Murphy (1973) decomposition over the distinct issued chances, a reliability table with
 * Wilson intervals, ROC, scores at the advice thresholds, and per-block scores worst first. Intervals
 * resample whole days, since a day's blocks share its weather.
 */
export function scorePairs(pairs: readonly ScorecardPair[], options: ScoreOptions): PairScores {
  const level = options.level ?? 0.9;
  const fewCases = options.fewCases ?? 10;
  const n = pairs.length;
  const f = new Float64Array(n);
  const o = new Float64Array(n);
  const ref = new Float64Array(n);
  const withRef: number[] = [];
  const byDay = new Map<string, number[]>();
  let events = 0;
  pairs.forEach((p, i) => {
    f[i] = p.chance;
    o[i] = p.observed;
    events += p.observed;
    if (p.climatologyChance !== null) {
      ref[i] = p.climatologyChance;
      withRef.push(i);
    }
    groupInto(byDay, p.date, i);
  });
  const days = [...byDay.values()];

  const sub = (values: Float64Array, indices: readonly number[]) =>
    Float64Array.from(indices, (i) => values[i]);
  const brierOf = (indices: readonly number[]) => brierScore(sub(f, indices), sub(o, indices));
  // Skill on the pairs that have a reference, so both scores rest on the same cases.
  const skillOf = (indices: readonly number[]) => {
    const use = indices.filter((i) => pairs[i].climatologyChance !== null);
    return brierSkill(brierOf(use), brierScore(sub(ref, use), sub(o, use)));
  };
  const rocAreaOf = (indices: readonly number[]) => roc(sub(f, indices), sub(o, indices)).area;
  const boot = (statistic: (indices: number[]) => number) =>
    options.resamples > 0 && days.length > 1
      ? interval(
          bootstrapInterval(days, statistic, { resamples: options.resamples, level, seed: options.seed }),
        )
      : null;

  const all = pairs.map((_, i) => i);
  const reliability: ReliabilityRow[] = reliabilityTable(f, o, DEFAULT_EDGES).map((b) => ({
    lower: b.lower,
    upper: b.upper,
    count: b.count,
    meanChance: finite(b.meanForecast),
    events: b.events,
    observedFrequency: finite(b.observedFrequency),
    interval: b.count > 0 ? wilsonInterval(b.events, b.count, level) : null,
    few: b.count < fewCases,
  }));
  const curve = n > 0 ? roc(f, o) : { points: [], area: Number.NaN };
  const thresholds: ThresholdScores[] = options.thresholds.map((t) => {
    const c = contingency(f, o, t);
    return { threshold: t, ...c, hitRate: finite(c.hitRate), falseAlarmRatio: finite(c.falseAlarmRatio) };
  });
  const murphy = n > 0 ? murphyDecomposition(f, o) : null;
  const climatologyBrier = withRef.length ? brierScore(sub(ref, withRef), sub(o, withRef)) : Number.NaN;

  const byBlock = new Map<string, number[]>();
  for (const [i, p] of pairs.entries()) groupInto(byBlock, p.blockCode, i);
  const blocks: BlockScore[] = [...byBlock.values()]
    .map((indices) => {
      const first = pairs[indices[0]];
      const bulletins = new Map<number, string>();
      for (const i of indices) bulletins.set(pairs[i].bulletinId, pairs[i].bulletinNumber);
      return {
        blockCode: first.blockCode,
        blockName: first.blockName,
        pairs: indices.length,
        events: indices.reduce((s, i) => s + o[i], 0),
        brier: brierOf(indices),
        skill: finite(skillOf(indices)),
        bulletins: [...bulletins].sort((a, b) => b[0] - a[0]).map(([id, number]) => ({ id, number })),
      };
    })
    .sort((a, b) => b.brier - a.brier || a.blockCode.localeCompare(b.blockCode));

  return {
    pairs: n,
    days: days.length,
    events,
    brier: n > 0 ? brierOf(all) : null,
    brierInterval: n > 0 ? boot(brierOf) : null,
    climatologyBrier: finite(climatologyBrier),
    skill: withRef.length ? finite(skillOf(all)) : null,
    skillInterval: withRef.length ? boot(skillOf) : null,
    murphy: murphy && {
      reliability: murphy.reliability,
      resolution: murphy.resolution,
      uncertainty: murphy.uncertainty,
      withinBin: murphy.withinBin,
    },
    reliability,
    fewCases,
    roc: { points: curve.points.filter((p) => Number.isFinite(p.threshold)), area: finite(curve.area) },
    rocAreaInterval: n > 0 ? boot(rocAreaOf) : null,
    thresholds,
    blocks,
    resamples: options.resamples,
  };
}
