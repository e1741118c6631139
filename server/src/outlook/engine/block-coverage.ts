import type { GeoPolygonal, Position } from '@stormhour/shared';
import { azimuthOf, type Coverage, isCovered } from '../../radar/engine/coverage.js';
import type { SitePlane } from '../../radar/engine/site-plane.js';

/** The polygons of a GeoJSON Polygon or MultiPolygon, each a list of rings. */
export function polygonsOf(g: GeoPolygonal): Position[][][] {
  return g.type === 'Polygon' ? [g.coordinates] : g.coordinates;
}

/** Even–odd ray casting over every ring, so holes count as outside. */
export function inRings(rings: Position[][], x: number, y: number): boolean {
  let inside = false;
  for (const ring of rings) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const [xi, yi] = ring[i];
      const [xj, yj] = ring[j];
      if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
    }
  }
  return inside;
}

/**
 * Share of a block's area inside the radar's coverage (DESIGN §3.3), by sampling the block on a
 * steps × steps longitude–latitude grid of cell centres, each weighted by cos(latitude) (equal-angle
 * cells shrink toward the poles). A block with no blocked sector whose every vertex lies within range
 * is wholly covered: the range disc is convex.
 */
export function coverageFraction(
  geometry: GeoPolygonal,
  coverage: Coverage,
  plane: SitePlane,
  steps = 40,
): number {
  const covered = (lon: number, lat: number) => {
    const [x, y] = plane.toKm(lon, lat);
    return isCovered(coverage, Math.hypot(x, y), azimuthOf(x, y));
  };
  const polygons = polygonsOf(geometry);
  if (coverage.blockedSectors.length === 0) {
    const allIn = polygons.every((rings) => rings[0].every(([lon, lat]) => covered(lon, lat)));
    if (allIn) return 1;
  }
  let minLon = Infinity;
  let minLat = Infinity;
  let maxLon = -Infinity;
  let maxLat = -Infinity;
  for (const rings of polygons)
    for (const [lon, lat] of rings[0]) {
      minLon = Math.min(minLon, lon);
      maxLon = Math.max(maxLon, lon);
      minLat = Math.min(minLat, lat);
      maxLat = Math.max(maxLat, lat);
    }
  const dLon = (maxLon - minLon) / steps;
  const dLat = (maxLat - minLat) / steps;
  let total = 0;
  let inside = 0;
  for (let j = 0; j < steps; j++) {
    const lat = minLat + (j + 0.5) * dLat;
    const w = Math.cos((lat * Math.PI) / 180);
    for (let i = 0; i < steps; i++) {
      const lon = minLon + (i + 0.5) * dLon;
      if (!polygons.some((rings) => inRings(rings, lon, lat))) continue;
      total += w;
      if (covered(lon, lat)) inside += w;
    }
  }
  return total > 0 ? inside / total : 0;
}

/** A block's outline in the site plane (km). */
export function toPlane(geometry: GeoPolygonal, plane: SitePlane): Position[][][] {
  return polygonsOf(geometry).map((rings) =>
    rings.map((ring) => ring.map(([lon, lat]) => plane.toKm(lon, lat))),
  );
}

/** Area and perimeter (outer rings) of a block in the plane, km² and km. */
export function areaAndPerimeter(polygons: Position[][][]): { areaKm2: number; perimeterKm: number } {
  let area = 0;
  let perimeter = 0;
  for (const rings of polygons)
    rings.forEach((ring, r) => {
      let a = 0;
      for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
        a += ring[j][0] * ring[i][1] - ring[i][0] * ring[j][1];
        if (r === 0) perimeter += Math.hypot(ring[i][0] - ring[j][0], ring[i][1] - ring[j][1]);
      }
      // Holes subtract whatever their winding.
      area += r === 0 ? Math.abs(a / 2) : -Math.abs(a / 2);
    });
  return { areaKm2: area, perimeterKm: perimeter };
}

/**
 * Area of a block buffered by r km: A + P·r + π r² (Steiner's formula, exact for a convex block and
 * a slight overestimate for a concave one).
 */
export function bufferedAreaKm2(areaKm2: number, perimeterKm: number, radiusKm: number): number {
  return areaKm2 + perimeterKm * radiusKm + Math.PI * radiusKm * radiusKm;
}

function segmentDistance(px: number, py: number, [ax, ay]: Position, [bx, by]: Position): number {
  const dx = bx - ax;
  const dy = by - ay;
  const len2 = dx * dx + dy * dy;
  const t = len2 > 0 ? Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / len2)) : 0;
  return Math.hypot(px - (ax + t * dx), py - (ay + t * dy));
}

/** Whether a point (km) is inside the block or within r km of its boundary. */
export function withinBuffer(polygons: Position[][][], x: number, y: number, radiusKm: number): boolean {
  for (const rings of polygons) {
    if (inRings(rings, x, y)) return true;
    if (radiusKm <= 0) continue;
    for (const ring of rings)
      for (let i = 0, j = ring.length - 1; i < ring.length; j = i++)
        if (segmentDistance(x, y, ring[j], ring[i]) <= radiusKm) return true;
  }
  return false;
}
