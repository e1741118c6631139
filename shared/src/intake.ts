import { z } from 'zod';

export const INTAKE_KINDS = ['volume', 'column-max', 'cell-table', 'scan-inventory', 'anomaly-grid'] as const;
export type IntakeKind = (typeof INTAKE_KINDS)[number];

export const ANOMALY_PRODUCTS = ['analysis', 'forecast'] as const;
export type AnomalyProduct = (typeof ANOMALY_PRODUCTS)[number];
export const FIELD_KINDS = ['anomaly', 'total', 'climatology'] as const;
export type FieldKind = (typeof FIELD_KINDS)[number];

/** Our names for the columns of a cell table; the user maps their file's columns onto these. */
export const CELL_TABLE_FIELDS = [
  'scan_time',
  'track_id',
  'lat',
  'lon',
  'x',
  'y',
  'area',
  'volume_km3',
  'max_dbz',
  'top35_km',
  'echo_top_km',
  'core40_km3',
  'vil_max_kg_m2',
  'parent_track_id',
] as const;
export type CellTableField = (typeof CELL_TABLE_FIELDS)[number];

/**
 * Header spellings tables commonly use for each field (compared lower-case, with runs of other
 * characters read as "_"), so a file's columns can be matched without the user's help.
 */
export const CELL_TABLE_SYNONYMS: Record<CellTableField, string[]> = {
  scan_time: [
    'scan_time_utc',
    'time_utc',
    'time',
    'datetime',
    'date_time',
    'timestamp',
    'scan',
    'scantime',
    'obs_time',
    'valid_time',
  ],
  track_id: ['track', 'trackid', 'track_no', 'storm_id', 'stormid'],
  lat: ['latitude', 'lat_deg', 'centroid_lat', 'cent_lat'],
  lon: ['longitude', 'long', 'lng', 'lon_deg', 'centroid_lon', 'cent_lon'],
  x: ['x_m', 'easting', 'centroid_x'],
  y: ['y_m', 'northing', 'centroid_y'],
  area: ['area_km2', 'area_m2', 'area_sqkm', 'size', 'size_km2'],
  volume_km3: ['volume', 'vol', 'vol_km3'],
  max_dbz: ['maxdbz', 'dbz_max', 'zmax', 'max_z', 'max_reflectivity'],
  top35_km: ['top35', 'top_35', 'top_35dbz', 'top35dbz'],
  echo_top_km: ['echo_top', 'echotop', 'et_km', 'top_km'],
  core40_km3: ['core40', 'core_km3', 'vol40', 'volume_40dbz'],
  vil_max_kg_m2: ['vil_max', 'vil', 'maxvil', 'vil_kg_m2'],
  parent_track_id: ['parent', 'parent_id', 'parent_track', 'split_from'],
};

/** "Area (km²)", "area_km2" and "AREA-KM2" all read as "area_km2". */
export function normaliseHeader(header: string): string {
  return header
    .trim()
    .toLowerCase()
    .replaceAll('²', '2')
    .replace(/[^a-z0-9]+/g, '_')
    .replace(/^_+|_+$/g, '');
}

/** Fields a cell table must have: a time, a position (lat/lon or x/y) and an area. */
export const REQUIRED_CELL_TABLE_FIELDS = ['scan_time', 'area'] as const;

export const CellTableMapping = z
  .object({
    /** Our field → the file's column header. Unmapped optional fields are left empty. */
    columns: z.partialRecord(z.enum(CELL_TABLE_FIELDS), z.string().min(1)),
    areaUnit: z.enum(['km2', 'm2']).default('km2'),
    /** 'UTC' or a fixed offset like '+06:00' that the file's times are in (when they carry none). */
    timeZone: z
      .string()
      .regex(/^(UTC|[+-]\d{2}:\d{2})$/, 'Use UTC or an offset such as +06:00')
      .default('UTC'),
    position: z.enum(['latlon', 'xy']).default('latlon'),
    /** For x/y positions: a proj4 definition or EPSG code of the file's coordinates (metres). */
    crs: z.string().optional(),
  })
  .strict();
export type CellTableMapping = z.infer<typeof CellTableMapping>;

