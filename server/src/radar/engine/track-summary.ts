import type { Scan, Track } from './tracking.js';

export interface StartSettings {
  /** A track is a storm only if it lasts at least this many scans. */
  minScans: number;
  nominalIntervalMs: number;
  /** Starts this close to the edge of coverage may be storms that came in from outside. */
  edgeBandKm: number;
  coverageRadiusKm: number;
}

export type NotOnsetReason = 'split' | 'data-start' | 'after-gap' | 'edge-band';

export interface TrackSummary {
  trackId: number;
  scans: number;
  isStorm: boolean;
  firstTime: number;
  lastTime: number;
  /** Last scan − first scan + one nominal interval: a one-scan cell lasted about one interval. */
  durationMs: number;
  /** First to last centroid over the time between them; null for a one-scan track. */
  speedMs: number | null;
  /** The direction the storm moves toward, degrees clockwise from north. */
  directionToDeg: number | null;
  /** Counted as a storm's onset: its first scan is where it really began. */
  onset: boolean;
  notOnsetReason: NotOnsetReason | null;
}

/** Decides whether a track's first scan is an onset, and describes its life and motion. */
export function summarizeTrack(track: Track, scans: Scan[], settings: StartSettings): TrackSummary {
  const [firstScan, firstCell] = track.cells[0];
  const [lastScan, lastCell] = track.cells[track.cells.length - 1];
  const first = scans[firstScan].cells[firstCell];
  const last = scans[lastScan].cells[lastCell];
  const firstTime = scans[firstScan].time;
  const lastTime = scans[lastScan].time;
  const seconds = (lastTime - firstTime) / 1000;
  const dx = last.x - first.x;
  const dy = last.y - first.y;
  const isStorm = track.cells.length >= settings.minScans;

  let notOnsetReason: NotOnsetReason | null = null;
  if (track.parent !== null) notOnsetReason = 'split';
  else if (track.startsUnseen) notOnsetReason = track.startsUnseen;
  else if (Math.hypot(first.x, first.y) > settings.coverageRadiusKm - settings.edgeBandKm)
    notOnsetReason = 'edge-band';

  return {
    trackId: track.id,
    scans: track.cells.length,
    isStorm,
    firstTime,
    lastTime,
    durationMs: lastTime - firstTime + settings.nominalIntervalMs,
    speedMs: seconds > 0 ? (Math.hypot(dx, dy) * 1000) / seconds : null,
    directionToDeg: seconds > 0 ? ((Math.atan2(dx, dy) * 180) / Math.PI + 360) % 360 : null,
    onset: isStorm && notOnsetReason === null,
    notOnsetReason,
  };
}
