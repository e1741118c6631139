import { z } from 'zod';

/**
 * The Atlas: the scientist's explorer of storm onsets and cell properties (DESIGN §3.5 maps, §3.6).
 * Every view takes the same filter; the server loads the period's onsets once and computes in the process.
 */

export const ATLAS_SOURCES = ['cell-table', 'volume', 'column-max'] as const;
export type AtlasSource = (typeof ATLAS_SOURCES)[number];

export const ATLAS_CELL_TYPES = ['shallow', 'congestus', 'deep'] as const;
export type AtlasCellType = (typeof ATLAS_CELL_TYPES)[number];

/** Widths of the local time-of-day bins the map can show; each divides the day evenly. */
export const ATLAS_BIN_HOURS = [1, 2, 3, 4, 6, 8, 12, 24] as const;

/** The default time–distance axis of the demo: south to north across the hill range, through the radar. */
export const DEFAULT_AXIS = { fromLat: 12.8, fromLon: 87.95, toLat: 15.4, toLon: 87.95 } as const;

const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a local date such as 2025-06-01');
const optionalNumber = (schema: z.ZodNumber) =>
  z.preprocess((v) => (v === '' || v === null ? undefined : v), z.coerce.number().pipe(schema).optional());

/** The filter every Atlas view shares. Dates are the site's local dates, both included. */
const filterShape = {
  siteId: z.coerce
    .number({ message: 'siteId must be the number of a radar site' })
    .int()
    .positive('siteId must be the number of a radar site'),
  from: day.optional(),
  to: day.optional(),
  /** A regime label such as "moist / onshore"; all days when left out. */
  regime: z.string().trim().min(1).max(80).optional(),
  districtId: optionalNumber(z.number().int().positive('districtId must be a district number')),
  cellType: z.enum(ATLAS_CELL_TYPES, { message: 'cellType must be shallow, congestus or deep' }).optional(),
  /** Sources are never added together; by default the one with the most onsets in the period. */
  source: z.enum(ATLAS_SOURCES, { message: 'source must be cell-table, volume or column-max' }).optional(),
};
const periodInOrder = (q: { from?: string; to?: string }) => !q.from || !q.to || q.from <= q.to;
const periodMessage = { message: 'The first day must not be after the last day', path: ['to'] };

export const AtlasQuery = z.object(filterShape).refine(periodInOrder, periodMessage);
export type AtlasQuery = z.input<typeof AtlasQuery>;
export type AtlasFilter = z.output<typeof AtlasQuery>;

const binFields = {
  binHours: z.coerce
    .number()
    .refine((h) => (ATLAS_BIN_HOURS as readonly number[]).includes(h), {
      message: `binHours must be one of ${ATLAS_BIN_HOURS.join(', ')}`,
    })
    .default(3),
  /** Which bin of the local day, 0 = the one starting at midnight; all hours when left out. */
  bin: optionalNumber(z.number().int().min(0, 'bin must be 0 or more')),
};

export const AtlasMapQuery = z
  .object({
    ...filterShape,
    ...binFields,
    bandwidthKm: z.coerce
      .number({ message: 'bandwidthKm must be a number of km' })
      .min(2, 'bandwidthKm must be at least 2 km')
      .max(100, 'bandwidthKm must be at most 100 km')
      .default(15),
  })
  .refine((q) => q.bin === undefined || q.bin < 24 / q.binHours, {
    message: 'bin must be below the number of bins in a day (24 / binHours)',
    path: ['bin'],
  })
  .refine(periodInOrder, periodMessage);
export type AtlasMapQuery = z.input<typeof AtlasMapQuery>;

const lat = (name: string) =>
  z.coerce
    .number({ message: `${name} must be a latitude` })
    .min(-90, `${name} must be a latitude`)
    .max(90);
const lon = (name: string) =>
  z.coerce
    .number({ message: `${name} must be a longitude` })
    .min(-180, `${name} must be a longitude`)
    .max(180);

export const AtlasTimeDistanceQuery = z
  .object({
    ...filterShape,
    fromLat: lat('fromLat').default(DEFAULT_AXIS.fromLat),
    fromLon: lon('fromLon').default(DEFAULT_AXIS.fromLon),
    toLat: lat('toLat').default(DEFAULT_AXIS.toLat),
    toLon: lon('toLon').default(DEFAULT_AXIS.toLon),
    halfWidthKm: z.coerce
      .number({ message: 'halfWidthKm must be a number of km' })
      .positive('halfWidthKm must be above 0 km')
      .max(200, 'halfWidthKm must be at most 200 km')
      .default(40),
    stepKm: z.coerce.number().min(1, 'stepKm must be at least 1 km').max(100).default(10),
  })
  .refine((q) => q.fromLat !== q.toLat || q.fromLon !== q.toLon, {
    message: 'The axis needs two different points',
    path: ['toLat'],
  })
  .refine(periodInOrder, periodMessage);
export type AtlasTimeDistanceQuery = z.input<typeof AtlasTimeDistanceQuery>;

