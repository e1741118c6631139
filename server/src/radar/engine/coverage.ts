import type { BlockedSector } from '@stormhour/shared';
import { destination, type SitePosition } from './site-plane.js';

export interface Coverage extends SitePosition {
  rangeKm: number;
  blockedSectors: BlockedSector[];
}

/** Whether an azimuth falls in a sector; a sector may wrap through north (from 350 to 20). */
export function inSector(azimuthDeg: number, { fromDeg, toDeg }: BlockedSector): boolean {
  const a = ((azimuthDeg % 360) + 360) % 360;
  return fromDeg <= toDeg ? a >= fromDeg && a <= toDeg : a >= fromDeg || a <= toDeg;
}

/** Whether a point at this distance and azimuth from the radar is seen by it. */
export function isCovered(c: Coverage, distanceKm: number, azimuthDeg: number): boolean {
  return distanceKm <= c.rangeKm && !c.blockedSectors.some((s) => inSector(azimuthDeg, s));
}

/** Distance inside the coverage edge from a point in the site plane (x east, y north, km). */
export function azimuthOf(xKm: number, yKm: number): number {
  return ((Math.atan2(xKm, yKm) * 180) / Math.PI + 360) % 360;
}

/**
 * The coverage as a GeoJSON polygon: the range ring traced by geodesics from the radar every degree,
 * pulled in to the radar itself across blocked sectors.
 */
export function coveragePolygon(
  c: Coverage,
  stepDeg = 1,
): { type: 'Polygon'; coordinates: [number, number][][] } {
  const ring: [number, number][] = [];
  for (let az = 0; az < 360; az += stepDeg) {
    if (c.blockedSectors.some((s) => inSector(az, s))) {
      const last = ring[ring.length - 1];
      if (!last || last[0] !== c.lon || last[1] !== c.lat) ring.push([c.lon, c.lat]);
      continue;
    }
    const p = destination(c, az, c.rangeKm);
    ring.push([p.lon, p.lat]);
  }
  // GeoJSON outer rings run counter-clockwise (RFC 7946 §3.1.6); azimuths run clockwise.
  ring.reverse();
  ring.push(ring[0]);
  return { type: 'Polygon', coordinates: [ring] };
}
