import type { QualityReport } from '@stormhour/shared';

export interface ReportInputs {
  filesRead: number;
  filesSkipped: number;
  duplicates: number;
  scans: number;
  cellsFound: number;
  cellsRejectedTooSmall: number;
  cellsOutsideCoverage: number;
  tracks: { isStorm: boolean; onset: boolean; notOnsetReason: string | null }[];
  /** The site's scan times over the job's span, sorted (ms). */
  siteScans: Float64Array;
  cellsPerScan: { time: number; cells: number }[];
  intervalMs: number;
  maxGapMs: number;
  utcOffsetMinutes: number;
}

const iso = (t: number) => new Date(t).toISOString();

/** Gaps longer than the tracking limit between consecutive scans. */
export function findGaps(times: Float64Array, maxGapMs: number): QualityReport['gaps'] {
  const gaps: QualityReport['gaps'] = [];
  for (let i = 1; i < times.length; i++) {
    const d = times[i] - times[i - 1];
    if (d > maxGapMs)
      gaps.push({ from: iso(times[i - 1]), to: iso(times[i]), minutes: Math.round(d / 60_000) });
  }
  return gaps;
}

/** Share of the expected scans present on each local day from the first to the last scan. */
export function availabilityByDay(times: Float64Array, intervalMs: number, utcOffsetMinutes: number) {
  if (times.length === 0) return [];
  const dayMs = 86_400_000;
  const offset = utcOffsetMinutes * 60_000;
  const dayOf = (t: number) => Math.floor((t + offset) / dayMs);
  const counts = new Map<number, number>();
  for (const t of times) counts.set(dayOf(t), (counts.get(dayOf(t)) ?? 0) + 1);
  const expected = dayMs / intervalMs;
  const out: QualityReport['availabilityByDay'] = [];
  for (let d = dayOf(times[0]); d <= dayOf(times[times.length - 1]); d++) {
    out.push({ date: iso(d * dayMs).slice(0, 10), share: Math.min(1, (counts.get(d) ?? 0) / expected) });
  }
  return out;
}

/** Long series are summed per hour so the plot stays readable and the report small. */
export function cellsPerScanSeries(points: { time: number; cells: number }[]): QualityReport['cellsPerScan'] {
  if (points.length <= 1500) return points.map((p) => ({ time: iso(p.time), cells: p.cells }));
  const hourly = new Map<number, number>();
  for (const p of points) {
    const h = Math.floor(p.time / 3_600_000) * 3_600_000;
    hourly.set(h, (hourly.get(h) ?? 0) + p.cells);
  }
  return [...hourly].map(([t, cells]) => ({ time: iso(t), cells }));
}

export function buildReport(r: ReportInputs): QualityReport {
  const flagged = { split: 0, 'data-start': 0, 'after-gap': 0, 'edge-band': 0 };
  for (const t of r.tracks) {
    if (t.isStorm && t.notOnsetReason && t.notOnsetReason in flagged)
      flagged[t.notOnsetReason as keyof typeof flagged]++;
  }
  return {
    filesRead: r.filesRead,
    filesSkipped: r.filesSkipped,
    duplicates: r.duplicates,
    scans: r.scans,
    cellsFound: r.cellsFound,
    cellsRejectedTooSmall: r.cellsRejectedTooSmall,
    cellsOutsideCoverage: r.cellsOutsideCoverage,
    tracks: r.tracks.length,
    storms: r.tracks.filter((t) => t.isStorm).length,
    onsets: r.tracks.filter((t) => t.onset).length,
    flaggedStarts: flagged,
    gaps: findGaps(r.siteScans, r.maxGapMs),
    cellsPerScan: cellsPerScanSeries(r.cellsPerScan),
    availabilityByDay: availabilityByDay(r.siteScans, r.intervalMs, r.utcOffsetMinutes),
  };
}
