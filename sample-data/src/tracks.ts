import { type CellMeasure, measureCell } from './cellprops.js';
import { levelThicknessKm, SITE } from './config.js';
import type { RadarProjection } from './geo.js';
import type { CellState, ModelCell } from './storms.js';

/** One row of the cell table (one identified cell in one scan), before formatting. */
export interface TableCell {
  step: number;
  trackId: number;
  modelCellId: number;
  lat: number;
  lon: number;
  measure: CellMeasure;
  state: CellState;
  parentTrackId: number | null;
  mergedIntoTrackId: number | null;
}

export interface Track {
  trackId: number;
  modelCellId: number;
  rows: TableCell[];
  parentTrackId: number | null;
  mergedIntoTrackId: number | null;
}

/**
 * Turns the model cells into what an upstream tracker would export: only scans that exist, only
 * cells that pass the identification rules (≥ 35 dBZ region, ≥ 15 km³, seen inside the range ring),
 * tracks broken wherever consecutive sightings are further apart than the maximum gap (so a track
 * never bridges the multi-hour outage), numbered in order of first appearance. Split children carry
 * their parent's track id; tracks that end by merging name the track they merged into.
 */
export function exportTracks(cells: ModelCell[], present: Uint8Array, proj: RadarProjection): Track[] {
  const levels = SITE.levelHeightsKm;
  const thickness = levelThicknessKm(levels);
  const maxGapSteps = SITE.tracking.maxGapFactor; // in nominal intervals
  interface Segment {
    cell: ModelCell;
    rows: TableCell[];
  }
  const segments: Segment[] = [];
  const segmentsOf = new Map<number, Segment[]>();
  for (const cell of cells) {
    const segs: Segment[] = [];
    let current: Segment | null = null;
    let lastStep = Number.NEGATIVE_INFINITY;
    for (const s of cell.states) {
      if (!present[s.step]) continue;
      const m = measureCell(s, levels, thickness, SITE.rangeKm);
      if (!m.identified) continue;
      if (!current || s.step - lastStep > maxGapSteps) {
        current = { cell, rows: [] };
        segs.push(current);
        segments.push(current);
      }
      const [lon, lat] = proj.toLonLat(m.x, m.y);
      current.rows.push({
        step: s.step,
        trackId: 0,
        modelCellId: cell.id,
        lat,
        lon,
        measure: m,
        state: s,
        parentTrackId: null,
        mergedIntoTrackId: null,
      });
      lastStep = s.step;
    }
    segmentsOf.set(cell.id, segs);
  }
  segments.sort((a, b) => a.rows[0].step - b.rows[0].step || a.cell.id - b.cell.id);
  const trackOf = new Map<Segment, number>();
  segments.forEach((seg, i) => {
    trackOf.set(seg, i + 1);
    for (const r of seg.rows) r.trackId = i + 1;
  });
  /** The track of a model cell that has a row within [from, to] (inclusive), nearest to `near`. */
  const trackAt = (cellId: number, from: number, to: number, near: number): number | null => {
    let best: number | null = null;
    let bestD = Number.POSITIVE_INFINITY;
    for (const seg of segmentsOf.get(cellId) ?? []) {
      for (const r of seg.rows) {
        if (r.step < from || r.step > to) continue;
        const dd = Math.abs(r.step - near);
        if (dd < bestD) {
          bestD = dd;
          best = trackOf.get(seg) ?? null;
        }
      }
    }
    return best;
  };

  const tracks: Track[] = segments.map((seg) => ({
    trackId: trackOf.get(seg) as number,
    modelCellId: seg.cell.id,
    rows: seg.rows,
    parentTrackId: null,
    mergedIntoTrackId: null,
  }));
  for (const t of tracks) {
    const seg = segments[t.trackId - 1];
    const cell = seg.cell;
    const first = seg.rows[0].step;
    const last = seg.rows[seg.rows.length - 1].step;
    const isFirstSegment = (segmentsOf.get(cell.id) ?? [])[0] === seg;
    // A split is visible to a tracker only if the child shows up at once, next to a parent it can see.
    if (cell.parentId !== undefined && isFirstSegment && first - cell.birthStep <= 2) {
      t.parentTrackId = trackAt(cell.parentId, first - 2, first, first);
    }
    const segs = segmentsOf.get(cell.id) ?? [];
    const isLastSegment = segs[segs.length - 1] === seg;
    if (
      cell.mergedIntoId !== undefined &&
      cell.mergeStep !== undefined &&
      isLastSegment &&
      cell.mergeStep - last <= 2
    ) {
      t.mergedIntoTrackId = trackAt(cell.mergedIntoId, cell.mergeStep, cell.mergeStep + 2, cell.mergeStep);
    }
    for (const r of t.rows) {
      r.parentTrackId = t.parentTrackId;
      r.mergedIntoTrackId = t.mergedIntoTrackId;
    }
  }
  return tracks;
}
