import { localDay, localHour } from '../../radar/engine/local-time.js';

/**
 * Scans present in each local hour of consecutive local days: `counts[(day - firstDay) * 24 + hour]`.
 * The database keeps these per counted source (table scan_hours); the outlook judges availability
 * against them instead of reading every scan.
 */
export interface ScanHours {
  /** Local day number (days since 1970-01-01) of the first day held; meaningless when dayCount is 0. */
  firstDay: number;
  dayCount: number;
  counts: Int32Array;
}

export const NO_SCANS: ScanHours = { firstDay: 0, dayCount: 0, counts: new Int32Array(0) };

/**
 * Counts scan times (UTC ms) per local day and hour, a time given more than once counting once.
 * The reference the stored summary is checked against, and how hand-made records are built in specs.
 */
export function countScanHours(scanTimes: ArrayLike<number>, utcOffsetMinutes: number): ScanHours {
  const distinct = Float64Array.from(scanTimes).sort();
  if (distinct.length === 0) return NO_SCANS;
  const firstDay = localDay(distinct[0], utcOffsetMinutes);
  const dayCount = localDay(distinct[distinct.length - 1], utcOffsetMinutes) - firstDay + 1;
  const counts = new Int32Array(dayCount * 24);
  for (let i = 0; i < distinct.length; i++) {
    if (i > 0 && distinct[i] === distinct[i - 1]) continue;
    const t = distinct[i];
    counts[(localDay(t, utcOffsetMinutes) - firstDay) * 24 + localHour(t, utcOffsetMinutes)]++;
  }
  return { firstDay, dayCount, counts };
}

/** Builds the packed form from rows of (local day, 24 counts), ascending by day; days not given hold none. */
export function scanHoursFromDays(days: ArrayLike<number>, hours: ArrayLike<number>[]): ScanHours {
  if (days.length === 0) return NO_SCANS;
  const firstDay = days[0];
  const dayCount = days[days.length - 1] - firstDay + 1;
  const counts = new Int32Array(dayCount * 24);
  for (let i = 0; i < days.length; i++) {
    const row = hours[i];
    const at = (days[i] - firstDay) * 24;
    for (let h = 0; h < 24; h++) counts[at + h] = row[h];
  }
  return { firstDay, dayCount, counts };
}

/** Local days that hold at least one scan, first and last; null when there are none. */
export function scannedDays(s: ScanHours): { first: number; last: number } | null {
  let first = -1;
  let last = -1;
  for (let d = 0; d < s.dayCount; d++) {
    let any = false;
    for (let h = 0; h < 24 && !any; h++) any = s.counts[d * 24 + h] > 0;
    if (any) {
      if (first < 0) first = d;
      last = d;
    }
  }
  return first < 0 ? null : { first: s.firstDay + first, last: s.firstDay + last };
}