/** Our names for the columns of a long-form anomaly CSV: one row per day, grid point, variable and level. */
export const ANOMALY_CSV_FIELDS = ['date', 'lat', 'lon', 'variable', 'level_hpa', 'value', 'units'] as const;
export type AnomalyCsvField = (typeof ANOMALY_CSV_FIELDS)[number];

/** Header spellings commonly used for each field, compared as normaliseHeader makes them. */
export const ANOMALY_CSV_SYNONYMS: Record<AnomalyCsvField, string[]> = {
  date: ['day', 'valid_day', 'valid_date', 'date_utc', 'time', 'valid_time', 'datetime'],
  lat: ['latitude', 'lat_deg'],
  lon: ['longitude', 'long', 'lng', 'lon_deg'],
  variable: ['var', 'field', 'parameter', 'param', 'quantity', 'name'],
  level_hpa: ['level', 'lev', 'plev', 'pressure', 'pressure_level', 'level_mb'],
  value: ['anomaly', 'anom', 'val', 'data'],
  units: ['unit', 'uom'],
};

export const ANOMALY_CSV_DATE_FORMATS = ['YYYY-MM-DD', 'YYYYMMDD', 'DD/MM/YYYY', 'MM/DD/YYYY'] as const;
export type AnomalyCsvDateFormat = (typeof ANOMALY_CSV_DATE_FORMATS)[number];

/**
 * How a long-form anomaly CSV's columns and values map onto ours. The variable may come from the
 * request's `variable` instead of a column, and the level from `levelHpa`, for files of one field.
 */
export const AnomalyCsvMapping = z
  .object({
    /** Our field → the file's column header. */
    columns: z.partialRecord(z.enum(ANOMALY_CSV_FIELDS), z.string().min(1)),
    /** The file's name for each of our variables, e.g. { q: "shum" }; unlisted ones are read as q, u, v. */
    variableNames: z.partialRecord(z.enum(['q', 'u', 'v']), z.string().trim().min(1)).default({}),
    /** The pressure level of every row, for a file without a level column. */
    levelHpa: z.number().positive().max(1100).optional(),
    dateFormat: z.enum(ANOMALY_CSV_DATE_FORMATS).default('YYYY-MM-DD'),
  })
  .strict();
export type AnomalyCsvMapping = z.infer<typeof AnomalyCsvMapping>;

/** The multipart fields of POST /api/intake besides files[]. */
export const IntakeRequest = z
  .object({
    siteId: z.coerce.number().int().positive(),
    kind: z.enum(INTAKE_KINDS, { message: `kind must be one of ${INTAKE_KINDS.join(', ')}` }),
    /** On a bad file: stop the whole job (nothing stored), or skip that file and go on. */
    onError: z.enum(['fail', 'skip']).default('skip'),
    /**
     * JSON of CellTableMapping for cell tables, of AnomalyCsvMapping for anomaly CSVs. Without it, our
     * own column names are expected.
     */
    mapping: z.string().optional(),
    /**
     * For files whose metadata lacks the scan time: a pattern for the file name with the tokens
     * YYYY MM DD hh mm ss, e.g. "VSR_YYYYMMDD_hhmm.tif". Times are UTC.
     */
    timePattern: z.string().optional(),
    /** Anomaly grids: which field the file holds, when its metadata does not say (VARIABLE). */
    variable: z.enum(['q', 'u', 'v']).optional(),
    /** Anomaly grids: the file's units, when its metadata does not say (UNITS); converted on intake. */
    units: z.enum(['g/kg', 'kg/kg', 'm/s', 'kt']).optional(),
    /** Anomaly grids: an analysis of past days, or a forecast of coming days (kept apart). */
    product: z.enum(ANOMALY_PRODUCTS).default('analysis'),
    /**
     * Anomaly grids: the values are anomalies; totals (turned into anomalies against the stored
     * climatology of the same variable, level and grid); or that climatology (one band per month or
     * day of the year), which must be uploaded before the totals.
     */
    fieldKind: z.enum(FIELD_KINDS).default('anomaly'),
  })
  .strict();
export type IntakeRequest = z.infer<typeof IntakeRequest>;

