import { addDays, type BulletinState, isoWeek, mondayOf, parseDay } from '@stormhour/shared';

type TagType = 'gray' | 'blue' | 'purple' | 'teal' | 'green' | 'red' | 'magenta' | 'warm-gray';

/** Carbon tag colours for the states, so a list reads at a glance. */
export const STATE_TAG: Record<BulletinState, TagType> = {
  draft: 'gray',
  in_review: 'blue',
  returned: 'magenta',
  approved: 'teal',
  sent: 'green',
  withdrawn: 'red',
};

/** "ISO week 27 of 2025: Mon 30 Jun – Sun 6 Jul" for a week's Monday, so the writer sees the week chosen. */
export function weekLabel(weekStart: string): string {
  const { year, week } = isoWeek(weekStart);
  const fmt = new Intl.DateTimeFormat('en-GB', {
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    timeZone: 'UTC',
  });
  const from = parseDay(weekStart);
  const to = parseDay(addDays(weekStart, 6));
  if (!from || !to) return weekStart;
  return `ISO week ${week} of ${year}: ${fmt.format(from)} – ${fmt.format(to)}`;
}

/** The Monday of the week holding a picked day, or null for text that is not a date. */
export function weekStartOf(day: string): string | null {
  return parseDay(day) ? mondayOf(day) : null;
}

/** The next week's Monday from a given day (a bulletin is usually drafted for the coming week). */
export function nextWeekStart(today: string): string {
  return addDays(mondayOf(today), 7);
}

/** Today's date in the browser's time zone, YYYY-MM-DD. */
export function localToday(now = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}
