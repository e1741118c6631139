import type { CropStageEntry } from '../advice.js';

const DAY_MS = 86_400_000;
const DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** A calendar date 'YYYY-MM-DD' as UTC midnight, or null when it is not a real date. */
export function parseDay(text: string): Date | null {
  const m = DATE.exec(text);
  if (!m) return null;
  const date = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  // Date.UTC rolls 31 April over into May; a real date survives the round trip.
  return date.toISOString().slice(0, 10) === text ? date : null;
}

export function formatDay(date: Date): string {
  return date.toISOString().slice(0, 10);
}

export function addDays(day: string, days: number): string {
  const date = parseDay(day);
  if (!date) throw new Error(`"${day}" is not a date such as 2025-08-04`);
  return formatDay(new Date(date.getTime() + days * DAY_MS));
}

/**
 * ISO 8601 week-numbering year and week of a date: weeks start on Monday and week 1 is the week
 * holding the year's first Thursday, so the Thursday of a date's week decides its year.
 */
export function isoWeek(day: string): { year: number; week: number } {
  const date = parseDay(day);
  if (!date) throw new Error(`"${day}" is not a date such as 2025-08-04`);
  const weekday = (date.getUTCDay() + 6) % 7; // Monday 0 … Sunday 6
  const thursday = new Date(date.getTime() + (3 - weekday) * DAY_MS);
  const year = thursday.getUTCFullYear();
  const firstOfYear = Date.UTC(year, 0, 1);
  const week = Math.floor((thursday.getTime() - firstOfYear) / DAY_MS / 7) + 1;
  return { year, week };
}

/** The Monday that starts the ISO week holding a date. */
export function mondayOf(day: string): string {
  const date = parseDay(day);
  if (!date) throw new Error(`"${day}" is not a date such as 2025-08-04`);
  const weekday = (date.getUTCDay() + 6) % 7;
  return formatDay(new Date(date.getTime() - weekday * DAY_MS));
}

/** Whether a stage's week range holds an ISO week; a range that starts after it ends wraps the year. */
export function rangeHoldsWeek(fromWeek: number, toWeek: number, week: number): boolean {
  return fromWeek <= toWeek ? week >= fromWeek && week <= toWeek : week >= fromWeek || week <= toWeek;
}

/**
 * The crops and stages of a calendar during the seven days from weekStart. A week that does not start
 * on Monday touches two ISO weeks; a stage in either counts. Sorted by crop, then by first week.
 */
export function stagesInWeek(
  calendar: readonly CropStageEntry[],
  weekStart: string,
): { crop: string; stage: string }[] {
  const weeks = new Set([isoWeek(weekStart).week, isoWeek(addDays(weekStart, 6)).week]);
  const found = calendar
    .filter((e) => [...weeks].some((w) => rangeHoldsWeek(e.fromWeek, e.toWeek, w)))
    .sort((a, b) => a.crop.localeCompare(b.crop) || a.fromWeek - b.fromWeek);
  const seen = new Set<string>();
  const out: { crop: string; stage: string }[] = [];
  for (const e of found) {
    const key = `${e.crop}|${e.stage}`;
    if (seen.has(key)) continue;
    seen.add(key);
    out.push({ crop: e.crop, stage: e.stage });
  }
  return out;
}
