import type {
  AnomalyCsvMapping,
  AnomalyProduct,
  AnomalyVariable,
  CellTableMapping,
  FieldKind,
  IntakeKind,
  IntakeRequest,
} from '@stormhour/shared';

export const KIND_LABELS: Record<IntakeKind, string> = {
  volume: 'Volume scans (GeoTIFF)',
  'column-max': 'Column-maximum fields (GeoTIFF)',
  'cell-table': 'Cell table (CSV)',
  'scan-inventory': 'Scan inventory (CSV)',
  'anomaly-grid': 'Anomaly grids (GeoTIFF one band per day, or long-form CSV)',
};

/** File-name endings each kind takes. */
export const KIND_EXTENSIONS: Record<IntakeKind, string[]> = {
  volume: ['.tif', '.tiff'],
  'column-max': ['.tif', '.tiff'],
  'cell-table': ['.csv', '.txt'],
  'scan-inventory': ['.csv', '.txt'],
  'anomaly-grid': ['.tif', '.tiff', '.csv'],
};

/** The units a file may state for an anomaly grid (IntakeRequest.units). */
export type AnomalyUnit = NonNullable<IntakeRequest['units']>;

export const ANOMALY_VARIABLE_LABELS: Record<AnomalyVariable, string> = {
  q: 'Specific humidity anomaly',
  u: 'Eastward wind anomaly',
  v: 'Northward wind anomaly',
};

export const ANOMALY_UNIT_LABELS: Record<AnomalyUnit, string> = {
  'g/kg': 'g/kg',
  'kg/kg': 'kg/kg',
  'm/s': 'm/s',
  kt: 'knots',
};

export const PRODUCT_LABELS: Record<AnomalyProduct, string> = {
  analysis: 'Analysis of past days (feeds the regimes)',
  forecast: 'Forecast of coming days (for the expected regime)',
};

export const FIELD_KIND_LABELS: Record<FieldKind, string> = {
  anomaly: 'Anomalies',
  total: 'Totals (the stored climatology is subtracted)',
  climatology: 'Climatology (one band per month or day of the year)',
};

/** The units that fit a variable; all of them while the variable is left to the file. */
export function unitsFor(variable: AnomalyVariable | null): AnomalyUnit[] {
  if (variable === 'q') return ['g/kg', 'kg/kg'];
  if (variable === 'u' || variable === 'v') return ['m/s', 'kt'];
  return ['g/kg', 'kg/kg', 'm/s', 'kt'];
}

export function isGeoTiffKind(kind: IntakeKind): boolean {
  return kind === 'volume' || kind === 'column-max';
}

export function fitsKind(fileName: string, kind: IntakeKind): boolean {
  const lower = fileName.toLowerCase();
  return KIND_EXTENSIONS[kind].some((ext) => lower.endsWith(ext));
}

export type OnError = 'skip' | 'fail';

export interface IntakeDraft {
  siteId: number | null;
  kind: IntakeKind;
  files: File[];
  onError: OnError;
  timePattern: string;
  /** Cell tables and anomaly CSVs; null until the mapping step is complete (or for no CSV). */
  mapping: CellTableMapping | AnomalyCsvMapping | null;
  /** Anomaly grids only; null leaves it to the file's metadata. */
  variable?: AnomalyVariable | null;
  units?: AnomalyUnit | null;
  product?: AnomalyProduct;
  fieldKind?: FieldKind;
}

/** The tokens a time pattern may use (IntakeRequest.timePattern). */
const PATTERN_TOKENS = /YYYY|MM|DD|hh|mm|ss/;

/** What stops the upload, in words; the Upload button stays off until this is empty. */
export function uploadBlockers(draft: IntakeDraft, mappingProblems: readonly string[]): string[] {
  const blockers: string[] = [];
  if (draft.siteId === null) blockers.push('Choose the radar site the files come from.');
  if (draft.files.length === 0) blockers.push('Add at least one file.');
  const wrong = draft.files.filter((f) => !fitsKind(f.name, draft.kind));
  if (wrong.length > 0) {
    blockers.push(
      `${wrong.map((f) => f.name).join(', ')} ${wrong.length === 1 ? 'does' : 'do'} not end in ${KIND_EXTENSIONS[draft.kind].join(' or ')}.`,
    );
  }
  if (
    (isGeoTiffKind(draft.kind) || draft.kind === 'anomaly-grid') &&
    draft.timePattern.trim() !== '' &&
    !PATTERN_TOKENS.test(draft.timePattern)
  ) {
    blockers.push('The file-name time pattern needs at least one of YYYY, MM, DD, hh, mm, ss.');
  }
  if (draft.kind === 'cell-table' || draft.kind === 'anomaly-grid') blockers.push(...mappingProblems);
  return blockers;
}

/** The multipart body of POST /api/intake: one `files[]` part per file, then the fields. */
export function buildIntakeForm(draft: IntakeDraft): FormData {
  const form = new FormData();
  for (const file of draft.files) form.append('files[]', file, file.name);
  form.append('siteId', String(draft.siteId));
  form.append('kind', draft.kind);
  form.append('onError', draft.onError);
  if ((draft.kind === 'cell-table' || draft.kind === 'anomaly-grid') && draft.mapping)
    form.append('mapping', JSON.stringify(draft.mapping));
  if ((isGeoTiffKind(draft.kind) || draft.kind === 'anomaly-grid') && draft.timePattern.trim() !== '') {
    form.append('timePattern', draft.timePattern.trim());
  }
  if (draft.kind === 'anomaly-grid') {
    if (draft.variable) form.append('variable', draft.variable);
    if (draft.units) form.append('units', draft.units);
    form.append('product', draft.product ?? 'analysis');
    form.append('fieldKind', draft.fieldKind ?? 'anomaly');
  }
  return form;
}
