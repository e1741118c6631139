import type { IntervalMethod, OutlookFigure, OutlookWeek } from '@stormhour/shared';
import { DAY_MS, HOUR_MS } from '../../radar/engine/local-time.js';
import { binomialInterval } from './intervals.js';
import type { EventBlocks } from './neighbourhood.js';
import type { ScanHours } from './scan-hours.js';
import { type BetaPrior, fitBetaPrior, shrunkRate } from './shrinkage.js';
import { weekWindows } from './weekly.js';

export interface OutlookBlockInput {
  /** Share of the block inside coverage, 0–1. */
  coverage: number;
  /** The area onsets are counted over (the block, or the block buffered by the radius), km². */
  countingAreaKm2: number;
}

export interface OutlookInput {
  blocks: OutlookBlockInput[];
  /** Event times (onset or cell scan, UTC ms) and the blocks each counts for. */
  eventTimes: Float64Array;
  eventBlocks: EventBlocks;
  /** Scans per local day and hour the counted source could have seen; availability is their share of those expected. */
  scanHours: ScanHours;
  /** Local day numbers (days since 1970-01-01) of the days asked about, ascending. */
  days: Int32Array;
  utcOffsetMinutes: number;
  intervalMin: number;
  binHours: number;
  afternoon: { fromHour: number; toHour: number };
  minAvailability: number;
  minBlockCoverage: number;
  interval: IntervalMethod;
  level: number;
  /** False when only rates are wanted (the all-days climatology beside a regime): no intervals. */
  withIntervals?: boolean;
  /** True to also return, day by day, whether each block saw a storm start in the afternoon. */
  withDaily?: boolean;
}

/** Day by day (in the order of `days`): what the scorecard checks issued chances against. */
export interface AfternoonDaily {
  /** 1 where the afternoon had enough radar availability to count. */
  counted: Uint8Array;
  /** Index b·days + p: 1 where block b (covered enough) saw a storm start in day p's counted afternoon. */
  storm: Uint8Array;
  /** Per block: covered enough to count at all. */
  blockCounted: boolean[];
}

export interface BlockResult {
  hasData: boolean;
  bins: OutlookFigure[];
  afternoon: OutlookFigure;
  week: OutlookWeek;
  peakBin: number | null;
}

export interface OutlookResult {
  blocks: BlockResult[];
  priors: { bins: BetaPrior[]; afternoon: BetaPrior };
  /** Only when asked for (`withDaily`). */
  afternoonDaily?: AfternoonDaily;
}

const NO_DATA: OutlookFigure = {
  n: null,
  x: null,
  rate: null,
  lower: null,
  upper: null,
  shrunk: null,
  per100Km2: null,
};

const hourMask = (from: number, to: number) => {
  let m = 0;
  for (let h = from; h < to; h++) m |= 1 << h;
  return m >>> 0;
};

/** Where an instant falls among the days asked about: a day position (−1 outside them) and local hour. */
function dayLocator(days: Int32Array, utcOffsetMinutes: number) {
  const offsetMs = utcOffsetMinutes * 60_000;
  const firstDay = days.length ? days[0] : 0;
  const span = days.length ? days[days.length - 1] - firstDay + 1 : 0;
  const position = new Int32Array(span).fill(-1);
  for (let p = 0; p < days.length; p++) position[days[p] - firstDay] = p;
  // The hour is handed back through a field rather than a new object: this runs for every event.
  const where = {
    hour: 0,
    position(t: number): number {
      const local = t + offsetMs;
      const day = Math.floor(local / DAY_MS);
      const i = day - firstDay;
      if (i < 0 || i >= span) return -1;
      where.hour = Math.floor((local - day * DAY_MS) / HOUR_MS);
      return position[i];
    },
  };
  return where;
}

/**
 * Which (day, bin) pairs and which days' afternoons count: those whose scans present reach the
 * availability threshold of those expected (DESIGN §3.3).
 */