export type JobState = 'queued' | 'running' | 'done' | 'failed';

export interface JobProblemView {
  file: string;
  /** Row, column, band or feature; null for the file as a whole. */
  where: string | null;
  problem: string;
}

export interface JobFileView {
  uploadId: number;
  fileName: string;
  sizeBytes: number;
  /** The same content was imported before: it is not counted twice. */
  duplicate: boolean;
  state: 'waiting' | 'imported' | 'skipped' | 'failed' | 'duplicate';
}

export interface QualityReport {
  filesRead: number;
  filesSkipped: number;
  duplicates: number;
  scans: number;
  cellsFound: number;
  cellsRejectedTooSmall: number;
  cellsOutsideCoverage: number;
  tracks: number;
  storms: number;
  onsets: number;
  flaggedStarts: { split: number; 'data-start': number; 'after-gap': number; 'edge-band': number };
  gaps: { from: string; to: string; minutes: number }[];
  cellsPerScan: { time: string; cells: number }[];
  /** Share of expected scans present, per local day. */
  availabilityByDay: { date: string; share: number }[];
}

export interface JobView {
  id: number;
  kind: string;
  state: JobState;
  /** 0–1. */
  progress: number;
  /** What it is doing now, in words. */
  stage: string | null;
  params: Record<string, unknown>;
  files: JobFileView[];
  /** The radar quality report; null for other kinds of job. */
  report: QualityReport | null;
  /** What a job that is not a radar intake did, in a sentence. */
  summary: string | null;
  problems: JobProblemView[];
  error: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

export type CellType = 'shallow' | 'congestus' | 'deep';
export type NotOnsetReason = 'split' | 'data-start' | 'after-gap' | 'edge-band';

export interface TrackView {
  id: number;
  siteId: number;
  source: 'volume' | 'column-max' | 'cell-table';
  externalId: string | null;
  firstTime: string;
  lastTime: string;
  scanCount: number;
  durationMin: number;
  speedMs: number | null;
  directionToDeg: number | null;
  isStorm: boolean;
  onset: boolean;
  notOnsetReason: NotOnsetReason | null;
  parentTrackId: number | null;
  mergedIntoTrackId: number | null;
  startLat: number;
  startLon: number;
  startBlockId: number | null;
  startBlockCode: string | null;
  maxVolumeKm3: number | null;
  maxAreaKm2: number;
  maxEchoTopKm: number | null;
  cellType: CellType | null;
  settingsVersion: number;
}

export interface CellView {
  id: number;
  scanTime: string;
  trackId: number | null;
  lat: number;
  lon: number;
  areaKm2: number;
  volumeKm3: number | null;
  maxDbz: number | null;
  top35Km: number | null;
  echoTopKm: number | null;
  coreVolumeKm3: number | null;
  vilMaxKgM2: number | null;
  rainRateMaxMmH: number | null;
  precipFluxM3s: number | null;
  semiMajorKm: number | null;
  semiMinorKm: number | null;
  orientationDeg: number | null;
  cellType: CellType | null;
  blockId: number | null;
}

export interface TrackDetail {
  track: TrackView;
  cells: CellView[];
}

export const TracksQuery = z.object({
  siteId: z.coerce.number().int().positive(),
  from: z.iso.datetime({ offset: true }).optional(),
  to: z.iso.datetime({ offset: true }).optional(),
  blockId: z.coerce.number().int().positive().optional(),
  onsetOnly: z
    .enum(['true', 'false'])
    .transform((v) => v === 'true')
    .optional(),
  stormsOnly: z
    .enum(['true', 'false'])
    .transform((v) => v === 'true')
    .optional(),
  type: z.enum(['shallow', 'congestus', 'deep']).optional(),
  minDurationMin: z.coerce.number().min(0).optional(),
  sort: z.enum(['firstTime', 'durationMin', 'maxVolumeKm3', 'maxEchoTopKm', 'speedMs']).default('firstTime'),
  order: z.enum(['asc', 'desc']).default('asc'),
  offset: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(1000).default(100),
});
export type TracksQuery = z.input<typeof TracksQuery>;
