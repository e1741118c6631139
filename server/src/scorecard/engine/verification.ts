import { randomInt, randomLcg } from 'd3-random';
import { quantile } from '../../regimes/engine/regime-math.js';

/**
 * Scores of issued probabilities against what happened (DESIGN §3.8). Forecasts f are chances in
 * [0, 1]; outcomes o are 0 or 1. Framework-free: arrays in, plain objects out.
 */

export type Numbers = ArrayLike<number>;

function checkPairs(f: Numbers, o: Numbers): void {
  if (f.length !== o.length) throw new Error(`${f.length} forecasts but ${o.length} outcomes`);
}

/** Brier score: the mean squared difference between chance and outcome, 0 (perfect) to 1. */
export function brierScore(f: Numbers, o: Numbers): number {
  checkPairs(f, o);
  if (f.length === 0) return Number.NaN;
  let sum = 0;
  for (let i = 0; i < f.length; i++) sum += (f[i] - o[i]) ** 2;
  return sum / f.length;
}

/** Skill against a reference forecast's Brier score: 1 perfect, 0 no better, negative worse. */
export function brierSkill(bs: number, reference: number): number {
  return reference > 0 ? 1 - bs / reference : Number.NaN;
}

export interface ReliabilityBin {
  /** The bin's lower and upper edges of issued chance; the last bin includes its upper edge. */
  lower: number;
  upper: number;
  count: number;
  /** Mean issued chance in the bin. */
  meanForecast: number;
  /** Cases in the bin where the event happened. */
  events: number;
  observedFrequency: number;
}

export const DEFAULT_EDGES = [0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1];

function binOf(p: number, edges: readonly number[]): number {
  for (let k = 0; k < edges.length - 2; k++) if (p < edges[k + 1]) return k;
  return edges.length - 2;
}

/** Issued-chance bins against observed frequency; empty bins are kept (count 0) so tables line up. */
export function reliabilityTable(f: Numbers, o: Numbers, edges: readonly number[] = DEFAULT_EDGES) {
  checkPairs(f, o);
  const bins: ReliabilityBin[] = [];
  for (let k = 0; k < edges.length - 1; k++) {
    bins.push({
      lower: edges[k],
      upper: edges[k + 1],
      count: 0,
      meanForecast: 0,
      events: 0,
      observedFrequency: 0,
    });
  }
  for (let i = 0; i < f.length; i++) {
    const b = bins[binOf(f[i], edges)];
    b.count++;
    b.meanForecast += f[i];
    b.events += o[i];
  }
  for (const b of bins) {
    if (b.count === 0) {
      b.meanForecast = Number.NaN;
      b.observedFrequency = Number.NaN;
    } else {
      b.meanForecast /= b.count;
      b.observedFrequency = b.events / b.count;
    }
  }
  return bins;
}

export interface MurphyDecomposition {
  brier: number;
  reliability: number;
  resolution: number;
  uncertainty: number;
  /**
   * What binning leaves out: BS − (REL − RES + UNC). Zero when every forecast in a bin is the same
   * value (forecasts issued as a few discrete chances); the spread of chances inside a bin otherwise.
   */
  withinBin: number;
}

/**
 * Murphy (1973): BS = REL − RES + UNC, with REL = Σ nₖ (f̄ₖ − ōₖ)² / N, RES = Σ nₖ (ōₖ − ō)² / N and
 * UNC = ō (1 − ō). Without edges every distinct issued chance is its own bin, so the identity is exact.
 */
export function murphyDecomposition(f: Numbers, o: Numbers, edges?: readonly number[]): MurphyDecomposition {
  checkPairs(f, o);
  const n = f.length;
  const groups = new Map<number, { count: number; sumF: number; events: number }>();
  for (let i = 0; i < n; i++) {
    const key = edges ? binOf(f[i], edges) : f[i];
    const g = groups.get(key) ?? { count: 0, sumF: 0, events: 0 };
    g.count++;
    g.sumF += f[i];
    g.events += o[i];
    groups.set(key, g);
  }
  let events = 0;
  for (let i = 0; i < n; i++) events += o[i];
  const base = events / n;
  let reliability = 0;
  let resolution = 0;
  for (const g of groups.values()) {
    const fk = g.sumF / g.count;
    const ok = g.events / g.count;
    reliability += g.count * (fk - ok) ** 2;
    resolution += g.count * (ok - base) ** 2;
  }
  reliability /= n;
  resolution /= n;
  const uncertainty = base * (1 - base);
  const brier = brierScore(f, o);
  return {
    brier,
    reliability,
    resolution,
    uncertainty,
    withinBin: brier - (reliability - resolution + uncertainty),
  };
}

