/*
 * Radar times are stored in UTC; people read them in the site's local time, a fixed offset from UTC
 * (SiteView.utcOffsetMinutes). Shifting the instant and formatting it as UTC gives that wall time
 * without depending on the browser's own time zone.
 */

const MINUTE_MS = 60_000;

const wallTime = new Intl.DateTimeFormat('en-GB', {
  timeZone: 'UTC',
  day: '2-digit',
  month: 'short',
  year: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
  hourCycle: 'h23',
});

const clockTime = new Intl.DateTimeFormat('en-GB', {
  timeZone: 'UTC',
  hour: '2-digit',
  minute: '2-digit',
  hourCycle: 'h23',
});

function pad(n: number): string {
  return String(n).padStart(2, '0');
}

/** "UTC+06:00", "UTC-03:30", "UTC+00:00". */
export function formatUtcOffset(offsetMinutes: number): string {
  const sign = offsetMinutes < 0 ? '-' : '+';
  const abs = Math.abs(offsetMinutes);
  return `UTC${sign}${pad(Math.floor(abs / 60))}:${pad(abs % 60)}`;
}

/** The offset as the cell-table mapping writes it: "UTC" for zero, else "+06:00". */
export function offsetForMapping(offsetMinutes: number): string {
  return offsetMinutes === 0 ? 'UTC' : formatUtcOffset(offsetMinutes).slice(3);
}

function shifted(iso: string | Date, offsetMinutes: number): Date {
  const ms = (iso instanceof Date ? iso : new Date(iso)).getTime();
  return new Date(ms + offsetMinutes * MINUTE_MS);
}

/** "14 Jul 2026, 15:42" in the site's local time. */
export function formatSiteTime(iso: string | Date, offsetMinutes: number): string {
  return wallTime.format(shifted(iso, offsetMinutes));
}

/** "15:42" in the site's local time. */
export function formatSiteClock(iso: string | Date, offsetMinutes: number): string {
  return clockTime.format(shifted(iso, offsetMinutes));
}

/** The UTC instant (ISO 8601) at which the local day "YYYY-MM-DD" begins at this offset. */
export function localDayStartIso(day: string, offsetMinutes: number): string {
  const midnightUtc = Date.parse(`${day}T00:00:00Z`);
  return new Date(midnightUtc - offsetMinutes * MINUTE_MS).toISOString();
}

/** The UTC instant at which the local day "YYYY-MM-DD" ends (the next local midnight). */
export function localDayEndIso(day: string, offsetMinutes: number): string {
  const midnightUtc = Date.parse(`${day}T00:00:00Z`) + 24 * 60 * MINUTE_MS;
  return new Date(midnightUtc - offsetMinutes * MINUTE_MS).toISOString();
}
