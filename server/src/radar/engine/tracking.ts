import { assign, FORBIDDEN } from './assignment.js';

/** One cell as the tracker sees it: position in km on the site's plane (x east, y north) and size. */
export interface CellObservation {
  x: number;
  y: number;
  areaKm2: number;
  volumeKm3: number;
}

export interface Scan {
  /** Scan time, ms since the epoch (UTC). */
  time: number;
  cells: CellObservation[];
}

export interface TrackingSettings {
  maxSpeedMs: number;
  /** Scans further apart than this break every track. */
  maxGapMs: number;
  /** Weight of the relative size difference against the normalised position error. */
  sizeWeight: number;
}

export const DEFAULT_TRACKING: Omit<TrackingSettings, 'maxGapMs'> = { maxSpeedMs: 30, sizeWeight: 0.5 };

export interface Track {
  id: number;
  /** [scan index, cell index] in time order. */
  cells: [number, number][];
  /** The track this one split from, if it began as a split. */
  parent: number | null;
  /** The track this one merged into, if it ended in a merger. */
  mergedInto: number | null;
  /** It began in the first scan of the data, or in the first scan after a gap: its start was not seen. */
  startsUnseen: 'data-start' | 'after-gap' | null;
}

interface Live {
  track: Track;
  cell: CellObservation;
  time: number;
  vx: number | null;
  vy: number | null;
}

const radiusKm = (c: CellObservation) => Math.sqrt(c.areaKm2 / Math.PI);
const relativeSizeDifference = (a: CellObservation, b: CellObservation) =>
  Math.abs(a.volumeKm3 - b.volumeKm3) / Math.max(a.volumeKm3, b.volumeKm3, 1e-9);

/**
 * Links cells between consecutive scans into tracks: each live track's cell is moved on by its own
 * motion (or, for a one-scan track, the mean motion of the others), the cost of pairing it with a new
 * cell is the position error relative to the farthest a storm could move plus a size-difference term,
 * pairs faster than the maximum speed are forbidden, and the optimal assignment decides. Footprints
 * are taken as circles of the cell's area: a new cell overlapping an advected old one that went to
 * another cell is a split; an old cell that found no partner but overlaps a new cell is a merger.
 */
export function trackScans(scans: Scan[], settings: TrackingSettings): Track[] {
  const tracks: Track[] = [];
  let live: Live[] = [];
  const start = (scan: number, cell: number, startsUnseen: Track['startsUnseen'], parent: number | null) => {
    const track: Track = { id: tracks.length, cells: [[scan, cell]], parent, mergedInto: null, startsUnseen };
    tracks.push(track);
    return track;
  };

  scans.forEach((scan, s) => {
    const dtMs = s === 0 ? Infinity : scan.time - scans[s - 1].time;
    if (dtMs <= 0) throw new Error(`Scans must be in increasing time order (scan ${s})`);
    if (s === 0 || dtMs > settings.maxGapMs) {
      const why = s === 0 ? 'data-start' : 'after-gap';
      live = scan.cells.map((cell, c) => ({
        track: start(s, c, why, null),
        cell,
        time: scan.time,
        vx: null,
        vy: null,
      }));
      return;
    }
    const dt = dtMs / 1000;
    const reachKm = (settings.maxSpeedMs * dt) / 1000;
    const moving = live.filter((l) => l.vx !== null);
    const meanVx = moving.length ? moving.reduce((a, l) => a + (l.vx as number), 0) / moving.length : 0;
    const meanVy = moving.length ? moving.reduce((a, l) => a + (l.vy as number), 0) / moving.length : 0;
    const predicted = live.map((l) => ({
      x: l.cell.x + ((l.vx ?? meanVx) * dt) / 1000,
      y: l.cell.y + ((l.vy ?? meanVy) * dt) / 1000,
    }));

    const cost = live.map((l, i) =>
      scan.cells.map((c) => {
        if (Math.hypot(c.x - l.cell.x, c.y - l.cell.y) > reachKm) return FORBIDDEN;
        const miss = Math.hypot(c.x - predicted[i].x, c.y - predicted[i].y) / reachKm;
        return miss + settings.sizeWeight * relativeSizeDifference(l.cell, c);
      }),
    );
    const { pairs } = assign(cost);
    const partnerOfOld = new Map(pairs.map(([i, j]) => [i, j]));
    const partnerOfNew = new Map(pairs.map(([i, j]) => [j, i]));

    const next: Live[] = [];
    for (const [i, j] of pairs) {
      const l = live[i];
      const c = scan.cells[j];
      const vx = ((c.x - l.cell.x) * 1000) / dt;
      const vy = ((c.y - l.cell.y) * 1000) / dt;
      l.track.cells.push([s, j]);
      // Smooth the motion a little: one noisy centroid should not throw the next prediction off.
      next.push({
        track: l.track,
        cell: c,
        time: scan.time,
        vx: l.vx === null ? vx : (l.vx + vx) / 2,
        vy: l.vy === null ? vy : (l.vy + vy) / 2,
      });
    }
    const overlaps = (i: number, j: number) =>
      Math.hypot(scan.cells[j].x - predicted[i].x, scan.cells[j].y - predicted[i].y) <
      radiusKm(live[i].cell) + radiusKm(scan.cells[j]);

    scan.cells.forEach((cell, j) => {
      if (partnerOfNew.has(j)) return;
      const parents = live.map((_, i) => i).filter((i) => partnerOfOld.has(i) && overlaps(i, j));
      const parent = parents.length ? live[nearest(parents, predicted, cell)].track.id : null;
      next.push({ track: start(s, j, null, parent), cell, time: scan.time, vx: null, vy: null });
    });
    live.forEach((l, i) => {
      if (partnerOfOld.has(i)) return;
      const into = scan.cells.map((_, j) => j).filter((j) => partnerOfNew.has(j) && overlaps(i, j));
      if (into.length) {
        const j = into.reduce((best, k) =>
          Math.hypot(scan.cells[k].x - predicted[i].x, scan.cells[k].y - predicted[i].y) <
          Math.hypot(scan.cells[best].x - predicted[i].x, scan.cells[best].y - predicted[i].y)
            ? k
            : best,
        );
        l.track.mergedInto = live[partnerOfNew.get(j) as number].track.id;
      }
    });
    live = next;
  });
  return tracks;
}

function nearest(candidates: number[], predicted: { x: number; y: number }[], cell: CellObservation): number {
  return candidates.reduce((best, i) =>
    Math.hypot(cell.x - predicted[i].x, cell.y - predicted[i].y) <
    Math.hypot(cell.x - predicted[best].x, cell.y - predicted[best].y)
      ? i
      : best,
  );
}