function countedDays(input: OutlookInput) {
  const { days, binHours } = input;
  const bins = 24 / binHours;
  const dayCount = days.length;
  const scansByHour = new Int32Array(dayCount * 24);
  const { scanHours } = input;
  for (let p = 0; p < dayCount; p++) {
    const d = days[p] - scanHours.firstDay;
    if (d >= 0 && d < scanHours.dayCount)
      scansByHour.set(scanHours.counts.subarray(d * 24, d * 24 + 24), p * 24);
  }
  const perHour = 60 / input.intervalMin;
  const available = (p: number, from: number, to: number) => {
    let present = 0;
    for (let h = from; h < to; h++) present += scansByHour[p * 24 + h];
    return Math.min(1, present / ((to - from) * perHour)) >= input.minAvailability;
  };
  const binCounted = new Uint8Array(dayCount * bins);
  const daysPerBin = new Int32Array(bins);
  const afternoonCounted = new Uint8Array(dayCount);
  let afternoonDays = 0;
  const { fromHour, toHour } = input.afternoon;
  for (let p = 0; p < dayCount; p++) {
    for (let k = 0; k < bins; k++)
      if (available(p, k * binHours, (k + 1) * binHours)) {
        binCounted[p * bins + k] = 1;
        daysPerBin[k]++;
      }
    if (available(p, fromHour, toHour)) {
      afternoonCounted[p] = 1;
      afternoonDays++;
    }
  }
  return { binCounted, daysPerBin, afternoonCounted, afternoonDays };
}

/**
 * Only the afternoon rate x/n of each block (null where the block has no data or no afternoon
 * counted): what an all-days climatology beside a regime's outlook needs, counted exactly as
 * computeOutlook counts it but without the bins, weeks, priors and intervals.
 */
export function afternoonRates(input: Omit<OutlookInput, 'withIntervals' | 'withDaily'>): (number | null)[] {
  const dayCount = input.days.length;
  const { afternoonCounted, afternoonDays } = countedDays(input);
  const { fromHour, toHour } = input.afternoon;
  const at = dayLocator(input.days, input.utcOffsetMinutes);
  const seen = new Uint8Array(input.blocks.length * dayCount);
  const x = new Int32Array(input.blocks.length);
  const { offsets, blockIndex } = input.eventBlocks;
  for (let e = 0; e < input.eventTimes.length; e++) {
    const p = at.position(input.eventTimes[e]);
    if (p < 0 || afternoonCounted[p] === 0 || at.hour < fromHour || at.hour >= toHour) continue;
    for (let j = offsets[e]; j < offsets[e + 1]; j++) {
      const cell = blockIndex[j] * dayCount + p;
      if (seen[cell] === 0) {
        seen[cell] = 1;
        x[blockIndex[j]]++;
      }
    }
  }
  return input.blocks.map((block, b) =>
    block.coverage >= input.minBlockCoverage && afternoonDays > 0 ? x[b] / afternoonDays : null,
  );
}

/**
 * Counts, for every block and local time-of-day bin, the days counted (n: days asked about whose
 * availability in the bin reaches the threshold, for blocks covered enough; otherwise null, never 0)
 * and the days among them with at least one event in the block (x); then rates, intervals, the
 * shrunk estimates, the afternoon and weekly figures and the peak bin (DESIGN §3.3, §3.5).
 * Everything is counted in one pass over typed arrays.
 */
