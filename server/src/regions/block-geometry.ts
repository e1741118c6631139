import type { BBox, GeoPolygonal, Position } from '@stormhour/shared';
import geodesic from 'geographiclib-geodesic';

const WGS84 = geodesic.Geodesic.WGS84;

function polygons(g: GeoPolygonal): Position[][][] {
  return g.type === 'Polygon' ? [g.coordinates] : g.coordinates;
}

/** Area on the WGS84 ellipsoid of one ring, with GeographicLib's polygon algorithm (Karney 2013). */
function ringAreaM2(ring: Position[]): number {
  const poly = WGS84.Polygon(false);
  // The closing point repeats the first; GeographicLib closes rings itself.
  for (const [lon, lat] of ring.slice(0, -1)) poly.AddPoint(lat, lon);
  return Math.abs(poly.Compute(false, true).area ?? 0);
}

/** Geodesic area in km²: outer rings minus their holes, summed over the parts. */
export function geodesicAreaKm2(g: GeoPolygonal): number {
  let m2 = 0;
  for (const [outer, ...holes] of polygons(g)) {
    m2 += ringAreaM2(outer) - holes.reduce((s, h) => s + ringAreaM2(h), 0);
  }
  return m2 / 1e6;
}

export function boundingBox(g: GeoPolygonal): BBox {
  let minLon = Infinity;
  let minLat = Infinity;
  let maxLon = -Infinity;
  let maxLat = -Infinity;
  for (const poly of polygons(g))
    for (const [lon, lat] of poly[0]) {
      minLon = Math.min(minLon, lon);
      maxLon = Math.max(maxLon, lon);
      minLat = Math.min(minLat, lat);
      maxLat = Math.max(maxLat, lat);
    }
  return [minLon, minLat, maxLon, maxLat];
}

/**
 * Area-weighted centroid in lon/lat (shoelace formula). Blocks span tens of kilometres, where
 * treating degrees as planar moves the centroid by far less than a block's size.
 */
export function centroid(g: GeoPolygonal): [number, number] {
  // Work relative to one vertex: cross products of raw coordinates near 88° lose digits.
  const [ox, oy] = polygons(g)[0][0][0];
  let a = 0;
  let cx = 0;
  let cy = 0;
  for (const poly of polygons(g))
    poly.forEach((ring, ringIndex) => {
      let ra = 0;
      let rx = 0;
      let ry = 0;
      for (let i = 0; i < ring.length - 1; i++) {
        const x0 = ring[i][0] - ox;
        const y0 = ring[i][1] - oy;
        const x1 = ring[i + 1][0] - ox;
        const y1 = ring[i + 1][1] - oy;
        const cross = x0 * y1 - x1 * y0;
        ra += cross;
        rx += (x0 + x1) * cross;
        ry += (y0 + y1) * cross;
      }
      // Orientation varies between files: count outer rings positive and holes negative either way.
      const s = (ringIndex === 0 ? 1 : -1) * Math.sign(ra);
      a += s * ra;
      cx += s * rx;
      cy += s * ry;
    });
  if (a === 0) {
    const [minLon, minLat, maxLon, maxLat] = boundingBox(g);
    return [(minLon + maxLon) / 2, (minLat + maxLat) / 2];
  }
  return [ox + cx / (3 * a), oy + cy / (3 * a)];
}
