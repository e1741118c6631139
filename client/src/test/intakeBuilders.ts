import {
  type CellView,
  DEFAULT_SITE_SETTINGS,
  type JobView,
  type QualityReport,
  type SiteView,
  type TrackView,
} from '@stormhour/shared';

// Invented sites, tracks and jobs of the demo province; no real radar or observation.

export function aSite(overrides: Partial<SiteView> = {}): SiteView {
  return {
    id: 1,
    code: 'VSR',
    name: 'Vessary Valley',
    lat: 14.2,
    lon: 88.1,
    altitudeM: 240,
    rangeKm: 180,
    intervalMin: 6,
    utcOffsetMinutes: 360,
    blockedSectors: [],
    settingsVersion: 1,
    settings: DEFAULT_SITE_SETTINGS,
    ...overrides,
  };
}

export function aReport(overrides: Partial<QualityReport> = {}): QualityReport {
  return {
    filesRead: 3,
    filesSkipped: 0,
    duplicates: 0,
    scans: 3,
    cellsFound: 0,
    cellsRejectedTooSmall: 0,
    cellsOutsideCoverage: 0,
    tracks: 0,
    storms: 0,
    onsets: 0,
    flaggedStarts: { split: 0, 'data-start': 0, 'after-gap': 0, 'edge-band': 0 },
    gaps: [],
    cellsPerScan: [],
    availabilityByDay: [],
    ...overrides,
  };
}

export function aJob(overrides: Partial<JobView> = {}): JobView {
  return {
    id: 11,
    kind: 'volume',
    state: 'queued',
    progress: 0,
    stage: null,
    params: { siteId: 1, onError: 'skip' },
    files: [],
    report: null,
    summary: null,
    problems: [],
    error: null,
    createdAt: '2026-07-14T03:00:00.000Z',
    startedAt: null,
    finishedAt: null,
    ...overrides,
  };
}

export function aTrack(overrides: Partial<TrackView> = {}): TrackView {
  return {
    id: 101,
    siteId: 1,
    source: 'volume',
    externalId: null,
    firstTime: '2026-07-14T09:42:00.000Z',
    lastTime: '2026-07-14T10:30:00.000Z',
    scanCount: 9,
    durationMin: 54,
    speedMs: 6.2,
    directionToDeg: 315,
    isStorm: true,
    onset: true,
    notOnsetReason: null,
    parentTrackId: null,
    mergedIntoTrackId: null,
    startLat: 14.05,
    startLon: 88.05,
    startBlockId: 1,
    startBlockCode: 'RVB-01',
    maxVolumeKm3: 410.5,
    maxAreaKm2: 120,
    maxEchoTopKm: 12.5,
    cellType: 'deep',
    settingsVersion: 1,
    ...overrides,
  };
}

export function aCell(overrides: Partial<CellView> = {}): CellView {
  return {
    id: 1001,
    scanTime: '2026-07-14T09:42:00.000Z',
    trackId: 101,
    lat: 14.05,
    lon: 88.05,
    areaKm2: 40,
    volumeKm3: 120,
    maxDbz: 52,
    top35Km: 8,
    echoTopKm: 11,
    coreVolumeKm3: 20,
    vilMaxKgM2: 18,
    rainRateMaxMmH: 40,
    precipFluxM3s: 300,
    semiMajorKm: 5,
    semiMinorKm: 3,
    orientationDeg: 30,
    cellType: 'deep',
    blockId: 1,
    ...overrides,
  };
}
