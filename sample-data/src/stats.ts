import { windFromDeg } from './anomalies.js';
import { FLOW_SECTORS, SITE, WEAK_FLOW_MS } from './config.js';
import { RadarProjection } from './geo.js';
import type { AnomalyRecord, CellRecord, ScanRecord } from './readers.js';
import { TERRAIN_CLASSES } from './terrain.js';
import { localDateOf, localHourOf, SCAN_MS } from './times.js';

export interface TrackSummary {
  trackId: number;
  rows: CellRecord[];
  scans: number;
  firstMs: number;
  lastMs: number;
  durationMin: number;
  speedMS: number | null;
  /** direction of motion (toward), degrees from north */
  towardDeg: number | null;
  isStorm: boolean;
  flags: { splitChild: boolean; afterGap: boolean; dataStart: boolean; edgeBand: boolean };
  /** a storm that passes all the onset rules of DESIGN.md §3.2 */
  isOnset: boolean;
  firstRangeKm: number;
}

/** Tracks and onsets from a cell table and scan inventory, by the rules of DESIGN.md §3.2. */
export function summariseTracks(cells: CellRecord[], scans: ScanRecord[]): TrackSummary[] {
  const proj = new RadarProjection(SITE.lat, SITE.lon);
  const maxGapMs = SITE.tracking.maxGapFactor * SCAN_MS;
  const scanTimes = scans.map((s) => s.scanMs).sort((a, b) => a - b);
  const prevScan = (ms: number): number | null => {
    let lo = 0;
    let hi = scanTimes.length - 1;
    let ans: number | null = null;
    while (lo <= hi) {
      const mid = (lo + hi) >> 1;
      if (scanTimes[mid] < ms) {
        ans = scanTimes[mid];
        lo = mid + 1;
      } else hi = mid - 1;
    }
    return ans;
  };
  const byTrack = new Map<number, CellRecord[]>();
  for (const c of cells) {
    const l = byTrack.get(c.trackId);
    if (l) l.push(c);
    else byTrack.set(c.trackId, [c]);
  }
  const out: TrackSummary[] = [];
  for (const [trackId, rows] of [...byTrack.entries()].sort((a, b) => a[0] - b[0])) {
    rows.sort((a, b) => a.scanMs - b.scanMs);
    const first = rows[0];
    const last = rows[rows.length - 1];
    const [x0, y0] = proj.toXY(first.lon, first.lat);
    const [x1, y1] = proj.toXY(last.lon, last.lat);
    const dt = (last.scanMs - first.scanMs) / 1000;
    const prev = prevScan(first.scanMs);
    const flags = {
      splitChild: first.parentTrackId !== null,
      dataStart: prev === null,
      afterGap: prev !== null && first.scanMs - prev > maxGapMs,
      edgeBand: Math.hypot(x0, y0) > SITE.rangeKm - SITE.tracking.edgeBandKm,
    };
    const isStorm = rows.length >= SITE.tracking.minScans;
    out.push({
      trackId,
      rows,
      scans: rows.length,
      firstMs: first.scanMs,
      lastMs: last.scanMs,
      durationMin: (last.scanMs - first.scanMs) / 60000 + SITE.scanIntervalMin,
      speedMS: dt > 0 ? (Math.hypot(x1 - x0, y1 - y0) * 1000) / dt : null,
      towardDeg: dt > 0 ? ((Math.atan2(x1 - x0, y1 - y0) * 180) / Math.PI + 360) % 360 : null,
      isStorm,
      flags,
      isOnset: isStorm && !flags.splitChild && !flags.dataStart && !flags.afterGap && !flags.edgeBand,
      firstRangeKm: Math.hypot(x0, y0),
    });
  }
  return out;
}

export interface TerrainSampler {
  west: number;
  north: number;
  step: number;
  width: number;
  height: number;
  elevation: ArrayLike<number>;
}

