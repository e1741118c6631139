import { z } from 'zod';

/** Identification, tracking and onset settings of a radar site (DESIGN §3.1–3.3). Versioned per site. */
export const SiteSettings = z
  .object({
    thresholdDbz: z.number().min(0).max(70).default(35),
    minVolumeKm3: z.number().min(0).default(15),
    minAreaKm2: z.number().min(0).default(5),
    minScans: z.number().int().min(1).max(100).default(2),
    echoTopDbz: z.number().min(-30).max(40).default(0),
    coreDbz: z.number().min(0).max(80).default(40),
    connectivity3d: z.union([z.literal(6), z.literal(18), z.literal(26)]).default(26),
    connectivity2d: z.union([z.literal(4), z.literal(8)]).default(8),
    maxSpeedMs: z.number().positive().max(100).default(30),
    /** Scans further apart than this many nominal intervals break tracks. */
    maxGapIntervals: z.number().min(1).max(20).default(2.5),
    sizeWeight: z.number().min(0).max(10).default(0.5),
    edgeBandKm: z.number().min(0).max(100).default(10),
    zrA: z.number().min(10, 'Z–R a below 10 is outside published relations').max(2000).default(200),
    zrB: z.number().min(0.5).max(3).default(1.6),
    vilCapDbz: z.number().min(40).max(80).default(56),
    typeEdgesKm: z
      .tuple([z.number().min(0), z.number().min(0)])
      .refine(([a, b]) => a < b, 'The shallow edge must be below the deep edge')
      .default([4, 9]),
    typeHeight: z.enum(['echoTop', 'top35']).default('echoTop'),
    /** Blocks with less of their area inside coverage than this get "no data". */
    minBlockCoverage: z.number().min(0).max(1).default(0.5),
    /** A day counts for a time-of-day bin only with at least this share of expected scans. */
    minAvailability: z.number().min(0).max(1).default(0.8),
  })
  .strict();
export type SiteSettings = z.infer<typeof SiteSettings>;

export const DEFAULT_SITE_SETTINGS: SiteSettings = SiteSettings.parse({});

/** An azimuth sector the beam cannot see (terrain, buildings), degrees clockwise from north. */
export const BlockedSector = z
  .object({ fromDeg: z.number().min(0).max(360), toDeg: z.number().min(0).max(360) })
  .strict();
export type BlockedSector = z.infer<typeof BlockedSector>;

const SiteFields = {
  code: z
    .string()
    .trim()
    .regex(/^[A-Z0-9][A-Z0-9_-]{0,23}$/, 'Use 1–24 capital letters, digits, - or _'),
  name: z.string().trim().min(1, 'Enter the site’s name').max(120),
  lat: z.number().min(-90).max(90),
  lon: z.number().min(-180).max(180),
  altitudeM: z.number().min(-500).max(9000),
  rangeKm: z.number().positive().max(500),
  intervalMin: z.number().positive().max(120),
  /** Local time = UTC + this offset. */
  utcOffsetMinutes: z
    .number()
    .int()
    .min(-12 * 60)
    .max(14 * 60),
  blockedSectors: z.array(BlockedSector).default([]),
};

export const CreateSiteRequest = z
  .object({ ...SiteFields, settings: SiteSettings.default(DEFAULT_SITE_SETTINGS) })
  .strict();
export type CreateSiteRequest = z.infer<typeof CreateSiteRequest>;

export const UpdateSiteRequest = z
  .object({
    name: SiteFields.name.optional(),
    rangeKm: SiteFields.rangeKm.optional(),
    intervalMin: SiteFields.intervalMin.optional(),
    utcOffsetMinutes: SiteFields.utcOffsetMinutes.optional(),
    blockedSectors: z.array(BlockedSector).optional(),
    /** Changing any setting makes a new settings version; cells keep the version that made them. */
    settings: SiteSettings.partial().optional(),
  })
  .strict();
export type UpdateSiteRequest = z.infer<typeof UpdateSiteRequest>;

export interface SiteView {
  id: number;
  code: string;
  name: string;
  lat: number;
  lon: number;
  altitudeM: number;
  rangeKm: number;
  intervalMin: number;
  utcOffsetMinutes: number;
  blockedSectors: BlockedSector[];
  settingsVersion: number;
  settings: SiteSettings;
}
