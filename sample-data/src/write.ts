import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  ANOMALY_DECIMALS,
  ANOMALY_QUANTITIES,
  ANOMALY_UNITS,
  ANOMALY_VARIABLES,
  type AnomalyGrids,
  generateForecastAnomalies,
  windFromDeg,
} from './anomalies.js';
import { measureCell } from './cellprops.js';
import {
  ANOMALY_GRID,
  ANOMALY_PARAMS,
  DEFAULT_SEED,
  FLOW_SECTORS,
  levelThicknessKm,
  OUTAGE_PARAMS,
  PROVINCE,
  RADAR_GRID,
  RUN_DEFAULTS,
  SCENARIO_NAME,
  SEASON_YEAR,
  SITE,
  STORM_PARAMS,
  TERRAIN_GRID,
  UTC_OFFSET_MIN,
  UTC_OFFSET_TEXT,
  WEAK_FLOW_MS,
} from './config.js';
import { cropCalendarCsv } from './crop-calendars.js';
import { fmt, fromLocalKm } from './geo.js';
import { readAnomalyCsv, readCellTable, readScanInventory } from './readers.js';
import { columnMax, interleave, radarGrid, renderVolume } from './render.js';
import type { Scenario } from './scenario.js';
import {
  coverageMeansFromRecords,
  flowClass,
  type RegimeSkill,
  regimeSkill,
  type SeasonStatistics,
  seasonStatistics,
  summariseTracks,
} from './stats.js';
import { semiMajor } from './storms.js';
import { aeqdKeys, encodeGeoTiff, type GdalItem, gdalMetadataXml, geographicKeys } from './tiff.js';
import { fileStamp, isoUtc, localDateOf } from './times.js';

export const GENERATOR_VERSION = '1.0.0';

export interface WriteOptions {
  /** how many 3-D volumes of the run to write (the stormiest consecutive scans); 'all' for every scan */
  volumes?: number | 'all';
  /** remove the output directory first */
  clean?: boolean;
}

export interface WrittenFile {
  path: string;
  bytes: number;
}

export interface WriteResult {
  files: WrittenFile[];
  statistics: SeasonStatistics;
  regimeSkill: RegimeSkill;
}

const round6 = (v: number) => Number(fmt(v, 6));

/** Site description (see README "site.json"). */
export function siteJson(): Record<string, unknown> {
  return {
    schemaVersion: 1,
    siteCode: SITE.code,
    name: SITE.name,
    location: { lat: SITE.lat, lon: SITE.lon },
    altitudeM: SITE.altitudeM,
    rangeKm: SITE.rangeKm,
    scanIntervalMin: SITE.scanIntervalMin,
    utcOffset: UTC_OFFSET_TEXT,
    levelHeightsKm: SITE.levelHeightsKm,
    levelHeightReference: 'above mean sea level',
    grid: {
      projection: 'azimuthal equidistant, radar-centred, WGS 84',
      proj4: `+proj=aeqd +lat_0=${SITE.lat} +lon_0=${SITE.lon} +datum=WGS84 +units=m +no_defs`,
      spacingKm: RADAR_GRID.spacingKm,
      halfSizeKm: RADAR_GRID.halfSizeKm,
    },
    identification: {
      thresholdDbz: SITE.identification.thresholdDbz,
      minVolumeKm3: SITE.identification.minVolumeKm3,
      minAreaKm2For2d: SITE.identification.minAreaKm2For2d,
      echoTopThresholdDbz: SITE.identification.echoTopThresholdDbz,
      coreThresholdDbz: SITE.identification.coreThresholdDbz,
      connectivity3d: SITE.identification.connectivity3d,
      connectivity2d: SITE.identification.connectivity2d,
      zrA: SITE.identification.zrA,
      zrB: SITE.identification.zrB,
      vilCapDbz: SITE.identification.vilCapDbz,
    },
    tracking: {
      maxSpeedMS: SITE.tracking.maxSpeedMS,
      maxGapFactor: SITE.tracking.maxGapFactor,
      maxGapMin: SITE.tracking.maxGapFactor * SITE.scanIntervalMin,
      minScans: SITE.tracking.minScans,
      edgeBandKm: SITE.tracking.edgeBandKm,
    },
    cellTypes: {
      shallowBelowKm: SITE.cellTypes.shallowBelowKm,
      deepFromKm: SITE.cellTypes.deepFromKm,
      heightUsed: SITE.cellTypes.heightUsed,
    },
    coverage: {
      minBlockCoverageFraction: SITE.coverage.minBlockCoverageFraction,
      minAvailability: SITE.coverage.minAvailability,
    },
    flowSectors: {
      basis: 'direction the 850 hPa anomaly wind blows from, degrees clockwise from north',
      weakBelowMS: WEAK_FLOW_MS,
      sectors: FLOW_SECTORS.map((s) => ({ name: s.name, fromDeg: s.fromDeg, toDeg: s.toDeg })),
    },
    createSiteRequest: createSiteRequest(),
  };
}

