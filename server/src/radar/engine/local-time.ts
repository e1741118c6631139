/** Local days and hours of a site (local time = UTC + offset, whole minutes, e.g. +05:45 = 345). */
export const DAY_MS = 86_400_000;
export const HOUR_MS = 3_600_000;

/** Days since 1970-01-01 of the local date t falls on. */
export function localDay(t: number, utcOffsetMinutes: number): number {
  return Math.floor((t + utcOffsetMinutes * 60_000) / DAY_MS);
}

/** The local hour of the day, 0–23. */
export function localHour(t: number, utcOffsetMinutes: number): number {
  const local = t + utcOffsetMinutes * 60_000;
  return Math.floor((local - Math.floor(local / DAY_MS) * DAY_MS) / HOUR_MS);
}

export function dayOfDate(date: string): number {
  return Date.parse(`${date}T00:00:00Z`) / DAY_MS;
}

export function dateOfDay(day: number): string {
  return new Date(day * DAY_MS).toISOString().slice(0, 10);
}

/** The UTC instant local midnight of that day begins. */
export function localMidnightUtc(day: number, utcOffsetMinutes: number): number {
  return day * DAY_MS - utcOffsetMinutes * 60_000;
}

/** Hour of the local day with its fraction, 0 ≤ h < 24. */
export function localHourOfDay(t: number, utcOffsetMinutes: number): number {
  const local = t + utcOffsetMinutes * 60_000;
  return (local - Math.floor(local / DAY_MS) * DAY_MS) / HOUR_MS;
}

/** The local date t falls on, YYYY-MM-DD. */
export function localDate(t: number, utcOffsetMinutes: number): string {
  return dateOfDay(localDay(t, utcOffsetMinutes));
}

/** The UTC instant a local date (YYYY-MM-DD) begins. */
export function localMidnightOfDate(date: string, utcOffsetMinutes: number): number {
  return localMidnightUtc(dayOfDate(date), utcOffsetMinutes);
}