export function computeOutlook(input: OutlookInput): OutlookResult {
  const { days, binHours, interval, level } = input;
  const bins = 24 / binHours;
  const blocks = input.blocks.length;
  const dayCount = days.length;
  const at = dayLocator(days, input.utcOffsetMinutes);
  const { binCounted, daysPerBin, afternoonCounted, afternoonDays } = countedDays(input);
  const { fromHour, toHour } = input.afternoon;

  // Events: which hours of which day saw one in each block, and how many on counted days.
  const seen = new Uint32Array(blocks * dayCount);
  const eventsPerBin = new Float64Array(blocks * bins);
  const eventsAfternoon = new Float64Array(blocks);
  const { offsets, blockIndex } = input.eventBlocks;
  for (let e = 0; e < input.eventTimes.length; e++) {
    const p = at.position(input.eventTimes[e]);
    if (p < 0) continue;
    const h = at.hour;
    const k = Math.floor(h / binHours);
    const inBin = binCounted[p * bins + k] === 1;
    const inAfternoon = h >= fromHour && h < toHour && afternoonCounted[p] === 1;
    for (let j = offsets[e]; j < offsets[e + 1]; j++) {
      const b = blockIndex[j];
      seen[b * dayCount + p] |= 1 << h;
      if (inBin) eventsPerBin[b * bins + k]++;
      if (inAfternoon) eventsAfternoon[b]++;
    }
  }
  const binMasks = Array.from({ length: bins }, (_, k) => hourMask(k * binHours, (k + 1) * binHours));
  const afternoonMask = hourMask(fromHour, toHour);

  const hasData = input.blocks.map((b) => b.coverage >= input.minBlockCoverage);
  const x = new Float64Array(blocks * bins);
  const n = new Float64Array(blocks * bins);
  const xAfternoon = new Float64Array(blocks);
  const nAfternoon = new Float64Array(blocks);
  const weeks: OutlookWeek[] = [];
  const hits = new Uint8Array(afternoonDays);
  for (let b = 0; b < blocks; b++) {
    if (!hasData[b]) {
      weeks.push({ windows: 0, hits: 0, rate: null, lower: null, upper: null });
      continue;
    }
    for (let k = 0; k < bins; k++) n[b * bins + k] = daysPerBin[k];
    nAfternoon[b] = afternoonDays;
    let c = 0;
    for (let p = 0; p < dayCount; p++) {
      const mask = seen[b * dayCount + p];
      if (mask !== 0)
        for (let k = 0; k < bins; k++) if (mask & binMasks[k] && binCounted[p * bins + k]) x[b * bins + k]++;
      if (afternoonCounted[p]) {
        const hit = mask & afternoonMask ? 1 : 0;
        hits[c++] = hit;
        xAfternoon[b] += hit;
      }
    }
    weeks.push(weekFigure(hits, interval, level, input.withIntervals !== false));
  }

  const binPriors: BetaPrior[] = [];
  const column = (k: number, of: Float64Array) => {
    const out = new Float64Array(blocks);
    for (let b = 0; b < blocks; b++) out[b] = of[b * bins + k];
    return out;
  };
  for (let k = 0; k < bins; k++) binPriors.push(fitBetaPrior(column(k, x), column(k, n)));
  const afternoonPrior = fitBetaPrior(xAfternoon, nAfternoon);

  const figure = (xb: number, nb: number, events: number, area: number, prior: BetaPrior): OutlookFigure => {
    const ci = input.withIntervals === false ? null : binomialInterval(interval, xb, nb, level);
    return {
      n: nb,
      x: xb,
      rate: nb > 0 ? xb / nb : null,
      lower: ci?.lower ?? null,
      upper: ci?.upper ?? null,
      shrunk: shrunkRate(xb, nb, prior),
      per100Km2: nb > 0 && area > 0 ? events / nb / (area / 100) : null,
    };
  };

  const results: BlockResult[] = input.blocks.map((block, b) => {
    if (!hasData[b])
      return {
        hasData: false,
        bins: Array(bins).fill(NO_DATA),
        afternoon: NO_DATA,
        week: weeks[b],
        peakBin: null,
      };
    const figures = binPriors.map((prior, k) =>
      figure(x[b * bins + k], n[b * bins + k], eventsPerBin[b * bins + k], block.countingAreaKm2, prior),
    );
    let peakBin: number | null = null;
    figures.forEach((f, k) => {
      if (f.shrunk !== null && (peakBin === null || f.shrunk > (figures[peakBin].shrunk as number)))
        peakBin = k;
    });
    return {
      hasData: true,
      bins: figures,
      afternoon: figure(
        xAfternoon[b],
        nAfternoon[b],
        eventsAfternoon[b],
        block.countingAreaKm2,
        afternoonPrior,
      ),
      week: weeks[b],
      peakBin,
    };
  });
  const result: OutlookResult = { blocks: results, priors: { bins: binPriors, afternoon: afternoonPrior } };
  if (input.withDaily) {
    const storm = new Uint8Array(blocks * dayCount);
    for (let b = 0; b < blocks; b++) {
      if (!hasData[b]) continue;
      for (let p = 0; p < dayCount; p++)
        if (afternoonCounted[p] && seen[b * dayCount + p] & afternoonMask) storm[b * dayCount + p] = 1;
    }
    result.afternoonDaily = { counted: afternoonCounted, storm, blockCounted: hasData };
  }
  return result;
}

/**
 * Windows overlap, so they are not independent trials: the interval is drawn as if from the
 * ⌊days / 7⌋ separate weeks the record holds, at the windows' hit rate (rounded to whole weeks).
 */
function weekFigure(
  hitByDay: Uint8Array,
  method: IntervalMethod,
  level: number,
  withInterval: boolean,
): OutlookWeek {
  const { windows, hits } = weekWindows(hitByDay);
  if (windows === 0) return { windows, hits, rate: null, lower: null, upper: null };
  const rate = hits / windows;
  if (!withInterval) return { windows, hits, rate, lower: null, upper: null };
  const weeks = Math.floor(hitByDay.length / 7);
  const ci = binomialInterval(method, Math.round(rate * weeks), weeks, level);
  return { windows, hits, rate, lower: ci?.lower ?? null, upper: ci?.upper ?? null };
}