/** The same site as the body of the server's CreateSiteRequest (shared/src/radar.ts), for the demo seeder. */
export function createSiteRequest(): Record<string, unknown> {
  const id = SITE.identification;
  const tr = SITE.tracking;
  return {
    code: SITE.code,
    name: SITE.name,
    lat: SITE.lat,
    lon: SITE.lon,
    altitudeM: SITE.altitudeM,
    rangeKm: SITE.rangeKm,
    intervalMin: SITE.scanIntervalMin,
    utcOffsetMinutes: UTC_OFFSET_MIN,
    blockedSectors: [],
    settings: {
      thresholdDbz: id.thresholdDbz,
      minVolumeKm3: id.minVolumeKm3,
      minAreaKm2: id.minAreaKm2For2d,
      minScans: tr.minScans,
      echoTopDbz: id.echoTopThresholdDbz,
      coreDbz: id.coreThresholdDbz,
      connectivity3d: id.connectivity3d,
      connectivity2d: id.connectivity2d,
      maxSpeedMs: tr.maxSpeedMS,
      maxGapIntervals: tr.maxGapFactor,
      edgeBandKm: tr.edgeBandKm,
      zrA: id.zrA,
      zrB: id.zrB,
      vilCapDbz: id.vilCapDbz,
      typeEdgesKm: [SITE.cellTypes.shallowBelowKm, SITE.cellTypes.deepFromKm],
      typeHeight: SITE.cellTypes.heightUsed,
      minBlockCoverage: SITE.coverage.minBlockCoverageFraction,
      minAvailability: SITE.coverage.minAvailability,
    },
  };
}

function blocksText(sc: Scenario): string {
  const head = `{"type":"FeatureCollection","name":${JSON.stringify(sc.blocks.name)},"features":[\n`;
  const body = sc.blocks.features.map((f) => JSON.stringify(f)).join(',\n');
  return `${head}${body}\n]}\n`;
}

function lakeText(sc: Scenario): string {
  const L = sc.terrain.lake;
  const a = (L.rotationDeg * Math.PI) / 180;
  const ring: [number, number][] = [];
  for (let k = 0; k < 72; k++) {
    const t = (2 * Math.PI * k) / 72;
    const u = L.semiMajorKm * Math.cos(t);
    const v = L.semiMinorKm * Math.sin(t);
    const x = L.x + u * Math.cos(a) - v * Math.sin(a);
    const y = L.y + u * Math.sin(a) + v * Math.cos(a);
    const [lon, lat] = fromLocalKm(x, y, PROVINCE.centerLon, PROVINCE.centerLat);
    ring.push([round6(lon), round6(lat)]);
  }
  ring.push(ring[0]);
  const f = {
    type: 'Feature',
    properties: { name: 'Lake (invented)', surface_m: L.levelM },
    geometry: { type: 'Polygon', coordinates: [ring] },
  };
  return `{"type":"FeatureCollection","features":[\n${JSON.stringify(f)}\n]}\n`;
}

