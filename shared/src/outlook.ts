import { z } from 'zod';

/** The block outlook (DESIGN §3.5): storm chances per block and local time-of-day bin, with their n. */

export const OUTLOOK_MEASURES = ['onsets', 'presence'] as const;
export type OutlookMeasure = (typeof OUTLOOK_MEASURES)[number];

export const INTERVAL_METHODS = ['jeffreys', 'wilson'] as const;
export type IntervalMethod = (typeof INTERVAL_METHODS)[number];

export const OUTLOOK_SOURCES = ['cell-table', 'volume', 'column-max'] as const;
export type OutlookSource = (typeof OUTLOOK_SOURCES)[number];

/** Bin widths that divide the day evenly. */
export const BIN_HOURS = [1, 2, 3, 4, 6] as const;

/** Every interval the outlook shows is a 90 % interval. */
export const OUTLOOK_LEVEL = 0.9;

/** Below this many days a figure is marked as resting on few days. */
export const SMALL_N = 10;

/** The regime value meaning "every day of the period". */
export const ALL_DAYS = 'all';

const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date such as 2025-06-01');
const hour = (what: string) =>
  z.coerce
    .number({ message: `Give the ${what} as a whole hour, 0–24` })
    .int(`Give the ${what} as a whole hour, 0–24`)
    .min(0, `The ${what} is an hour from 0 to 24`)
    .max(24, `The ${what} is an hour from 0 to 24`);

export const OutlookQuery = z
  .object({
    siteId: z.coerce.number({ message: 'Give the radar site id' }).int().positive('Give the radar site id'),
    /** A regime name such as "moist / onshore", or "all" (the default) for every day. */
    regime: z.string().trim().min(1).max(80).default(ALL_DAYS),
    from: day.optional(),
    to: day.optional(),
    binHours: z.coerce
      .number()
      .refine(
        (h) => (BIN_HOURS as readonly number[]).includes(h),
        'Choose a bin width of 1, 2, 3, 4 or 6 hours',
      )
      .default(3),
    measure: z.enum(OUTLOOK_MEASURES, { message: 'Choose onsets or presence' }).default('onsets'),
    radiusKm: z.coerce
      .number()
      .min(0, 'The radius cannot be negative')
      .max(50, 'Keep the radius within 50 km')
      .default(0),
    /** Which stored source to count; by default the one with the most onsets in the period. */
    source: z.enum(OUTLOOK_SOURCES, { message: 'Choose cell-table, volume or column-max' }).optional(),
    interval: z.enum(INTERVAL_METHODS, { message: 'Choose jeffreys or wilson' }).default('jeffreys'),
    afternoonFrom: hour('afternoon start').default(12),
    afternoonTo: hour('afternoon end').default(18),
  })
  .strict()
  .superRefine((q, ctx) => {
    if (q.afternoonFrom >= q.afternoonTo)
      ctx.addIssue({
        code: 'custom',
        path: ['afternoonTo'],
        message: 'The afternoon window must end after it starts',
      });
    if (q.from && q.to && q.from > q.to)
      ctx.addIssue({
        code: 'custom',
        path: ['to'],
        message: 'The period must end on or after its first day',
      });
  });
export type OutlookQuery = z.infer<typeof OutlookQuery>;
export type OutlookQueryInput = z.input<typeof OutlookQuery>;

/** A chance with its counts: x of n counted days; null throughout when the block or bin has no data. */
export interface OutlookFigure {
  /** Days counted (availability and coverage passed); null = no data. */
  n: number | null;
  /** Of those, days with at least one onset (or presence). */
  x: number | null;
  rate: number | null;
  lower: number | null;
  upper: number | null;
  /** Empirical-Bayes estimate shrunk toward the all-block rate. */
  shrunk: number | null;
  /** Onsets (or cell sightings) per 100 km² per counted day. */
  per100Km2: number | null;
}

export interface OutlookWeek {
  /** 7-day windows of consecutive counted days, and those with at least one afternoon storm. */
  windows: number;
  hits: number;
  rate: number | null;
  lower: number | null;
  upper: number | null;
}

export interface OutlookBlock {
  blockId: number;
  code: string;
  name: string;
  districtId: number;
  districtCode: string;
  districtName: string;
  areaKm2: number;
  /** Share of the block's area inside the radar's coverage, 0–1. */
  coverage: number;
  /** False when the coverage is below the site's threshold: every figure is then null ("no data"). */
  hasData: boolean;
  bins: OutlookFigure[];
  afternoon: OutlookFigure;
  /** The same block's afternoon rate over all days of the period, and this regime's rate over it. */
  climatologyRate: number | null;
  ratioToClimatology: number | null;
  week: OutlookWeek;
  /** Index of the bin with the highest shrunk estimate. */
  peakBin: number | null;
}

export interface OutlookPrior {
  /** The all-block rate the estimates shrink toward. */
  mean: number | null;
  /** α + β of the fitted beta prior; null when the blocks show no spread beyond chance (full pooling). */
  strength: number | null;
  alpha: number | null;
  beta: number | null;
}

export interface OutlookBin {
  index: number;
  fromHour: number;
  toHour: number;
  /** "12–15". */
  label: string;
}

export interface OutlookResponse {
  siteId: number;
  siteCode: string;
  utcOffsetMinutes: number;
  source: OutlookSource | null;
  /** Onset tracks per stored source in the period, to show which one is counted. */
  sources: { source: string; onsets: number }[];
  measure: OutlookMeasure;
  /** The regime asked for, or "all". */
  regime: string;
  from: string | null;
  to: string | null;
  binHours: number;
  bins: OutlookBin[];
  afternoon: { fromHour: number; toHour: number };
  radiusKm: number;
  interval: IntervalMethod;
  level: number;
  minAvailability: number;
  minBlockCoverage: number;
  /** Days in the period, and days of the regime. */
  daysInPeriod: number;
  regimeDays: number;
  /** Regimes found in the period, for the picker. */
  regimes: { regime: string; days: number }[];
  priors: { bins: OutlookPrior[]; afternoon: OutlookPrior; method: 'moments' };
  blocks: OutlookBlock[];
}
