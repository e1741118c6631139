import { CropCalendarRequest, type CropStageEntry } from '@stormhour/shared';
import { fieldErrorsFromZod } from '../../lib/fieldErrors';

/** One editable row of the calendar table; weeks stay text until saved so a half-typed value is kept. */
export interface CalendarRow {
  key: string;
  crop: string;
  stage: string;
  fromWeek: string;
  toWeek: string;
}

let nextKey = 1;
export function newRow(values: Partial<Omit<CalendarRow, 'key'>> = {}): CalendarRow {
  return { key: `row-${nextKey++}`, crop: '', stage: '', fromWeek: '', toWeek: '', ...values };
}

export function rowsFromEntries(entries: readonly CropStageEntry[]): CalendarRow[] {
  return entries.map((e) => newRow({ ...e, fromWeek: String(e.fromWeek), toWeek: String(e.toWeek) }));
}

const week = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));

/**
 * Checks the rows with the server's own schema. Errors are keyed "row key.field" so each shows beside
 * its input; a week left empty reads "Give an ISO week number from 1 to 53".
 */
export function checkRows(
  rows: readonly CalendarRow[],
): { ok: true; request: CropCalendarRequest } | { ok: false; errors: Record<string, string> } {
  const parsed = CropCalendarRequest.safeParse({
    entries: rows.map((r) => ({
      crop: r.crop,
      stage: r.stage,
      fromWeek: week(r.fromWeek),
      toWeek: week(r.toWeek),
    })),
  });
  if (parsed.success) return { ok: true, request: parsed.data };
  const byIndex = fieldErrorsFromZod(parsed.error);
  const errors: Record<string, string> = {};
  for (const [path, message] of Object.entries(byIndex)) {
    const [, index, field] = path.split('.');
    const row = rows[Number(index)];
    if (row) errors[field ? `${row.key}.${field}` : `${row.key}.crop`] ??= message;
  }
  return { ok: false, errors };
}

/** The week spans to draw for a stage: one, or two when it wraps over the new year. */
export function weekSpans(fromWeek: number, toWeek: number, lastWeek = 53): [number, number][] {
  return fromWeek <= toWeek
    ? [[fromWeek, toWeek]]
    : [
        [fromWeek, lastWeek],
        [1, toWeek],
      ];
}
