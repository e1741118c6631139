import {
  ANOMALY_CSV_FIELDS,
  ANOMALY_CSV_SYNONYMS,
  ANOMALY_VARIABLES,
  type AnomalyCsvDateFormat,
  type AnomalyCsvField,
  AnomalyCsvMapping,
  type AnomalyVariable,
} from '@stormhour/shared';
import { guessColumnsFor } from './cellTableMapping';
import type { CsvPreview } from './csvPreview';

/** What each of our anomaly-CSV fields means, for the mapping step. */
export const ANOMALY_FIELD_LABELS: Record<AnomalyCsvField, string> = {
  date: 'Date of the day',
  lat: 'Latitude of the grid point (°)',
  lon: 'Longitude of the grid point (°)',
  variable: 'Variable (q, u or v)',
  level_hpa: 'Pressure level (hPa)',
  value: 'Value',
  units: 'Units of the value',
};

export const DATE_FORMAT_EXAMPLES: Record<AnomalyCsvDateFormat, string> = {
  'YYYY-MM-DD': '2025-06-01',
  YYYYMMDD: '20250601',
  'DD/MM/YYYY': '01/06/2025',
  'MM/DD/YYYY': '06/01/2025',
};

export interface AnomalyMappingDraft {
  columns: Partial<Record<AnomalyCsvField, string>>;
  /** The file's name for each of q, u, v; empty when the file uses ours. */
  variableNames: Record<AnomalyVariable, string>;
  /** Typed text, so a half-written number can be shown and named as wrong. */
  levelHpa: string;
  dateFormat: AnomalyCsvDateFormat;
}

/** The date format the first dates fit; for d/m/y against m/d/y, a first part above 12 settles it. */
export function guessDateFormat(dates: readonly string[]): AnomalyCsvDateFormat {
  const first = dates.find((d) => d.trim() !== '')?.trim() ?? '';
  if (/^\d{4}-\d{2}-\d{2}$/.test(first)) return 'YYYY-MM-DD';
  if (/^\d{8}$/.test(first)) return 'YYYYMMDD';
  const slashed = dates.map((d) => /^(\d{1,2})\/(\d{1,2})\/\d{4}$/.exec(d.trim())).filter((m) => m !== null);
  if (slashed.length > 0) {
    if (slashed.some((m) => Number(m[2]) > 12)) return 'MM/DD/YYYY';
    return 'DD/MM/YYYY';
  }
  return 'YYYY-MM-DD';
}

/** A first draft from the preview: matched columns and the date format the first rows use. */
export function anomalyDraftFromPreview(preview: CsvPreview): AnomalyMappingDraft {
  const columns = guessColumnsFor(preview.headers, ANOMALY_CSV_FIELDS, ANOMALY_CSV_SYNONYMS);
  const dateColumn = columns.date;
  return {
    columns,
    variableNames: { q: '', u: '', v: '' },
    levelHpa: '',
    dateFormat: guessDateFormat(dateColumn ? preview.rows.map((r) => r[dateColumn] ?? '') : []),
  };
}

/** The distinct names in the previewed rows' variable column that are not q, u, v nor mapped to them. */
export function unknownVariableNames(draft: AnomalyMappingDraft, preview: CsvPreview): string[] {
  const column = draft.columns.variable;
  if (!column) return [];
  const known = new Set<string>(ANOMALY_VARIABLES);
  for (const name of Object.values(draft.variableNames))
    if (name.trim()) known.add(name.trim().toLowerCase());
  const seen = new Set(preview.rows.map((r) => (r[column] ?? '').trim()).filter((v) => v !== ''));
  return [...seen].filter((v) => !known.has(v.toLowerCase()));
}

/**
 * Everything still missing before the file can be uploaded, in words; empty when ready.
 * `fileVariable` is the variable chosen for the whole upload, if any.
 */
export function anomalyMappingProblems(
  draft: AnomalyMappingDraft,
  preview: CsvPreview,
  fileVariable: AnomalyVariable | null,
): string[] {
  const problems: string[] = [];
  const missing = (f: AnomalyCsvField) => !draft.columns[f];
  if (missing('date')) problems.push('Choose the column with the date (date).');
  if (missing('lat') || missing('lon'))
    problems.push('Choose the columns with the latitude and longitude (lat and lon).');
  if (missing('value')) problems.push('Choose the column with the values (value).');
  if (missing('variable') && !fileVariable)
    problems.push('Choose the column with the variable, or pick the variable of the whole file above.');
  if (missing('level_hpa')) {
    const level = Number(draft.levelHpa);
    if (draft.levelHpa.trim() === '')
      problems.push('Choose the column with the pressure level, or enter the level of the whole file.');
    else if (!(level > 0 && level <= 1100))
      problems.push(`The level "${draft.levelHpa}" is not a pressure in hPa between 0 and 1100.`);
  }
  const unknown = unknownVariableNames(draft, preview);
  if (unknown.length > 0)
    problems.push(
      `The file names variables ${unknown.map((n) => `"${n}"`).join(', ')}: say which of q, u, v each one is.`,
    );
  return problems;
}

/** The mapping as sent in the `mapping` field. */
export function toAnomalyMapping(draft: AnomalyMappingDraft): AnomalyCsvMapping {
  const columns = Object.fromEntries(Object.entries(draft.columns).filter(([, header]) => header));
  const variableNames = Object.fromEntries(
    Object.entries(draft.variableNames).filter(([, name]) => name.trim() !== ''),
  );
  return AnomalyCsvMapping.parse({
    columns,
    variableNames,
    dateFormat: draft.dateFormat,
    ...(draft.columns.level_hpa ? {} : { levelHpa: Number(draft.levelHpa) }),
  });
}
