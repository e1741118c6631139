import { addDays } from '@stormhour/shared';

/**
 * Local wall-clock times of a bulletin's district ("2025-09-30T15:30") as instants, and whether they fall
 * in the bulletin's week (Monday 00:00 to the next Monday 00:00, local).
 */
const LOCAL = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/;

export function localToUtc(local: string, utcOffsetMinutes: number): Date | null {
  const m = LOCAL.exec(local);
  if (!m) return null;
  const [y, mo, d, h, mi] = m.slice(1).map(Number);
  if (h > 23 || mi > 59) return null;
  const asUtc = Date.UTC(y, mo - 1, d, h, mi);
  // Date.UTC rolls 31 September over into October; a real date survives the round trip.
  if (new Date(asUtc).toISOString().slice(0, 16) !== local) return null;
  return new Date(asUtc - utcOffsetMinutes * 60_000);
}

export function weekBounds(weekStart: string, utcOffsetMinutes: number): { from: Date; to: Date } {
  return {
    from: localToUtc(`${weekStart}T00:00`, utcOffsetMinutes) as Date,
    to: localToUtc(`${addDays(weekStart, 7)}T00:00`, utcOffsetMinutes) as Date,
  };
}

/** Today's date where the district is, YYYY-MM-DD. */
export function localToday(now: Date, utcOffsetMinutes: number): string {
  return new Date(now.getTime() + utcOffsetMinutes * 60_000).toISOString().slice(0, 10);
}