export function elevationAt(t: TerrainSampler, lon: number, lat: number): number {
  const i = Math.min(t.width - 1, Math.max(0, Math.floor((lon - t.west) / t.step)));
  const j = Math.min(t.height - 1, Math.max(0, Math.floor((t.north - lat) / t.step)));
  return t.elevation[j * t.width + i];
}

/** Daily coverage means of the anomalies (cos-latitude weights, grid points within range). */
export function coverageMeansFromRecords(
  records: AnomalyRecord[],
): Map<string, { q: number; u: number; v: number }> {
  const proj = new RadarProjection(SITE.lat, SITE.lon);
  const acc = new Map<string, { w: number; q: number; u: number; v: number }>();
  const inside = new Map<string, boolean>();
  for (const r of records) {
    const key = `${r.lat},${r.lon}`;
    let ok = inside.get(key);
    if (ok === undefined) {
      const [x, y] = proj.toXY(r.lon, r.lat);
      ok = Math.hypot(x, y) <= SITE.rangeKm;
      inside.set(key, ok);
    }
    if (!ok) continue;
    const w = Math.cos((r.lat * Math.PI) / 180);
    const a = acc.get(r.date) ?? { w: 0, q: 0, u: 0, v: 0 };
    if (r.variable === 'q') {
      a.q += w * r.value;
      a.w += w;
    } else if (r.variable === 'u') a.u += w * r.value;
    else if (r.variable === 'v') a.v += w * r.value;
    acc.set(r.date, a);
  }
  const out = new Map<string, { q: number; u: number; v: number }>();
  for (const [d, a] of acc) out.set(d, { q: a.q / a.w, u: a.u / a.w, v: a.v / a.w });
  return out;
}

export function flowClass(u: number, v: number): string {
  if (Math.hypot(u, v) < WEAK_FLOW_MS) return 'weak';
  const from = windFromDeg(u, v);
  for (const s of FLOW_SECTORS) {
    const inside =
      s.fromDeg < s.toDeg ? from >= s.fromDeg && from < s.toDeg : from >= s.fromDeg || from < s.toDeg;
    if (inside) return s.name;
  }
  return 'weak';
}

const mean = (a: number[]) => (a.length ? a.reduce((s, x) => s + x, 0) / a.length : Number.NaN);
const median = (a: number[]) => {
  if (!a.length) return Number.NaN;
  const s = a.slice().sort((x, y) => x - y);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};
const r2 = (x: number) => Math.round(x * 100) / 100;
const r3 = (x: number) => Math.round(x * 1000) / 1000;

export interface SeasonStatistics {
  cellRows: number;
  tracks: number;
  storms: number;
  onsets: number;
  flagged: { splitChild: number; dataStart: number; afterGap: number; edgeBand: number };
  stormsWithMergeEnd: number;
  splitShare: number;
  mergeShare: number;
  onsetsByLocalHour: number[];
  peakLocalHour: number;
  cellAreaKm2: { mean: number; median: number };
  stormDurationMin: { mean: number; median: number };
  stormSpeedMS: { mean: number; median: number };
  stormMotionTowardDeg: { circularMean: number };
  top35MaxKm: { shareFrom4To9: number; median: number };
  echoTopMaxKm: { median: number };
  volumeKm3: { median: number };
  onsetDensityPer1000Km2: { hills: number; valley: number; hillsAreaKm2: number; valleyAreaKm2: number };
  nightOnsetDensityPer1000Km2: { lake: number; elsewhere: number };
  onsetsPerDay: {
    dryTercile: number;
    middleTercile: number;
    moistTercile: number;
    byFlowClass: Record<string, number>;
  };
  scans: { nominal: number; present: number; missing: number; availability: number };
}

