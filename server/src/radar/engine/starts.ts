import { type Coverage, inSector } from './coverage.js';
import type { NotOnsetReason } from './track-summary.js';

export interface StartFacts {
  hasParent: boolean;
  firstTime: number;
  /** Where the track began, relative to the radar. */
  firstDistanceKm: number;
  firstAzimuthDeg: number;
}

export interface StartRules {
  maxGapMs: number;
  edgeBandKm: number;
  coverage: Coverage;
}

/** Index of the last scan time strictly before t in a sorted list, or −1. */
function lastBefore(times: Float64Array, t: number): number {
  let lo = 0;
  let hi = times.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (times[mid] < t) lo = mid + 1;
    else hi = mid;
  }
  return lo - 1;
}

/**
 * Why a track's first scan is not an onset, or null if it is one (DESIGN §3.2): a split child; a start
 * at the start of the data or in the first scan after a gap (the storm may have begun unseen); a start
 * within the edge band of coverage (the range ring or a blocked sector), where storms drift in.
 * The scan times are the site's whole inventory, so a later upload can change the answer.
 */
export function classifyStart(
  start: StartFacts,
  siteScanTimes: Float64Array,
  rules: StartRules,
): NotOnsetReason | null {
  if (start.hasParent) return 'split';
  const prev = lastBefore(siteScanTimes, start.firstTime);
  if (prev < 0) return 'data-start';
  if (start.firstTime - siteScanTimes[prev] > rules.maxGapMs) return 'after-gap';
  const { coverage, edgeBandKm } = rules;
  if (start.firstDistanceKm > coverage.rangeKm - edgeBandKm) return 'edge-band';
  // Near a blocked sector: within the edge band measured along the arc at that range.
  const bandDeg = start.firstDistanceKm > 0 ? (edgeBandKm / start.firstDistanceKm) * (180 / Math.PI) : 0;
  const nearBlocked = coverage.blockedSectors.some(
    (s) => inSector(start.firstAzimuthDeg + bandDeg, s) || inSector(start.firstAzimuthDeg - bandDeg, s),
  );
  return nearBlocked ? 'edge-band' : null;
}
