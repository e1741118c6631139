/** Local time of a site: UTC plus its offset in minutes (which need not be whole hours). */

const HOUR_MS = 3_600_000;

/** Hour of the local day, 0 ≤ h < 24 (fractional). */
export function localHour(utcMs: number, utcOffsetMinutes: number): number {
  const h = (utcMs / HOUR_MS + utcOffsetMinutes / 60) % 24;
  return h < 0 ? h + 24 : h;
}

/** The local date, YYYY-MM-DD. */
export function localDate(utcMs: number, utcOffsetMinutes: number): string {
  return new Date(utcMs + utcOffsetMinutes * 60_000).toISOString().slice(0, 10);
}

/** UTC instant of local midnight starting a local date. */
export function localMidnightUtc(date: string, utcOffsetMinutes: number): number {
  return Date.parse(`${date}T00:00:00Z`) - utcOffsetMinutes * 60_000;
}