function terrainTiff(sc: Scenario): Buffer {
  const g = TERRAIN_GRID;
  const width = Math.round((g.east - g.west) / g.step);
  const height = Math.round((g.north - g.south) / g.step);
  const data = new Int16Array(width * height);
  for (let j = 0; j < height; j++) {
    const lat = g.north - (j + 0.5) * g.step;
    for (let i = 0; i < width; i++) {
      data[j * width + i] = Math.round(sc.terrain.elevation(g.west + (i + 0.5) * g.step, lat));
    }
  }
  return encodeGeoTiff({
    width,
    height,
    bands: 1,
    data,
    pixelScale: [g.step, g.step],
    origin: [g.west, g.north],
    geoKeys: geographicKeys(),
    gdalMetadataXml: gdalMetadataXml([
      { name: 'QUANTITY', value: 'elevation' },
      { name: 'UNITS', value: 'm' },
      { name: 'VERTICAL_REFERENCE', value: 'above mean sea level' },
      { name: 'SCENARIO', value: SCENARIO_NAME },
      { name: 'DESCRIPTION', sample: 0, role: 'description', value: 'elevation (m)' },
    ]),
  });
}

function cellTableText(sc: Scenario): string {
  const lines = [
    'scan_time_utc,track_id,lat,lon,area_km2,volume_km3,max_dbz,top35_km,echo_top_km,core40_km3,vil_max_kg_m2,parent_track_id,merged_into_track_id,max_dbz_height_km',
  ];
  for (const r of sc.rows) {
    const m = r.measure;
    lines.push(
      [
        isoUtc(sc.clock.timeOf(r.step)),
        r.trackId,
        fmt(r.lat, 5),
        fmt(r.lon, 5),
        fmt(m.areaKm2, 2),
        fmt(m.volumeKm3, 2),
        fmt(m.maxDbz, 1),
        fmt(m.top35Km, 1),
        fmt(m.echoTopKm, 1),
        fmt(m.core40Km3, 2),
        fmt(m.vilMaxKgM2, 2),
        r.parentTrackId ?? '',
        r.mergedIntoTrackId ?? '',
        fmt(m.maxDbzHeightKm, 1),
      ].join(','),
    );
  }
  return `${lines.join('\n')}\n`;
}

function scanInventoryText(sc: Scenario): string {
  const counts = new Map<number, number>();
  for (const r of sc.rows) counts.set(r.step, (counts.get(r.step) ?? 0) + 1);
  const lines = ['scan_time_utc,cell_count'];
  for (let k = 0; k < sc.clock.nScans; k++) {
    if (sc.present[k]) lines.push(`${isoUtc(sc.clock.timeOf(k))},${counts.get(k) ?? 0}`);
  }
  return `${lines.join('\n')}\n`;
}

function anomalyCsvText(sc: Scenario): string {
  const A = sc.anomalies;
  const lines = ['date,lat,lon,variable,level_hpa,value'];
  const latsAsc = A.lats.map((lat, j) => ({ lat, j })).sort((a, b) => a.lat - b.lat);
  A.dates.forEach((date, d) => {
    for (const v of ANOMALY_VARIABLES) {
      const f = A.fields[v][d];
      for (const { lat, j } of latsAsc) {
        A.lons.forEach((lon, i) => {
          lines.push(
            `${date},${fmt(lat, 2)},${fmt(lon, 2)},${v},${ANOMALY_GRID.levelHpa},${fmt(f[j * A.lons.length + i], ANOMALY_DECIMALS[v])}`,
          );
        });
      }
    }
  });
  return `${lines.join('\n')}\n`;
}

