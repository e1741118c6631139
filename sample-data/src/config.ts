/**
 * Fixed facts of the Vessary scenario and the parameters of its stochastic models.
 * Everything that the README explains lives here, so the numbers are in one place.
 */

export const SCENARIO_NAME = 'Vessary Province (invented)';
export const SEASON_YEAR = 2025;
/** First local date of the season and its default length (1 June – 30 September). */
export const SEASON_START_LOCAL = '2025-06-01';
export const SEASON_DAYS = 122;
/** Local time is UTC+06:00 all year (no daylight saving). */
export const UTC_OFFSET_MIN = 360;
export const UTC_OFFSET_TEXT = '+06:00';
export const DEFAULT_SEED = 2031;

/** Province centre and nominal extent (the outline is drawn around this). */
export const PROVINCE = {
  centerLon: 88.0,
  centerLat: 14.0,
  /** half-extent in km east–west and north–south of the outline's superellipse */
  halfWidthKm: 160,
  halfHeightKm: 136,
  superellipseExponent: 3.2,
  vertices: 120,
} as const;

/** Radar site (identification and tracking defaults of DESIGN.md §3.1–3.2). */
export const SITE = {
  code: 'VSR',
  name: 'Vessary Valley radar',
  lon: 87.95,
  lat: 14.18,
  altitudeM: 240,
  rangeKm: 180,
  scanIntervalMin: 6,
  /** CAPPI level heights above mean sea level, km (one GeoTIFF band each). */
  levelHeightsKm: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15],
  identification: {
    thresholdDbz: 35,
    minVolumeKm3: 15,
    minAreaKm2For2d: 5,
    echoTopThresholdDbz: 0,
    coreThresholdDbz: 40,
    connectivity3d: 26,
    connectivity2d: 8,
    zrA: 200,
    zrB: 1.6,
    vilCapDbz: 56,
  },
  tracking: {
    maxSpeedMS: 30,
    maxGapFactor: 2.5,
    minScans: 2,
    edgeBandKm: 10,
  },
  cellTypes: { shallowBelowKm: 4, deepFromKm: 9, heightUsed: 'echoTop' as const },
  coverage: { minBlockCoverageFraction: 0.5, minAvailability: 0.8 },
} as const;

/** Radar product grid: radar-centred azimuthal equidistant, 1 km, ±180 km. */
export const RADAR_GRID = {
  spacingKm: 1,
  halfSizeKm: 180,
  /** dBZ = raw × scale + offset; raw 255 is nodata (outside range), raw 0 is "no echo" (−32 dBZ). */
  scale: 0.5,
  offset: -32,
  nodataRaw: 255,
} as const;

/** Terrain GeoTIFF grid (EPSG:4326). */
export const TERRAIN_GRID = { west: 85.5, east: 90.5, south: 11.5, north: 16.5, step: 0.01 } as const;

/** Anomaly grid (EPSG:4326, 0.25°, pixel centres at the listed coordinates). */
export const ANOMALY_GRID = {
  west: 86.0,
  east: 90.0,
  south: 12.25,
  north: 15.75,
  step: 0.25,
  levelHpa: 850,
} as const;

/**
 * Anomaly-wind sectors by the direction the anomaly wind blows FROM (degrees from north, clockwise),
 * as suggested per-site flow classes for DESIGN.md §3.4. Winds under 1 m/s are "weak".
 */
export const FLOW_SECTORS = [
  { name: 'onshore', fromDeg: 100, toDeg: 190 },
  { name: 'along-shore', fromDeg: 190, toDeg: 280 },
  { name: 'offshore', fromDeg: 280, toDeg: 10 },
  { name: 'along-shore', fromDeg: 10, toDeg: 100 },
] as const;
export const WEAK_FLOW_MS = 1;

/** Parameters of the daily anomaly model (see README "Anomalies"). */
export const ANOMALY_PARAMS = {
  /** flow regimes (Markov chain states): the anomaly wind's from-direction (deg) and speed (m/s) */
  regimes: [
    { name: 'SE', fromDeg: 145, speedMS: 3.0, qShift: 0.8 },
    { name: 'SW', fromDeg: 235, speedMS: 2.6, qShift: 0.3 },
    { name: 'NW', fromDeg: 325, speedMS: 3.0, qShift: -1.0 },
    { name: 'NE', fromDeg: 55, speedMS: 2.2, qShift: -0.3 },
    { name: 'weak', fromDeg: 0, speedMS: 0.3, qShift: 0 },
  ],
  /** probability that a day keeps the previous day's flow regime */
  regimePersistence: 0.78,
  /** starting weights of the regimes (wet-season climatology: SE most common) */
  regimeWeights: [0.34, 0.2, 0.18, 0.13, 0.15],
  /** day-to-day noise of the domain-mean wind anomaly, m/s per component */
  windNoiseMS: 0.7,
  /** the moisture anomaly follows the regime's qShift with lag: m ← lag·m + (1 − lag)·qGain·qShift */
  qLag: 0.6,
  qGain: 1.6,
  /** AR(1) coefficient and innovation σ (g/kg) of the rest of the moisture anomaly */
  qAr: 0.72,
  qInnovation: 0.62,
  /** large-scale gradients across the grid: σ per degree, and AR(1) coefficient */
  gradientSigma: { q: 0.25, wind: 0.35 },
  gradientAr: 0.6,
  /** small-scale texture (σ) */
  textureSigma: { q: 0.12, wind: 0.25 },
} as const;