export function seasonStatistics(input: {
  cells: CellRecord[];
  scans: ScanRecord[];
  nominalScans: number;
  dates: string[];
  terrain: TerrainSampler;
  isLake: (lon: number, lat: number) => boolean;
  dailyMeans: Map<string, { q: number; u: number; v: number }>;
}): SeasonStatistics {
  const tracks = summariseTracks(input.cells, input.scans);
  const storms = tracks.filter((t) => t.isStorm);
  const onsets = storms.filter((t) => t.isOnset);
  const byHour = new Array(24).fill(0);
  for (const o of onsets) byHour[Math.floor(localHourOf(o.firstMs))]++;
  const peakLocalHour = byHour.indexOf(Math.max(...byHour));

  // Terrain classes within the onset-eligible part of the coverage (inside the edge band).
  const proj = new RadarProjection(SITE.lat, SITE.lon);
  const t = input.terrain;
  let hillsArea = 0;
  let valleyArea = 0;
  let lakeArea = 0;
  let eligibleArea = 0;
  for (let j = 0; j < t.height; j++) {
    const lat = t.north - (j + 0.5) * t.step;
    const cellKm2 = (t.step * 111.195) ** 2 * Math.cos((lat * Math.PI) / 180);
    for (let i = 0; i < t.width; i++) {
      const lon = t.west + (i + 0.5) * t.step;
      const [x, y] = proj.toXY(lon, lat);
      if (Math.hypot(x, y) > SITE.rangeKm - SITE.tracking.edgeBandKm) continue;
      eligibleArea += cellKm2;
      const e = t.elevation[j * t.width + i];
      const lake = input.isLake(lon, lat);
      if (lake) lakeArea += cellKm2;
      else if (e >= TERRAIN_CLASSES.hillsFromM) hillsArea += cellKm2;
      else if (e < TERRAIN_CLASSES.valleyBelowM) valleyArea += cellKm2;
    }
  }
  let hills = 0;
  let valley = 0;
  let nightLake = 0;
  let nightElsewhere = 0;
  for (const o of onsets) {
    const { lon, lat } = o.rows[0];
    const e = elevationAt(t, lon, lat);
    const lake = input.isLake(lon, lat);
    if (!lake && e >= TERRAIN_CLASSES.hillsFromM) hills++;
    else if (!lake && e < TERRAIN_CLASSES.valleyBelowM) valley++;
    const h = localHourOf(o.firstMs);
    if (h < 6) {
      if (lake) nightLake++;
      else nightElsewhere++;
    }
  }

  // Onsets per local date by moisture tercile and by flow class of the coverage-mean anomaly.
  const perDay = new Map<string, number>(input.dates.map((d) => [d, 0]));
  for (const o of onsets) {
    const d = localDateOf(o.firstMs);
    if (perDay.has(d)) perDay.set(d, (perDay.get(d) ?? 0) + 1);
  }
  const days = input.dates.filter((d) => input.dailyMeans.has(d));
  const sorted = days
    .slice()
    .sort((a, b) => (input.dailyMeans.get(a)?.q ?? 0) - (input.dailyMeans.get(b)?.q ?? 0));
  const third = Math.floor(sorted.length / 3);
  const dry = sorted.slice(0, third);
  const moist = sorted.slice(sorted.length - third);
  const middle = sorted.slice(third, sorted.length - third);
  const countOf = (ds: string[]) => mean(ds.map((d) => perDay.get(d) ?? 0));
  const byFlow: Record<string, number[]> = {};
  for (const d of days) {
    const m = input.dailyMeans.get(d);
    if (!m) continue;
    const c = flowClass(m.u, m.v);
    const list = byFlow[c] ?? [];
    list.push(perDay.get(d) ?? 0);
    byFlow[c] = list;
  }

  const maxTop = storms.map((s) => Math.max(...s.rows.map((r) => r.top35Km)));
  const speeds = storms.map((s) => s.speedMS).filter((v): v is number => v !== null);
  let sx = 0;
  let sy = 0;
  for (const s of storms) {
    if (s.towardDeg === null) continue;
    sx += Math.sin((s.towardDeg * Math.PI) / 180);
    sy += Math.cos((s.towardDeg * Math.PI) / 180);
  }
  const stormRows = storms.flatMap((s) => s.rows);
  return {
    cellRows: input.cells.length,
    tracks: tracks.length,
    storms: storms.length,
    onsets: onsets.length,
    flagged: {
      splitChild: storms.filter((s) => s.flags.splitChild).length,
      dataStart: storms.filter((s) => s.flags.dataStart).length,
      afterGap: storms.filter((s) => s.flags.afterGap).length,
      edgeBand: storms.filter((s) => s.flags.edgeBand).length,
    },
    stormsWithMergeEnd: storms.filter((s) => s.rows[0].mergedIntoTrackId !== null).length,
    splitShare: r3(storms.filter((s) => s.flags.splitChild).length / storms.length),
    mergeShare: r3(storms.filter((s) => s.rows[0].mergedIntoTrackId !== null).length / storms.length),
    onsetsByLocalHour: byHour,
    peakLocalHour,
    cellAreaKm2: {
      mean: r2(mean(stormRows.map((r) => r.areaKm2))),
      median: r2(median(stormRows.map((r) => r.areaKm2))),
    },
    stormDurationMin: {
      mean: r2(mean(storms.map((s) => s.durationMin))),
      median: r2(median(storms.map((s) => s.durationMin))),
    },
    stormSpeedMS: { mean: r2(mean(speeds)), median: r2(median(speeds)) },
    stormMotionTowardDeg: { circularMean: r2(((Math.atan2(sx, sy) * 180) / Math.PI + 360) % 360) },
    top35MaxKm: {
      shareFrom4To9: r3(maxTop.filter((h) => h >= 4 && h <= 9).length / maxTop.length),
      median: median(maxTop),
    },
    echoTopMaxKm: { median: median(storms.map((s) => Math.max(...s.rows.map((r) => r.echoTopKm)))) },
    volumeKm3: { median: r2(median(stormRows.map((r) => r.volumeKm3))) },
    onsetDensityPer1000Km2: {
      hills: r3((hills / hillsArea) * 1000),
      valley: r3((valley / valleyArea) * 1000),
      hillsAreaKm2: Math.round(hillsArea),
      valleyAreaKm2: Math.round(valleyArea),
    },
    nightOnsetDensityPer1000Km2: {
      lake: r3((nightLake / lakeArea) * 1000),
      elsewhere: r3((nightElsewhere / (eligibleArea - lakeArea)) * 1000),
    },
    onsetsPerDay: {
      dryTercile: r2(countOf(dry)),
      middleTercile: r2(countOf(middle)),
      moistTercile: r2(countOf(moist)),
      byFlowClass: Object.fromEntries(
        Object.entries(byFlow)
          .sort((a, b) => a[0].localeCompare(b[0]))
          .map(([k, v]) => [k, r2(mean(v))]),
      ),
    },
    scans: {
      nominal: input.nominalScans,
      present: input.scans.length,
      missing: input.nominalScans - input.scans.length,
      availability: r3(input.scans.length / input.nominalScans),
    },
  };
}

