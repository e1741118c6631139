import {
  CROP_CALENDAR_COLUMNS,
  type CropStageEntry,
  CropStageEntry as CropStageEntrySchema,
  type ErrorDetail,
  RegionCode,
} from '@stormhour/shared';
import Papa from 'papaparse';

export interface CalendarCsvRow {
  /** Line of the file the row is on (the header is row 1). */
  row: number;
  districtCode: string;
  entry: CropStageEntry;
}

export type CalendarCsvCheck =
  | { ok: true; rows: CalendarCsvRow[] }
  | { ok: false; fileProblem?: string; problems: ErrorDetail[] };

const MAX_PROBLEMS = 200;

/**
 * Reads a crop calendar CSV (columns district_code, crop, stage, from_week, to_week, in any order) and
 * checks every row. Any problem means no rows at all, so a caller can never store part of a file.
 * Districts are not looked up here: the caller names unknown codes by row.
 */
export function checkCropCalendarCsv(text: string): CalendarCsvCheck {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    // Blank lines are skipped below, so the row numbers stay the file's line numbers.
    skipEmptyLines: false,
    transformHeader: (h) => h.trim().toLowerCase(),
  });
  const headers = parsed.meta.fields ?? [];
  const missing = CROP_CALENDAR_COLUMNS.filter((c) => !headers.includes(c));
  if (missing.length)
    return {
      ok: false,
      fileProblem: `The file lacks the column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}; a crop calendar needs ${CROP_CALENDAR_COLUMNS.join(', ')}.`,
      problems: missing.map((c) => ({ where: `column "${c}"`, problem: 'missing' })),
    };

  const problems: ErrorDetail[] = [];
  const problem = (where: string, text: string) => {
    if (problems.length < MAX_PROBLEMS) problems.push({ where, problem: text });
  };
  const rows: CalendarCsvRow[] = [];
  const seen = new Map<string, number>();
  parsed.data.forEach((record, i) => {
    const row = i + 2;
    const cell = (column: string) => (record[column] ?? '').trim();
    if (CROP_CALENDAR_COLUMNS.every((c) => cell(c) === '')) return;
    const where = (column: string) => `row ${row}, column "${column}"`;
    let ok = true;

    const districtCode = cell('district_code');
    const code = RegionCode.safeParse(districtCode);
    if (!code.success) {
      problem(
        where('district_code'),
        districtCode ? `"${districtCode}": ${code.error.issues[0].message}` : 'is empty',
      );
      ok = false;
    }
    const week = (column: 'from_week' | 'to_week'): number => {
      const raw = cell(column);
      if (raw === '') {
        problem(where(column), 'is empty');
        ok = false;
      } else if (!/^\d+$/.test(raw)) {
        problem(where(column), `"${raw}" is not a week number; give an ISO week from 1 to 53`);
        ok = false;
      }
      return Number(raw);
    };
    const candidate = {
      crop: cell('crop'),
      stage: cell('stage'),
      fromWeek: week('from_week'),
      toWeek: week('to_week'),
    };
    const entry = CropStageEntrySchema.safeParse(candidate);
    if (!entry.success) {
      const column = { crop: 'crop', stage: 'stage', fromWeek: 'from_week', toWeek: 'to_week' };
      for (const issue of entry.error.issues) {
        const col = column[issue.path[0] as keyof typeof column];
        // An empty or non-numeric week has been named already.
        if ((col === 'from_week' || col === 'to_week') && !/^\d+$/.test(cell(col))) continue;
        problem(where(col), cell(col) === '' ? 'is empty' : issue.message);
      }
      ok = false;
    }
    if (!ok || !entry.success) return;
    const key = `${districtCode}|${entry.data.crop}|${entry.data.stage}|${entry.data.fromWeek}|${entry.data.toWeek}`;
    const first = seen.get(key);
    if (first !== undefined) {
      problem(`row ${row}`, `repeats row ${first}`);
      return;
    }
    seen.set(key, row);
    rows.push({ row, districtCode, entry: entry.data });
  });
  if (problems.length) return { ok: false, problems };
  if (rows.length === 0)
    return { ok: false, fileProblem: 'The file has a header but no rows.', problems: [] };
  return { ok: true, rows };
}
