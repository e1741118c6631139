import {
  CELL_TABLE_FIELDS,
  type CellTableField,
  CellTableMapping,
  normaliseHeader,
  CELL_TABLE_SYNONYMS as SYNONYMS,
} from '@stormhour/shared';

/** What each of our cell-table fields means, for the mapping step. */
export const CELL_FIELD_LABELS: Record<CellTableField, string> = {
  scan_time: 'Scan time',
  track_id: 'Track id in the file',
  lat: 'Latitude of the centroid (°)',
  lon: 'Longitude of the centroid (°)',
  x: 'x of the centroid (m)',
  y: 'y of the centroid (m)',
  area: 'Cell area, in the unit set below',
  volume_km3: 'Volume (km³)',
  max_dbz: 'Maximum reflectivity (dBZ)',
  top35_km: '35 dBZ top (km)',
  echo_top_km: 'Echo top (km)',
  core40_km3: 'Volume ≥ 40 dBZ (km³)',
  vil_max_kg_m2: 'Maximum VIL (kg m⁻²)',
  parent_track_id: 'Parent track id (splits)',
};

export { normaliseHeader };

export type ColumnChoice = Partial<Record<CellTableField, string>>;

/**
 * Pre-selects the file's column for each field whose header matches the name or a synonym; each column
 * is taken once, and exact names before synonyms so "area" is not claimed by another field's synonym.
 */
export function guessColumnsFor<F extends string>(
  headers: readonly string[],
  fields: readonly F[],
  synonyms: Record<F, string[]>,
): Partial<Record<F, string>> {
  const byNormal = new Map<string, string>();
  for (const header of headers) {
    const key = normaliseHeader(header);
    if (!byNormal.has(key)) byNormal.set(key, header);
  }
  const used = new Set<string>();
  const columns: Partial<Record<F, string>> = {};
  for (const pass of ['own', 'synonyms'] as const) {
    for (const field of fields) {
      if (columns[field]) continue;
      const names = pass === 'own' ? [field] : synonyms[field];
      const header = names.map((n) => byNormal.get(n)).find((h) => h !== undefined && !used.has(h));
      if (header) {
        columns[field] = header;
        used.add(header);
      }
    }
  }
  return columns;
}

/** Pre-selects the file's column for each of our cell-table fields. */
export function guessColumns(headers: readonly string[]): ColumnChoice {
  return guessColumnsFor(headers, CELL_TABLE_FIELDS, SYNONYMS);
}

export interface MappingDraft {
  columns: ColumnChoice;
  areaUnit: 'km2' | 'm2';
  /** 'UTC' or '+06:00'. */
  timeZone: string;
  position: 'latlon' | 'xy';
  crs: string;
}

/** A first draft from the headers: matched columns, and the unit and position kind they suggest. */
export function draftFromHeaders(headers: readonly string[], timeZone: string): MappingDraft {
  const columns = guessColumns(headers);
  const area = columns.area ? normaliseHeader(columns.area) : '';
  const areaUnit = /(^|_)m2$/.test(area) && !area.endsWith('km2') ? 'm2' : 'km2';
  const position = !(columns.lat && columns.lon) && columns.x && columns.y ? 'xy' : 'latlon';
  return { columns, areaUnit, timeZone, position, crs: '' };
}

/** Everything still missing before the file can be uploaded, in words; empty when ready. */
export function mappingProblems(draft: MappingDraft): string[] {
  const problems: string[] = [];
  const missing = (field: CellTableField) => !draft.columns[field];
  if (missing('scan_time')) problems.push('Choose the column with the scan time (scan_time).');
  if (missing('area')) problems.push('Choose the column with the cell area (area).');
  if (draft.position === 'latlon' && (missing('lat') || missing('lon'))) {
    problems.push('Choose the columns with the latitude and longitude (lat and lon).');
  }
  if (draft.position === 'xy') {
    if (missing('x') || missing('y'))
      problems.push('Choose the columns with the x and y positions (x and y).');
    if (draft.crs.trim() === '')
      problems.push('Enter the coordinate system of x and y (an EPSG code or proj4 text).');
  }
  if (!/^(UTC|[+-]\d{2}:\d{2})$/.test(draft.timeZone)) {
    problems.push('Write the time zone as UTC or an offset such as +06:00.');
  }
  return problems;
}

/** The mapping as sent in the `mapping` field; the other position kind's columns are left out. */
export function toMapping(draft: MappingDraft): CellTableMapping {
  const unused: CellTableField[] = draft.position === 'latlon' ? ['x', 'y'] : ['lat', 'lon'];
  const columns = Object.fromEntries(
    Object.entries(draft.columns).filter(
      ([field, header]) => header && !unused.includes(field as CellTableField),
    ),
  );
  return CellTableMapping.parse({
    columns,
    areaUnit: draft.areaUnit,
    timeZone: draft.timeZone,
    position: draft.position,
    ...(draft.position === 'xy' ? { crs: draft.crs.trim() } : {}),
  });
}