function anomalyTiff(
  A: Pick<AnomalyGrids, 'dates' | 'lons' | 'lats' | 'fields'>,
  v: (typeof ANOMALY_VARIABLES)[number],
  product?: string,
): Buffer {
  const nx = A.lons.length;
  const ny = A.lats.length;
  const bands = A.dates.length;
  const data = new Float32Array(nx * ny * bands);
  A.dates.forEach((_, d) => {
    const f = A.fields[v][d];
    for (let q = 0; q < nx * ny; q++) data[q * bands + d] = f[q];
  });
  const step = ANOMALY_GRID.step;
  const items: GdalItem[] = [
    { name: 'VARIABLE', value: v },
    { name: 'QUANTITY', value: ANOMALY_QUANTITIES[v] },
    { name: 'UNITS', value: ANOMALY_UNITS[v] },
    { name: 'LEVEL_HPA', value: ANOMALY_GRID.levelHpa },
    { name: 'DATES', value: A.dates.join(',') },
    { name: 'DATE_REFERENCE', value: `local dates (UTC${UTC_OFFSET_TEXT}), daily means` },
    { name: 'SCENARIO', value: SCENARIO_NAME },
  ];
  if (product) items.push({ name: 'PRODUCT', value: product });
  A.dates.forEach((date, d) => {
    items.push({ name: 'DATE', sample: d, value: date });
    items.push({ name: 'DESCRIPTION', sample: d, role: 'description', value: date });
  });
  return encodeGeoTiff({
    width: nx,
    height: ny,
    bands,
    data,
    pixelScale: [step, step],
    origin: [A.lons[0] - step / 2, A.lats[0] + step / 2],
    geoKeys: geographicKeys(),
    gdalMetadataXml: gdalMetadataXml(items),
  });
}

function radarTiff(sc: Scenario, raw: Uint8Array, step: number, kind: 'volume' | 'cmax'): Buffer {
  const v = radarGrid();
  const bands = kind === 'volume' ? v.levelsKm.length : 1;
  const scan = isoUtc(sc.clock.timeOf(step));
  const items: GdalItem[] = [
    {
      name: 'PRODUCT',
      value: kind === 'volume' ? 'CAPPI reflectivity volume' : 'column maximum reflectivity',
    },
    { name: 'QUANTITY', value: 'reflectivity' },
    { name: 'UNITS', value: 'dBZ' },
    { name: 'SCAN_TIME_UTC', value: scan },
    { name: 'SITE', value: SITE.code },
    { name: 'SITE_LAT', value: SITE.lat },
    { name: 'SITE_LON', value: SITE.lon },
    { name: 'RANGE_KM', value: SITE.rangeKm },
    { name: 'PROJ4', value: sc.projection.proj4 },
    { name: 'SCALE', value: v.scale },
    { name: 'OFFSET', value: v.offset },
    { name: 'NODATA_RAW', value: v.nodataRaw },
    { name: 'NO_ECHO_RAW', value: 0 },
    { name: 'LEVEL_HEIGHTS_KM', value: kind === 'volume' ? v.levelsKm.join(',') : '' },
    { name: 'LEVEL_HEIGHT_REFERENCE', value: 'above mean sea level' },
    { name: 'SCENARIO', value: SCENARIO_NAME },
  ];
  if (kind === 'cmax') items.splice(13, 2, { name: 'COLUMN_OF_LEVELS_KM', value: v.levelsKm.join(',') });
  for (let b = 0; b < bands; b++) {
    if (kind === 'volume') items.push({ name: 'HEIGHT_KM', sample: b, value: v.levelsKm[b] });
    items.push({
      name: 'DESCRIPTION',
      sample: b,
      role: 'description',
      value: kind === 'volume' ? `${v.levelsKm[b]} km` : 'column maximum',
    });
    items.push({ name: 'SCALE', sample: b, role: 'scale', value: v.scale });
    items.push({ name: 'OFFSET', sample: b, role: 'offset', value: v.offset });
  }
  return encodeGeoTiff({
    width: v.nx,
    height: v.ny,
    bands,
    data: kind === 'volume' ? interleave(raw, v.nx * v.ny, bands) : raw,
    pixelScale: [v.spacingKm * 1000, v.spacingKm * 1000],
    origin: v.originM,
    geoKeys: aeqdKeys(SITE.lat, SITE.lon, `${SITE.name} azimuthal equidistant; ${sc.projection.proj4}`),
    gdalMetadataXml: gdalMetadataXml(items),
    gdalNodata: String(v.nodataRaw),
  });
}

