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

/** Each pair's place among the distinct issued chances, ascending, and how many there are. */
export function chanceRanks(f: Float64Array): { rank: Int32Array; distinct: number } {
  const values = [...new Set(f)].sort((a, b) => a - b);
  const index = new Map(values.map((v, k) => [v, k]));
  return { rank: Int32Array.from(f, (v) => index.get(v) as number), distinct: values.length };
}

/**
 * The area under the ROC curve of the pairs `indices` (repeats allowed), as the Mann–Whitney
 * probability that an event had a higher chance than a non-event, ties counted half. Counting by
 * rank of chance makes it linear in the pairs, so it can be bootstrapped.
 */
export function rocAreaByRank(
  ranks: { rank: Int32Array; distinct: number },
  o: Float64Array,
  indices: readonly number[],
): number {
  const events = new Float64Array(ranks.distinct);
  const nonEvents = new Float64Array(ranks.distinct);
  for (const i of indices) {
    if (o[i]) events[ranks.rank[i]]++;
    else nonEvents[ranks.rank[i]]++;
  }
  let below = 0;
  let wins = 0;
  let nEvents = 0;
  for (let k = 0; k < ranks.distinct; k++) {
    wins += events[k] * (below + nonEvents[k] / 2);
    below += nonEvents[k];
    nEvents += events[k];
  }
  return nEvents > 0 && below > 0 ? wins / (nEvents * below) : Number.NaN;
}

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
  const hasRef = pairs.map((p) => p.climatologyChance !== null);
  // The bootstrap evaluates these a thousand times over thousands of pairs: plain loops, no copies.
  const brierOf = (indices: readonly number[]) => {
    let sum = 0;
    for (const i of indices) sum += (f[i] - o[i]) ** 2;
    return indices.length ? sum / indices.length : Number.NaN;
  };
  // Skill on the pairs that have a reference, so both scores rest on the same cases.
  const skillOf = (indices: readonly number[]) => {
    let bs = 0;
    let bsRef = 0;
    for (const i of indices)
      if (hasRef[i]) {
        bs += (f[i] - o[i]) ** 2;
        bsRef += (ref[i] - o[i]) ** 2;
      }
    return brierSkill(bs, bsRef);
  };
  const ranks = chanceRanks(f);
  const rocAreaOf = (indices: readonly number[]) => rocAreaByRank(ranks, o, indices);
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
