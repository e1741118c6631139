import { z } from 'zod';

/** Identification, tracking and onset settings of a radar site (DESIGN §3.1–3.3). Versioned per site. */
const settingFields = {
  thresholdDbz: z.number().min(0).max(70),
  minVolumeKm3: z.number().min(0),
  minAreaKm2: z.number().min(0),
  minScans: z.number().int().min(1).max(100),
  echoTopDbz: z.number().min(-30).max(40),
  coreDbz: z.number().min(0).max(80),
  connectivity3d: z.union([z.literal(6), z.literal(18), z.literal(26)]),
  connectivity2d: z.union([z.literal(4), z.literal(8)]),
  maxSpeedMs: z.number().positive().max(100),
  /** Scans further apart than this many nominal intervals break tracks. */
  maxGapIntervals: z.number().min(1).max(20),
  sizeWeight: z.number().min(0).max(10),
  edgeBandKm: z.number().min(0).max(100),
  zrA: z.number().min(10, 'Z–R a below 10 is outside published relations').max(2000),
  zrB: z.number().min(0.5).max(3),
  vilCapDbz: z.number().min(40).max(80),
  typeEdgesKm: z
    .tuple([z.number().min(0), z.number().min(0)])
    .refine(([a, b]) => a < b, 'The shallow edge must be below the deep edge'),
  typeHeight: z.enum(['echoTop', 'top35']),
  /** Blocks with less of their area inside coverage than this get "no data". */
  minBlockCoverage: z.number().min(0).max(1),
  /** A day counts for a time-of-day bin only with at least this share of expected scans. */
  minAvailability: z.number().min(0).max(1),
};

type SettingsShape = { [K in keyof typeof settingFields]: z.infer<(typeof settingFields)[K]> };

/** The design's defaults: 35 dBZ, 15 km³, 5 km² for 2-D input, two scans, 30 m/s, 2.5 intervals … */
export const DEFAULT_SITE_SETTINGS: SettingsShape = {
  thresholdDbz: 35,
  minVolumeKm3: 15,
  minAreaKm2: 5,
  minScans: 2,
  echoTopDbz: 0,
  coreDbz: 40,
  connectivity3d: 26,
  connectivity2d: 8,
  maxSpeedMs: 30,
  maxGapIntervals: 2.5,
  sizeWeight: 0.5,
  edgeBandKm: 10,
  zrA: 200,
  zrB: 1.6,
  vilCapDbz: 56,
  typeEdgesKm: [4, 9],
  typeHeight: 'echoTop',
  minBlockCoverage: 0.5,
  minAvailability: 0.8,
};

/** Whole settings: anything left out takes its default. */
export const SiteSettings = z
  .object(settingFields)
  .partial()
  .strict()
  .transform((given): SettingsShape => ({ ...DEFAULT_SITE_SETTINGS, ...given }) as SettingsShape);
export type SiteSettings = SettingsShape;

/** A change to some settings: only the keys given change; nothing is filled with defaults. */
export const SiteSettingsPatch = z.object(settingFields).partial().strict();
export type SiteSettingsPatch = z.infer<typeof SiteSettingsPatch>;

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
    settings: SiteSettingsPatch.optional(),
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