function truthText(sc: Scenario, steps: number[]): string {
  const lines = [
    'scan_time_utc,track_id,model_cell_id,in_cell_table,lat,lon,x_km,y_km,area_km2,volume_km3,max_dbz,top35_km,echo_top_km,core40_km3,vil_max_kg_m2,parent_track_id,merged_into_track_id,max_dbz_height_km,semi_major_km,semi_minor_km,orientation_deg,peak_dbz,hmax_km,top35_exact_km,echo_top_exact_km,truncated_by_range',
  ];
  const levels = SITE.levelHeightsKm;
  const thickness = levelThicknessKm(levels);
  for (const step of steps) {
    const inTable = new Map(sc.rows.filter((r) => r.step === step).map((r) => [r.modelCellId, r]));
    const entries = sc
      .statesAt(step)
      .map((s) => {
        const r = inTable.get(s.cellId);
        const m = r ? r.measure : measureCell(s, levels, thickness, SITE.rangeKm);
        return { s, r, m };
      })
      .filter((e) => e.r || e.m.areaKm2 > 0)
      .sort((a, b) => (a.r?.trackId ?? 1e9) - (b.r?.trackId ?? 1e9) || a.s.cellId - b.s.cellId);
    for (const { s, r, m } of entries) {
      const a = semiMajor(s.areaKm2, s.axisRatio);
      const [lon, lat] = r ? [r.lon, r.lat] : sc.projection.toLonLat(m.x, m.y);
      lines.push(
        [
          isoUtc(sc.clock.timeOf(step)),
          r?.trackId ?? '',
          s.cellId,
          r ? 1 : 0,
          fmt(lat, 6),
          fmt(lon, 6),
          fmt(m.x, 4),
          fmt(m.y, 4),
          fmt(m.areaKm2, 3),
          fmt(m.volumeKm3, 3),
          fmt(m.maxDbz, 2),
          fmt(m.top35Km, 1),
          fmt(m.echoTopKm, 1),
          fmt(m.core40Km3, 3),
          fmt(m.vilMaxKgM2, 3),
          r?.parentTrackId ?? '',
          r?.mergedIntoTrackId ?? '',
          fmt(m.maxDbzHeightKm, 1),
          fmt(a, 4),
          fmt(a * s.axisRatio, 4),
          fmt(s.orientationDeg, 2),
          fmt(s.peakDbz, 2),
          fmt(s.hmaxKm, 3),
          fmt(s.top35Km, 3),
          fmt(s.echoTopKm, 3),
          m.truncated ? 1 : 0,
        ].join(','),
      );
    }
  }
  return `${lines.join('\n')}\n`;
}

/** The stormiest run of n consecutive scans of the radar run (ties: earliest). */
export function volumeSteps(sc: Scenario, n: number | 'all'): number[] {
  const steps = sc.run.steps;
  if (n === 'all' || n >= steps.length) return steps.slice();
  if (n <= 0) return [];
  const count = new Map<number, number>();
  for (const r of sc.rows) count.set(r.step, (count.get(r.step) ?? 0) + 1);
  let best = 0;
  let bestScore = -1;
  for (let i = 0; i + n <= steps.length; i++) {
    const score = steps.slice(i, i + n).reduce((s, k) => s + (count.get(k) ?? 0), 0);
    if (score > bestScore) {
      bestScore = score;
      best = i;
    }
  }
  return steps.slice(best, best + n);
}