export interface RocPoint {
  /** "Yes" is issued when the chance is at least this. */
  threshold: number;
  hitRate: number;
  falseAlarmRate: number;
}

/**
 * ROC points for every distinct issued chance as the yes/no threshold, from (1, 1) down to (0, 0),
 * and the area under them by the trapezoid rule (equal to the Mann–Whitney U / (n₁ n₀), ties counted half).
 */
export function roc(f: Numbers, o: Numbers): { points: RocPoint[]; area: number } {
  checkPairs(f, o);
  let events = 0;
  for (let i = 0; i < o.length; i++) events += o[i];
  const nonEvents = o.length - events;
  const thresholds = [...new Set(Array.from(f))].sort((a, b) => b - a);
  const points: RocPoint[] = [{ threshold: Number.POSITIVE_INFINITY, hitRate: 0, falseAlarmRate: 0 }];
  for (const t of thresholds) {
    const c = contingency(f, o, t);
    points.push({
      threshold: t,
      hitRate: events ? c.hits / events : Number.NaN,
      falseAlarmRate: nonEvents ? c.falseAlarms / nonEvents : Number.NaN,
    });
  }
  let area = 0;
  for (let k = 1; k < points.length; k++) {
    const [a, b] = [points[k - 1], points[k]];
    area += ((b.falseAlarmRate - a.falseAlarmRate) * (a.hitRate + b.hitRate)) / 2;
  }
  return { points: points.reverse(), area: events && nonEvents ? area : Number.NaN };
}

export interface Contingency {
  hits: number;
  misses: number;
  falseAlarms: number;
  correctNegatives: number;
  /** Hits / events (probability of detection). */
  hitRate: number;
  /** False alarms / "yes" forecasts (false-alarm ratio, not rate). */
  falseAlarmRatio: number;
}

/** The 2 × 2 table when "yes" means an issued chance of at least `threshold`. */
export function contingency(f: Numbers, o: Numbers, threshold: number): Contingency {
  checkPairs(f, o);
  let hits = 0;
  let misses = 0;
  let falseAlarms = 0;
  let correctNegatives = 0;
  for (let i = 0; i < f.length; i++) {
    const yes = f[i] >= threshold;
    if (yes && o[i]) hits++;
    else if (yes) falseAlarms++;
    else if (o[i]) misses++;
    else correctNegatives++;
  }
  return {
    hits,
    misses,
    falseAlarms,
    correctNegatives,
    hitRate: hits + misses ? hits / (hits + misses) : Number.NaN,
    falseAlarmRatio: hits + falseAlarms ? falseAlarms / (hits + falseAlarms) : Number.NaN,
  };
}

/**
 * A percentile interval of a statistic by resampling whole groups (days) with replacement, since the
 * blocks of one day share its weather and are not independent cases. Seeded, so a report is repeatable.
 */
export function bootstrapInterval(
  groups: readonly (readonly number[])[],
  statistic: (indices: number[]) => number,
  options: BootstrapOptions = {},
): { lower: number; upper: number; resamples: number } {
  return percentileInterval(groups.length, options, (pick) => {
    const indices: number[] = [];
    for (let g = 0; g < groups.length; g++) for (const i of groups[pick()]) indices.push(i);
    return statistic(indices);
  });
}

/**
 * The same bootstrap (same seed, same draws) with each resample given as how many times every group
 * was drawn. For statistics built from per-group sums this costs the number of groups per resample,
 * not the number of cases.
 */
export function bootstrapIntervalByCounts(
  groupCount: number,
  statistic: (timesDrawn: Float64Array) => number,
  options: BootstrapOptions = {},
): { lower: number; upper: number; resamples: number } {
  const counts = new Float64Array(groupCount);
  return percentileInterval(groupCount, options, (pick) => {
    counts.fill(0);
    for (let g = 0; g < groupCount; g++) counts[pick()]++;
    return statistic(counts);
  });
}

export interface BootstrapOptions {
  resamples?: number;
  level?: number;
  seed?: number;
}

function percentileInterval(
  groupCount: number,
  options: BootstrapOptions,
  resampled: (pick: () => number) => number,
): { lower: number; upper: number; resamples: number } {
  const resamples = options.resamples ?? 1000;
  const level = options.level ?? 0.9;
  const pick = randomInt.source(randomLcg(options.seed ?? 1))(groupCount);
  const values: number[] = [];
  for (let r = 0; r < resamples; r++) {
    const v = resampled(pick);
    if (Number.isFinite(v)) values.push(v);
  }
  values.sort((a, b) => a - b);
  const tail = (1 - level) / 2;
  return { lower: quantile(values, tail), upper: quantile(values, 1 - tail), resamples: values.length };
}
