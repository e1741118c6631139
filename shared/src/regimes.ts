import { z } from 'zod';

/** Daily anomaly fields Stormhour classifies days by (DESIGN §3.4). */
export const ANOMALY_VARIABLES = ['q', 'u', 'v'] as const;
export type AnomalyVariable = (typeof ANOMALY_VARIABLES)[number];

export const MOISTURE_CLASSES = ['dry', 'near-normal', 'moist'] as const;
export type MoistureClass = (typeof MOISTURE_CLASSES)[number];

/** A sector of the direction the anomaly wind blows from, degrees clockwise from north; may wrap. */
export const FlowSector = z
  .object({
    name: z.string().trim().min(1).max(40),
    fromDeg: z.number().min(0).max(360),
    toDeg: z.number().min(0).max(360),
  })
  .strict();
export type FlowSector = z.infer<typeof FlowSector>;

export const RegimeSettings = z
  .object({
    moistureMethod: z.enum(['terciles', 'fixed']).default('terciles'),
    /** With fixed bounds: q′ below the first is dry, above the second moist (g/kg). */
    fixedBoundsGKg: z
      .tuple([z.number(), z.number()])
      .refine(([a, b]) => a < b, 'The dry bound must be below the moist bound')
      .default([-0.5, 0.5]),
    weakBelowMs: z.number().min(0).max(10).default(1),
    sectors: z
      .array(FlowSector)
      .min(1)
      .default([
        { name: 'onshore', fromDeg: 100, toDeg: 190 },
        { name: 'along-shore', fromDeg: 190, toDeg: 280 },
        { name: 'offshore', fromDeg: 280, toDeg: 10 },
        { name: 'along-valley', fromDeg: 10, toDeg: 100 },
      ]),
  })
  .strict();
export type RegimeSettings = z.infer<typeof RegimeSettings>;

export interface RegimeDay {
  /** Local date of the site, YYYY-MM-DD. */
  date: string;
  /** Area-weighted domain means of the anomalies; null where no grid covers the day. */
  q: number | null;
  u: number | null;
  v: number | null;
  speedMs: number | null;
  /** The direction the anomaly wind blows from, degrees clockwise from north. */
  directionFromDeg: number | null;
  moisture: MoistureClass | null;
  /** A sector name, or "weak" below the speed threshold. */
  flow: string | null;
  /** "moist / onshore"; null when either part is unknown. */
  regime: string | null;
  /** Share of the domain's cells that had data, 0–1. */
  coverage: number;
}

export interface RegimesResponse {
  siteId: number;
  settings: RegimeSettings;
  /** The q′ thresholds in use (terciles of the period's days, or the fixed bounds), g/kg. */
  moistureBoundsGKg: [number, number] | null;
  days: RegimeDay[];
  counts: { regime: string; days: number }[];
}

export interface RegimeComposite {
  regime: string;
  days: number;
  /** Grid cell centres. */
  lons: number[];
  lats: number[];
  /** Mean over the regime's days, [row][col] with rows north to south; null where no data. */
  q: (number | null)[][];
  u: (number | null)[][];
  v: (number | null)[][];
}

/**
 * The regime expected for a coming period, classified from forecast anomaly grids with the moisture
 * bounds of the analysis record (so a forecast week is "moist" by the same yardstick as the past).
 * `GET /api/regimes/expected?siteId&from&to`.
 */
export interface ExpectedRegimeResponse {
  siteId: number;
  from: string;
  to: string;
  /** Forecast days found in the period, each classified with the record's bounds. */
  days: RegimeDay[];
  /** The regime of most forecast days; null when no forecast grid covers the period. */
  regime: string | null;
  moistureBoundsGKg: [number, number] | null;
}

/** One source of stored anomaly fields (`GET /api/regimes/sources`): what they are and where from. */
export interface AnomalySource {
  /** Analyses of past days feed the regimes; forecasts only the expected regime of a coming period. */
  product: 'analysis' | 'forecast';
  variable: AnomalyVariable;
  sourceFile: string;
  /** Uploaded as anomalies, or computed on intake as totals minus the stored climatology. */
  derivation: 'anomaly' | 'total-minus-climatology';
  /** The climatology's source file, for fields computed from totals. */
  climatologyFile: string | null;
  days: number;
  first: string;
  last: string;
}