/** Writes every file of the scenario into outDir. Same scenario and options → byte-identical files. */
export function writeScenario(sc: Scenario, outDir: string, options: WriteOptions = {}): WriteResult {
  if (options.clean) rmSync(outDir, { recursive: true, force: true });
  mkdirSync(outDir, { recursive: true });
  const files: WrittenFile[] = [];
  const put = (rel: string, content: string | Buffer) => {
    const p = join(outDir, rel);
    writeFileSync(p, content);
    files.push({
      path: rel,
      bytes: typeof content === 'string' ? Buffer.byteLength(content) : content.length,
    });
  };
  const year = SEASON_YEAR;
  put('site.json', `${JSON.stringify(siteJson(), null, 2)}\n`);
  put('blocks.geojson', blocksText(sc));
  put('lake.geojson', lakeText(sc));
  put('crop-calendars.csv', cropCalendarCsv());
  put('terrain.tif', terrainTiff(sc));
  const cellsCsv = cellTableText(sc);
  const scansCsv = scanInventoryText(sc);
  const anomCsv = anomalyCsvText(sc);
  put(`cells-${year}.csv`, cellsCsv);
  put(`scans-${year}.csv`, scansCsv);
  put(`anomalies-${year}.csv`, anomCsv);
  for (const v of ANOMALY_VARIABLES)
    put(`anomalies-${year}-${v}${ANOMALY_GRID.levelHpa}.tif`, anomalyTiff(sc.anomalies, v));
  // The coming week's forecast grids, after the season (their own random stream).
  const forecast = generateForecastAnomalies(sc.seed);
  for (const v of ANOMALY_VARIABLES)
    put(
      `forecast-${forecast.dates[0]}-${v}${ANOMALY_GRID.levelHpa}.tif`,
      anomalyTiff(forecast, v, 'forecast: daily mean anomalies of a coming week'),
    );

  // The radar run: column maxima for every scan, volumes for the stormiest consecutive scans.
  const runDir = `run-${sc.run.localDate.replaceAll('-', '')}`;
  mkdirSync(join(outDir, runDir), { recursive: true });
  const withVolume = new Set(volumeSteps(sc, options.volumes ?? RUN_DEFAULTS.committedVolumes));
  const runScans: Record<string, unknown>[] = [];
  for (const step of sc.run.steps) {
    const vol = renderVolume(sc, step);
    const stamp = fileStamp(sc.clock.timeOf(step));
    const cmaxName = `${runDir}/cmax-${stamp}.tif`;
    put(cmaxName, radarTiff(sc, columnMax(vol), step, 'cmax'));
    let volumeName: string | null = null;
    if (withVolume.has(step)) {
      volumeName = `${runDir}/volume-${stamp}.tif`;
      put(volumeName, radarTiff(sc, vol.raw, step, 'volume'));
    }
    runScans.push({
      scanTimeUtc: isoUtc(sc.clock.timeOf(step)),
      columnMaxFile: cmaxName.slice(runDir.length + 1),
      volumeFile: volumeName ? volumeName.slice(runDir.length + 1) : null,
      cells: sc.rows.filter((r) => r.step === step).length,
    });
  }
  put(`${runDir}/truth-cells.csv`, truthText(sc, sc.run.steps));
  const g = radarGrid();
  put(
    `${runDir}/run.json`,
    `${JSON.stringify(
      {
        localDate: sc.run.localDate,
        siteCode: SITE.code,
        scanIntervalMin: SITE.scanIntervalMin,
        scans: runScans,
        grid: {
          crs: 'user-defined azimuthal equidistant (GeoKeys: ProjectedCSTypeGeoKey 32767, ProjCoordTransGeoKey 12)',
          proj4: sc.projection.proj4,
          width: g.nx,
          height: g.ny,
          pixelSizeM: g.spacingKm * 1000,
          upperLeftCornerM: g.originM,
          pixelCentresKm: `x = -${RADAR_GRID.halfSizeKm} … ${RADAR_GRID.halfSizeKm} (west → east), y = ${RADAR_GRID.halfSizeKm} … -${RADAR_GRID.halfSizeKm} (north → south)`,
        },
        levelsKm: g.levelsKm,
        encoding: {
          sampleType: 'uint8',
          dbz: 'raw × scale + offset',
          scale: g.scale,
          offset: g.offset,
          nodataRaw: g.nodataRaw,
          noEchoRaw: 0,
        },
        truthFile: 'truth-cells.csv',
      },
      null,
      2,
    )}\n`,
  );

  // Statistics, computed from the files as written (their rounded values), for scenario.json.
  const cells = readCellTable(cellsCsv);
  const scans = readScanInventory(scansCsv);
  const means = coverageMeansFromRecords(readAnomalyCsv(anomCsv));
  const tg = TERRAIN_GRID;
  const tw = Math.round((tg.east - tg.west) / tg.step);
  const th = Math.round((tg.north - tg.south) / tg.step);
  const elev = new Float64Array(tw * th);
  for (let j = 0; j < th; j++)
    for (let i = 0; i < tw; i++)
      elev[j * tw + i] = Math.round(
        sc.terrain.elevation(tg.west + (i + 0.5) * tg.step, tg.north - (j + 0.5) * tg.step),
      );
  const statistics = seasonStatistics({
    cells,
    scans,
    nominalScans: sc.clock.nScans,
    dates: sc.clock.dates,
    terrain: { west: tg.west, north: tg.north, step: tg.step, width: tw, height: th, elevation: elev },
    isLake: (lon, lat) => sc.terrain.isLake(lon, lat),
    dailyMeans: means,
  });

  const daily = sc.clock.dates.map((date, d) => {
    const m = means.get(date) ?? sc.anomalies.coverageMeans[d];
    return {
      date,
      qAnomalyGKg: Number(fmt(m.q, 3)),
      uAnomalyMS: Number(fmt(m.u, 2)),
      vAnomalyMS: Number(fmt(m.v, 2)),
      anomalyWindFromDeg: Number(fmt(windFromDeg(m.u, m.v), 1)),
      flowClass: flowClass(m.u, m.v),
      hiddenRegime: sc.anomalies.regimes[d],
      stormDayFactor: Number(fmt(sc.dayFactors[d], 3)),
      onsets: 0,
    };
  });
  const summaries = summariseTracks(cells, scans);
  const skill = regimeSkill({
    onsets: summaries.filter((t) => t.isOnset),
    blocks: sc.blocks.features.map((f) => ({
      polygons: f.geometry.type === 'Polygon' ? [f.geometry.coordinates] : f.geometry.coordinates,
    })),
    dates: sc.clock.dates,
    dailyMeans: means,
    scans,
    shuffleSeed: sc.seed,
  });
  for (const t of summaries) {
    if (!t.isOnset) continue;
    const d = sc.clock.dates.indexOf(localDateOf(t.firstMs));
    if (d >= 0) daily[d].onsets++;
  }
  put(
    'scenario.json',
    `${JSON.stringify(
      {
        scenario: SCENARIO_NAME,
        generator: `@stormhour/sample-data ${GENERATOR_VERSION}`,
        prng: 'sfc32 seeded by FNV-1a + splitmix32, one named stream per part',
        seed: sc.seed,
        defaultSeed: DEFAULT_SEED,
        days: sc.days,
        firstLocalDate: sc.clock.dates[0],
        lastLocalDate: sc.clock.dates[sc.clock.dates.length - 1],
        utcOffset: UTC_OFFSET_TEXT,
        firstScanUtc: isoUtc(sc.clock.timeOf(0)),
        lastNominalScanUtc: isoUtc(sc.clock.timeOf(sc.clock.nScans - 1)),
        radarRun: {
          localDate: sc.run.localDate,
          directory: runDir,
          scans: sc.run.steps.length,
          volumes: withVolume.size,
        },
        outages: sc.outages,
        statistics,
        regimeSkill: skill,
        daily,
        parameters: { storms: STORM_PARAMS, anomalies: ANOMALY_PARAMS, outages: OUTAGE_PARAMS },
      },
      null,
      2,
    )}\n`,
  );
  return { files, statistics, regimeSkill: skill };
}
