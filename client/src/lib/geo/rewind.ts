import type { MultiPolygon, Polygon, Position } from 'geojson';

/** Twice the planar signed area of a ring in lon/lat; positive when it runs anticlockwise. */
export function ringSignedArea(ring: readonly Position[]): number {
  let sum = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    sum += (ring[j][0] - ring[i][0]) * (ring[j][1] + ring[i][1]);
  }
  return sum;
}

function orient(ring: Position[], clockwise: boolean): Position[] {
  const isClockwise = ringSignedArea(ring) < 0;
  return isClockwise === clockwise ? ring : [...ring].reverse();
}

function rewindRings(rings: Position[][]): Position[][] {
  return rings.map((ring, index) => orient(ring, index === 0));
}

/**
 * GeoJSON (RFC 7946 §3.1.6) winds outer rings anticlockwise; d3-geo reads rings on the sphere and
 * wants them clockwise, otherwise a small block becomes "the whole globe except this block".
 * Returns a copy with outer rings clockwise and holes anticlockwise.
 */
export function rewindForD3<G extends Polygon | MultiPolygon>(geometry: G): G {
  if (geometry.type === 'Polygon') {
    return { ...geometry, coordinates: rewindRings(geometry.coordinates) };
  }
  return { ...geometry, coordinates: geometry.coordinates.map(rewindRings) };
}
