import { Delaunay } from 'd3-delaunay';
import polygonClipping, { type MultiPolygon } from 'polygon-clipping';
import { PROVINCE } from './config.js';
import { fromLocalKm, localKm, ringAreaKm2 } from './geo.js';
import { BLOCK_NAMES, DISTRICTS, type DistrictCode } from './names.js';
import { Rng } from './prng.js';
import { pointInRing, type Ring } from './province.js';

export type Position = [number, number];
export type BlockGeometry =
  | { type: 'Polygon'; coordinates: Position[][] }
  | { type: 'MultiPolygon'; coordinates: Position[][][] };

export interface BlockFeature {
  type: 'Feature';
  properties: { district_code: string; district_name: string; block_code: string; block_name: string };
  geometry: BlockGeometry;
}

export interface BlocksCollection {
  type: 'FeatureCollection';
  name: string;
  features: BlockFeature[];
}

const COORD_DECIMALS = 6;
const SCALE = 10 ** COORD_DECIMALS;

/** Which district a point (local km from the province centre) belongs to. */
export function districtRegion(x: number, y: number): DistrictCode {
  if (y > 62 + 8 * Math.sin(x / 60 + 0.5)) return 'UPL';
  if (y < -24 + 6 * Math.sin(x / 50)) return 'HLF';
  return x < 38 + 10 * Math.sin(y / 30) ? 'RVB' : 'LKS';
}

const toKm = (p: readonly number[]): Position => localKm(p[0], p[1], PROVINCE.centerLon, PROVINCE.centerLat);
const toLonLat = (p: readonly number[]): Position =>
  fromLocalKm(p[0], p[1], PROVINCE.centerLon, PROVINCE.centerLat);

/** Planar centroid of a polygon set (km), area-weighted. */
function centroidKm(mp: MultiPolygon): Position {
  let a = 0;
  let cx = 0;
  let cy = 0;
  for (const poly of mp) {
    poly.forEach((ring, k) => {
      const sign = k === 0 ? 1 : -1;
      for (let i = 0; i < ring.length - 1; i++) {
        const [x1, y1] = ring[i];
        const [x2, y2] = ring[i + 1];
        const c = x1 * y2 - x2 * y1;
        a += (sign * c) / 2;
        cx += (sign * (x1 + x2) * c) / 6;
        cy += (sign * (y1 + y2) * c) / 6;
      }
    });
  }
  return [cx / a, cy / a];
}

/**
 * Seeded Voronoi partition of the province into blocks (d3-delaunay), each cell clipped to the
 * province outline (polygon-clipping), a few Lloyd relaxation steps for even shapes, coordinates
 * rounded to 6 decimals and snapped so that neighbouring blocks share their vertices exactly.
 */
