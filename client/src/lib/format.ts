const dateTime = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

/** A timestamp as staff read it, in the browser's time zone; "—" when there is none. */
export function formatDateTime(iso: string | null | undefined, none = '—'): string {
  if (!iso) return none;
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : dateTime.format(date);
}