/** What the filter resolved to, returned with every view so the screen can say what it shows. */
export interface AtlasScope {
  siteId: number;
  source: AtlasSource;
  /** Onset tracks per source in the period (before the regime, district and type filters). */
  onsetsBySource: { source: AtlasSource; onsets: number }[];
  from: string | null;
  to: string | null;
  regime: string | null;
  districtId: number | null;
  cellType: AtlasCellType | null;
  /** Local days with scans of the source in the period (and of the regime, when one is chosen). */
  days: number;
  /** Onsets left after every filter. */
  onsets: number;
  utcOffsetMinutes: number;
  /** Regimes with days in the period, for the filter's choices. */
  regimes: { regime: string; days: number }[];
}

export interface OnsetPoint {
  trackId: number;
  /** Onset time, UTC ISO 8601, and the site's local hour of it (0–23.99). */
  time: string;
  localHour: number;
  lat: number;
  lon: number;
  blockId: number | null;
  cellType: AtlasCellType | null;
}

export interface DensityBand {
  /** Lower edge of the band, onsets per 1000 km² per day. */
  threshold: number;
  /** GeoJSON MultiPolygon in lon/lat (RFC 7946 winding) of where the density is at least the threshold. */
  geometry: { type: 'MultiPolygon'; coordinates: number[][][][] };
}

export interface AtlasMapResponse {
  scope: AtlasScope;
  binHours: number;
  bin: number | null;
  /** Local hours the bin covers, [start, end). */
  hours: [number, number];
  bandwidthKm: number;
  points: OnsetPoint[];
  density: {
    unit: 'onsets per 1000 km² per day';
    gridKm: number;
    max: number;
    /** Density integrated over the grid, in onsets (equals the onset count within grid truncation). */
    integral: number;
    bands: DensityBand[];
  };
}

export const DIURNAL_PROPERTIES = [
  'areaKm2',
  'volumeKm3',
  'top35Km',
  'echoTopKm',
  'vilMaxKgM2',
  'precipFluxM3s',
] as const;
export type DiurnalProperty = (typeof DIURNAL_PROPERTIES)[number];

export interface DiurnalCurve {
  /** 'all' or a cell type. */
  group: 'all' | AtlasCellType;
  /** 24 values by local hour; null where no onset or cell fell in the hour. */
  values: (number | null)[];
  /** Hour (0–23) of the largest value; null when every value is null. */
  peakHour: number | null;
  /** How many onsets or cells the curve rests on. */
  n: number;
}

export interface AtlasDiurnalResponse {
  scope: AtlasScope;
  /** Onsets per local hour: counts per hour over the period. */
  onsets: DiurnalCurve[];
  /** Mean cell property per local hour, from every cell of the source (not just onsets). */
  properties: { property: DiurnalProperty; unit: string; curves: DiurnalCurve[] }[];
  /** Cells the property curves rest on. */
  cells: number;
}

export const DISTRIBUTION_VARIABLES = ['areaKm2', 'durationMin', 'top35Km'] as const;
export type DistributionVariable = (typeof DISTRIBUTION_VARIABLES)[number];

export interface LogNormalFit {
  /** Maximum likelihood: μ̂ = mean ln x, σ̂ = population SD of ln x. */
  mu: number;
  sigma: number;
  median: number;
  mean: number;
  /** Kolmogorov–Smirnov statistic of the sample against the fitted distribution. */
  ksD: number;
  /** 5 % critical value of D and how it was found. */
  critical05: number;
  criticalMethod: 'exact' | 'asymptotic';
  /** D below the critical value (too lenient with fitted parameters: Lilliefors 1967). */
  consistent: boolean;
}

export interface DistributionSummary {
  variable: DistributionVariable;
  label: string;
  unit: string;
  n: number;
  /** Values that were not positive or missing, left out of the fit. */
  skipped: number;
  fit: LogNormalFit | null;
  /** Log-spaced bins: edges (length bins + 1), counts, and the count the fit expects in each bin. */
  histogram: { edges: number[]; counts: number[]; expected: number[] };
}

export interface AtlasDistributionsResponse {
  scope: AtlasScope;
  distributions: DistributionSummary[];
}

export interface AtlasTimeDistanceResponse {
  scope: AtlasScope;
  axis: { fromLat: number; fromLon: number; toLat: number; toLon: number; lengthKm: number };
  halfWidthKm: number;
  stepKm: number;
  /** Lower edges of the distance bins along the axis, km from its first point. */
  distancesKm: number[];
  /** Onsets per day: counts[distanceBin][localHour] / days. */
  counts: number[][];
  perDay: number[][];
  /** Onsets inside the corridor. */
  inCorridor: number;
}

export const MOTION_SPEED_CLASSES_MS = [0, 2, 4, 6, 8] as const;

export interface AtlasMotionResponse {
  scope: AtlasScope;
  /** Sectors of 22.5° centred on N, NNE, …; counts[sector][speedClass]. */
  sectors: { centreDeg: number; name: string; counts: number[]; total: number }[];
  /** Lower edges of the speed classes, m/s (the last is open-ended). */
  speedClassesMs: number[];
  /** Onsets with a motion (a direction needs two scans at different places). */
  withMotion: number;
  /** Sector with the most onsets. */
  modeSector: string | null;
  /** Mean of the regime's days' anomaly wind (all days when no regime is chosen). */
  anomalyWind: {
    u: number;
    v: number;
    speedMs: number;
    fromDeg: number;
    towardDeg: number;
    days: number;
  } | null;
}