export interface RegimeSkill {
  /** Brier skill score of the regime-conditioned climatology against the all-days climatology */
  bss: number;
  /** the same with the regime labels shuffled among the days */
  bssShuffled: number;
  days: number;
  blocks: number;
  regimes: number;
  baseRate: number;
}

/**
 * A quick check that the flow/moisture regime carries information about afternoon storms per block:
 * event = at least one onset in the block between 12 and 18 local; forecasts by leave-one-day-out
 * climatology, all days vs days of the same regime (moisture tercile × flow class, shrunk towards the
 * block's climatology with 2 pseudo-days). Days with afternoon availability under 80 % are left out.
 */
export function regimeSkill(input: {
  onsets: TrackSummary[];
  blocks: { polygons: number[][][][] }[];
  dates: string[];
  dailyMeans: Map<string, { q: number; u: number; v: number }>;
  scans: ScanRecord[];
  shuffleSeed: number;
}): RegimeSkill {
  const afternoon = (ms: number) => {
    const h = localHourOf(ms);
    return h >= 12 && h < 18;
  };
  const present = new Map<string, number>();
  for (const s of input.scans) {
    if (!afternoon(s.scanMs)) continue;
    const d = localDateOf(s.scanMs);
    present.set(d, (present.get(d) ?? 0) + 1);
  }
  const expected = (6 * 60) / SITE.scanIntervalMin;
  const days = input.dates.filter(
    (d) => input.dailyMeans.has(d) && (present.get(d) ?? 0) / expected >= SITE.coverage.minAvailability,
  );
  const dayIndex = new Map(days.map((d, i) => [d, i]));
  const B = input.blocks.length;
  const obs = days.map(() => new Uint8Array(B));
  for (const o of input.onsets) {
    if (!afternoon(o.firstMs)) continue;
    const di = dayIndex.get(localDateOf(o.firstMs));
    if (di === undefined) continue;
    const { lon, lat } = o.rows[0];
    input.blocks.forEach((b, bi) => {
      if (b.polygons.some((p) => pointInPolygonRing(lon, lat, p[0]))) obs[di][bi] = 1;
    });
  }
  const qs = days.map((d) => input.dailyMeans.get(d)?.q ?? 0);
  const sortedQ = qs.slice().sort((a, b) => a - b);
  const t1 = sortedQ[Math.floor(sortedQ.length / 3)];
  const t2 = sortedQ[Math.floor((2 * sortedQ.length) / 3)];
  const labels = days.map((d, i) => {
    const m = input.dailyMeans.get(d) ?? { q: 0, u: 0, v: 0 };
    const moist = qs[i] < t1 ? 'dry' : qs[i] < t2 ? 'normal' : 'moist';
    return `${moist}/${flowClass(m.u, m.v)}`;
  });
  const score = (lab: string[]) => {
    const N = days.length;
    const total = new Float64Array(B);
    for (const o of obs) for (let b = 0; b < B; b++) total[b] += o[b];
    const byRegime = new Map<string, { n: number; x: Float64Array }>();
    lab.forEach((l, i) => {
      const e = byRegime.get(l) ?? { n: 0, x: new Float64Array(B) };
      e.n++;
      for (let b = 0; b < B; b++) e.x[b] += obs[i][b];
      byRegime.set(l, e);
    });
    let bsClim = 0;
    let bsReg = 0;
    const alpha = 2;
    for (let i = 0; i < N; i++) {
      const e = byRegime.get(lab[i]) as { n: number; x: Float64Array };
      for (let b = 0; b < B; b++) {
        const o = obs[i][b];
        const clim = (total[b] - o) / (N - 1);
        const reg = (e.x[b] - o + alpha * clim) / (e.n - 1 + alpha);
        bsClim += (clim - o) ** 2;
        bsReg += (reg - o) ** 2;
      }
    }
    return 1 - bsReg / bsClim;
  };
  // Seeded shuffle (sfc32 through Rng would be a circular import; a small LCG is enough here).
  let s = input.shuffleSeed >>> 0 || 1;
  const rand = () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 4294967296;
  };
  const shuffled = labels.slice();
  for (let i = shuffled.length - 1; i > 0; i--) {
    const j = Math.floor(rand() * (i + 1));
    [shuffled[i], shuffled[j]] = [shuffled[j], shuffled[i]];
  }
  let events = 0;
  for (const o of obs) for (let b = 0; b < B; b++) events += o[b];
  return {
    bss: r3(score(labels)),
    bssShuffled: r3(score(shuffled)),
    days: days.length,
    blocks: B,
    regimes: new Set(labels).size,
    baseRate: r3(events / (days.length * B)),
  };
}

function pointInPolygonRing(lon: number, lat: number, ring: number[][]): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi > lat !== yj > lat && lon < ((xj - xi) * (lat - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}
