import { OUTAGE_PARAMS, SEASON_START_LOCAL, SITE, UTC_OFFSET_MIN } from './config.js';
import { Rng } from './prng.js';

export const MINUTE_MS = 60_000;
export const SCAN_MS = SITE.scanIntervalMin * MINUTE_MS;
export const SCANS_PER_DAY = (24 * 60) / SITE.scanIntervalMin;

/** UTC milliseconds of local midnight at the start of a local date (YYYY-MM-DD). */
export function localMidnightUtcMs(localDate: string): number {
  const [y, m, d] = localDate.split('-').map(Number);
  return Date.UTC(y, m - 1, d) - UTC_OFFSET_MIN * MINUTE_MS;
}

export function addDays(localDate: string, days: number): string {
  const [y, m, d] = localDate.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

/** ISO 8601 UTC with seconds and "Z", e.g. 2025-07-14T06:00:00Z. */
export function isoUtc(ms: number): string {
  return `${new Date(ms).toISOString().slice(0, 19)}Z`;
}

/** Compact stamp for file names, e.g. 20250714T0600Z. */
export function fileStamp(ms: number): string {
  const s = new Date(ms).toISOString();
  return `${s.slice(0, 4)}${s.slice(5, 7)}${s.slice(8, 10)}T${s.slice(11, 13)}${s.slice(14, 16)}Z`;
}

export function localDateOf(ms: number): string {
  return new Date(ms + UTC_OFFSET_MIN * MINUTE_MS).toISOString().slice(0, 10);
}

/** Local clock time in hours [0, 24). */
export function localHourOf(ms: number): number {
  const t = (ms + UTC_OFFSET_MIN * MINUTE_MS) % 86_400_000;
  return (t < 0 ? t + 86_400_000 : t) / 3_600_000;
}

export interface SeasonClock {
  dates: string[];
  startMs: number;
  nScans: number;
  timeOf(k: number): number;
}

export function seasonClock(days: number, startLocal: string = SEASON_START_LOCAL): SeasonClock {
  const dates = Array.from({ length: days }, (_, d) => addDays(startLocal, d));
  const startMs = localMidnightUtcMs(startLocal);
  return { dates, startMs, nScans: days * SCANS_PER_DAY, timeOf: (k) => startMs + k * SCAN_MS };
}

export interface Outage {
  firstMissingUtc: string;
  lastMissingUtc: string;
  missingScans: number;
  kind: 'single scan' | 'short' | 'multi-hour';
}

/**
 * Which nominal scans exist. Missing: isolated single scans, a few short outages (12–60 min), and
 * one multi-hour gap over a late morning and afternoon.
 */
export function generateAvailability(
  seed: number,
  clock: SeasonClock,
): { present: Uint8Array; outages: Outage[] } {
  const P = OUTAGE_PARAMS;
  const r = new Rng(seed, 'outages');
  const n = clock.nScans;
  const present = new Uint8Array(n).fill(1);
  for (let k = 0; k < n; k++) if (r.chance(P.isolatedMissingChance)) present[k] = 0;
  const days = clock.dates.length;
  const nShort = r.poisson(P.shortOutagesPerDay * days);
  for (let s = 0; s < nShort; s++) {
    const k0 = r.int(0, n - 1);
    const len = r.int(P.shortOutageScans[0], P.shortOutageScans[1]);
    for (let k = k0; k < Math.min(n, k0 + len); k++) present[k] = 0;
  }
  const longDay = Math.min(days - 1, Math.floor(days * P.longOutageDayFraction));
  const startHour = r.range(P.longOutageStartLocalHour[0], P.longOutageStartLocalHour[1]);
  const hours = r.range(P.longOutageHours[0], P.longOutageHours[1]);
  const k0 = longDay * SCANS_PER_DAY + Math.round((startHour * 60) / SITE.scanIntervalMin);
  const k1 = Math.min(n, k0 + Math.round((hours * 60) / SITE.scanIntervalMin));
  for (let k = k0; k < k1; k++) present[k] = 0;

  const outages: Outage[] = [];
  let k = 0;
  while (k < n) {
    if (present[k]) {
      k++;
      continue;
    }
    let j = k;
    while (j + 1 < n && !present[j + 1]) j++;
    const len = j - k + 1;
    outages.push({
      firstMissingUtc: isoUtc(clock.timeOf(k)),
      lastMissingUtc: isoUtc(clock.timeOf(j)),
      missingScans: len,
      kind: len === 1 ? 'single scan' : len * SITE.scanIntervalMin >= 180 ? 'multi-hour' : 'short',
    });
    k = j + 1;
  }
  return { present, outages };
}