export function generateBlocks(seed: number, outline: Ring): BlocksCollection {
  const r = new Rng(seed, 'blocks');
  const outlineKm = outline.map(toKm);
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const [x, y] of outlineKm) {
    minX = Math.min(minX, x);
    minY = Math.min(minY, y);
    maxX = Math.max(maxX, x);
    maxY = Math.max(maxY, y);
  }
  const inside = (x: number, y: number) => pointInRing(x, y, outlineKm);

  // District areas on a 2 km lattice, for the seed spacing.
  const areaKm2: Record<string, number> = { RVB: 0, LKS: 0, HLF: 0, UPL: 0 };
  for (let x = minX; x <= maxX; x += 2) {
    for (let y = minY; y <= maxY; y += 2) if (inside(x, y)) areaKm2[districtRegion(x, y)] += 4;
  }

  const seeds: { x: number; y: number; district: DistrictCode }[] = [];
  for (const d of DISTRICTS) {
    const n = r.int(5, 8);
    let spacing = 0.62 * Math.sqrt(areaKm2[d.code] / n);
    let placed = 0;
    let tries = 0;
    while (placed < n) {
      tries++;
      if (tries % 2000 === 0) spacing *= 0.9;
      const x = r.range(minX, maxX);
      const y = r.range(minY, maxY);
      if (!inside(x, y) || districtRegion(x, y) !== d.code) continue;
      if (seeds.some((s) => Math.hypot(s.x - x, s.y - y) < spacing)) continue;
      seeds.push({ x, y, district: d.code });
      placed++;
    }
  }

  const bounds: [number, number, number, number] = [minX - 50, minY - 50, maxX + 50, maxY + 50];
  const clipCells = (): MultiPolygon[] => {
    const voronoi = Delaunay.from(seeds.map((s) => [s.x, s.y] as Position)).voronoi(bounds);
    return seeds.map((_, i) => {
      const cell = voronoi.cellPolygon(i) as Position[];
      return polygonClipping.intersection([cell], [outlineKm]);
    });
  };

  // Lloyd relaxation, keeping every seed inside its own district's region.
  for (let iter = 0; iter < 3; iter++) {
    const cells = clipCells();
    cells.forEach((mp, i) => {
      const [cx, cy] = centroidKm(mp);
      if (Number.isFinite(cx) && inside(cx, cy) && districtRegion(cx, cy) === seeds[i].district) {
        seeds[i].x = cx;
        seeds[i].y = cy;
      }
    });
  }
  const cells = clipCells();

  // Convert to lon/lat, round, snap near-identical vertices to one.
  const snap = new Map<string, Position>();
  const snapVertex = (p: Position): Position => {
    const ix = Math.round(p[0] * SCALE);
    const iy = Math.round(p[1] * SCALE);
    for (let dx = -2; dx <= 2; dx++) {
      for (let dy = -2; dy <= 2; dy++) {
        const hit = snap.get(`${ix + dx},${iy + dy}`);
        if (hit) return hit;
      }
    }
    const v: Position = [ix / SCALE, iy / SCALE];
    snap.set(`${ix},${iy}`, v);
    return v;
  };
  // Outline vertices first, so the border keeps its own coordinates.
  for (const p of outline) snapVertex([p[0], p[1]]);

  const geometries: Position[][][][] = cells.map((mp) =>
    mp
      .map((poly) =>
        poly
          .map((ring) => {
            const out: Position[] = [];
            for (const p of ring) {
              const v = snapVertex(toLonLat(p));
              const last = out[out.length - 1];
              if (!last || last[0] !== v[0] || last[1] !== v[1]) out.push(v);
            }
            if (
              out.length > 1 &&
              (out[0][0] !== out[out.length - 1][0] || out[0][1] !== out[out.length - 1][1])
            ) {
              out.push(out[0]);
            }
            return out;
          })
          .filter((ring) => ring.length >= 4),
      )
      .filter((poly) => poly.length > 0)
      .map((poly) =>
        poly.map((ring, k) => {
          // RFC 7946: exterior rings counter-clockwise, holes clockwise.
          const ccw = ringAreaKm2(ring) > 0;
          return (k === 0) === ccw ? ring : ring.slice().reverse();
        }),
      ),
  );

  // Codes: blocks of a district numbered west to east.
  const names = r.shuffle(BLOCK_NAMES);
  const features: BlockFeature[] = [];
  let nameIndex = 0;
  for (const d of DISTRICTS) {
    const members = seeds
      .map((s, i) => ({ s, i }))
      .filter(({ s }) => s.district === d.code)
      .sort((a, b) => a.s.x - b.s.x);
    members.forEach(({ i }, k) => {
      const polys = geometries[i];
      const geometry: BlockGeometry =
        polys.length === 1
          ? { type: 'Polygon', coordinates: polys[0] }
          : { type: 'MultiPolygon', coordinates: polys };
      features.push({
        type: 'Feature',
        properties: {
          district_code: d.code,
          district_name: d.name,
          block_code: `${d.code}-${String(k + 1).padStart(2, '0')}`,
          block_name: names[nameIndex++],
        },
        geometry,
      });
    });
  }
  return { type: 'FeatureCollection', name: 'Vessary Province blocks (invented)', features };
}

/** The polygons of a block geometry, always as a MultiPolygon coordinate array. */
export function polygonsOf(g: BlockGeometry): Position[][][] {
  return g.type === 'Polygon' ? [g.coordinates] : g.coordinates;
}