/**
 * Forecast anomaly grids of one coming week right after the season (a moist south-easterly spell), for
 * the Outlook's expected regime. Drawn from their own random stream, so the season's files do not change.
 */
export const FORECAST_WEEK = {
  firstDate: '2025-10-01',
  days: 7,
  /** domain-mean q′ (g/kg) of the spell and its day-to-day spread */
  qMeanGKg: 1.4,
  qSigmaGKg: 0.3,
  /** the anomaly wind blows from the south-east (onshore), with a little scatter of direction and speed */
  fromDeg: 145,
  fromSigmaDeg: 12,
  speedMS: 3.2,
} as const;

/** Parameters of the convective-cell population (see README "Storm model"). */
export const STORM_PARAMS = {
  /** model domain: births anywhere within this distance of the radar (km); cells die beyond domainKm + 20 */
  domainKm: 225,
  /** mean low-level flow of the wet season (blowing from, deg; m/s), used for upslope forcing */
  climFlowFromDeg: 135,
  climFlowMS: 4.5,
  /** storm motion: the steering flow (toward the north-west) plus a share of the day's anomaly wind */
  motionTowardDeg: 312,
  motionMS: 3.4,
  motionAnomalyShare: 0.45,
  motionSpreadMS: 1.15,
  /** expected births per day at day-factor 1, by component (integral of the diurnal shape = 1) */
  birthsPerDay: { hill: 18, valleyEvening: 3.6, lakeNight: 2.0, background: 3.2 },
  /** diurnal shapes (local hours): asymmetric Gaussian peaks */
  diurnal: {
    hill: { peak: 14.2, rise: 1.6, fall: 2.0, start: 9.5 },
    valleyEvening: { peak: 17.8, rise: 1.4, fall: 1.8, start: 13 },
    lakeNight: { peak: 2.8, rise: 2.0, fall: 2.0, start: -99 },
    background: { peak: 15.5, rise: 4.0, fall: 4.0, start: -99, floor: 0.25 },
  },
  /** hills: weight = heightRamp × (slopeBase + slope/slopeRef) × exp(upslopeGain × upslope wind) */
  hillHeightFromM: 330,
  hillHeightToM: 700,
  slopeBase: 0.25,
  slopeRefMPerKm: 20,
  upslopeGain: 0.32,
  /** day factor = exp(moistureGain × q′ + onshoreGain × c′), c′ = anomaly wind component toward onshoreTowardDeg */
  moistureGain: 0.5,
  onshoreGain: 0.12,
  onshoreTowardDeg: 315,
  /** cell properties at peak: log-normal medians and σ of ln (a shared latent "vigour" correlates them) */
  peakAreaMedianKm2: 26,
  peakAreaSigma: 0.72,
  lifetimeMedianMin: 52,
  lifetimeSigma: 0.5,
  top35MedianKm: 6.3,
  top35Sigma: 0.2,
  echoTopExcessMedianKm: 3.0,
  echoTopExcessSigma: 0.3,
  peakDbzMean: 47,
  peakDbzSigma: 4.5,
  /** shares of events */
  splitChance: 0.13,
  mergePairChance: 0.06,
  /** births closer than this (km, beyond both footprints) to an existing cell are redrawn */
  birthClearanceKm: 6,
  /** footprints closer than this (km) merge: the tracker would see one region */
  touchGapKm: 2.5,
} as const;

/** Parameters of the radar availability model (see README "Outages"). */
export const OUTAGE_PARAMS = {
  isolatedMissingChance: 0.004,
  shortOutagesPerDay: 0.05,
  shortOutageScans: [2, 10] as const,
  longOutageHours: [5, 8] as const,
  longOutageDayFraction: 0.55,
  longOutageStartLocalHour: [10.5, 12.5] as const,
} as const;

/** The rendered radar run. */
export const RUN_DEFAULTS = { startLocalHour: 12, hours: 3, committedVolumes: 5 } as const;

export function levelThicknessKm(levels: readonly number[]): number[] {
  // Layer of each level: half-way to its neighbours (edge levels mirror their single neighbour).
  return levels.map((h, k) => {
    const below = k > 0 ? (h - levels[k - 1]) / 2 : k + 1 < levels.length ? (levels[k + 1] - h) / 2 : 0.5;
    const above = k + 1 < levels.length ? (levels[k + 1] - h) / 2 : below;
    return below + above;
  });
}
