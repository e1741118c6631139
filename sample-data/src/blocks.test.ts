import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import turfArea from '@turf/area';
import kinks from '@turf/kinks';
import type { Feature, MultiPolygon, Polygon } from 'geojson';
import polygonClipping, { type MultiPolygon as PcMultiPolygon } from 'polygon-clipping';
import { describe, expect, it } from 'vitest';
import { DEFAULT_SEED } from './config.js';
import { polygonAreaKm2 } from './geo.js';
import { BLOCK_NAMES } from './names.js';
import { provinceOutline } from './province.js';

const dir = new URL('../vessary/', import.meta.url);
const blocks = JSON.parse(readFileSync(fileURLToPath(new URL('blocks.geojson', dir)), 'utf8')) as {
  type: string;
  features: Feature<Polygon | MultiPolygon, Record<string, string>>[];
};
const outline = provinceOutline(DEFAULT_SEED);
const polys = (f: Feature<Polygon | MultiPolygon>): PcMultiPolygon =>
  (f.geometry.type === 'Polygon' ? [f.geometry.coordinates] : f.geometry.coordinates) as PcMultiPolygon;
/** Geodesic area (km²) of a polygon-clipping result, by @turf/area. */
const areaKm2 = (mp: PcMultiPolygon): number =>
  mp.length ? turfArea({ type: 'MultiPolygon', coordinates: mp }) / 1e6 : 0;

describe('blocks.geojson (import contract)', () => {
  it('is a FeatureCollection of Polygon/MultiPolygon features with the four properties', () => {
    expect(blocks.type).toBe('FeatureCollection');
    for (const f of blocks.features) {
      expect(f.type).toBe('Feature');
      expect(['Polygon', 'MultiPolygon']).toContain(f.geometry.type);
      expect(Object.keys(f.properties).sort()).toEqual([
        'block_code',
        'block_name',
        'district_code',
        'district_name',
      ]);
      expect(f.properties.block_code).toMatch(/^[A-Z0-9][A-Z0-9_-]{0,23}$/);
      expect(f.properties.block_code.startsWith(`${f.properties.district_code}-`)).toBe(true);
      expect(BLOCK_NAMES).toContain(f.properties.block_name);
    }
    const codes = blocks.features.map((f) => f.properties.block_code);
    expect(new Set(codes).size).toBe(codes.length);
    const names = blocks.features.map((f) => f.properties.block_name);
    expect(new Set(names).size).toBe(names.length);
  });

  it('has the four districts with five to eight blocks each', () => {
    const byDistrict = new Map<string, { name: string; n: number }>();
    for (const f of blocks.features) {
      const e = byDistrict.get(f.properties.district_code) ?? { name: f.properties.district_name, n: 0 };
      expect(e.name).toBe(f.properties.district_name);
      e.n++;
      byDistrict.set(f.properties.district_code, e);
    }
    expect([...byDistrict.keys()].sort()).toEqual(['HLF', 'LKS', 'RVB', 'UPL']);
    expect(Object.fromEntries([...byDistrict.entries()].map(([k, v]) => [k, v.name]))).toEqual({
      RVB: 'Riverbend',
      LKS: 'Lakeshore',
      HLF: 'Hillfoot',
      UPL: 'Upland',
    });
    for (const { n } of byDistrict.values()) {
      expect(n).toBeGreaterThanOrEqual(5);
      expect(n).toBeLessThanOrEqual(8);
    }
  });

  it('has closed, counter-clockwise, non-self-intersecting rings in WGS84 lon/lat with ≤ 6 decimals', () => {
    for (const f of blocks.features) {
      for (const poly of polys(f)) {
        poly.forEach((ring, k) => {
          expect(ring.length).toBeGreaterThanOrEqual(4);
          expect(ring[0]).toEqual(ring[ring.length - 1]);
          if (k === 0) expect(polygonAreaKm2([ring])).toBeGreaterThan(0);
          for (const [lon, lat] of ring) {
            expect(lon).toBeGreaterThan(86);
            expect(lon).toBeLessThan(90);
            expect(lat).toBeGreaterThan(12.5);
            expect(lat).toBeLessThan(15.5);
            expect(Math.abs(lon * 1e6 - Math.round(lon * 1e6))).toBeLessThan(1e-6);
            expect(Math.abs(lat * 1e6 - Math.round(lat * 1e6))).toBeLessThan(1e-6);
          }
        });
      }
      expect(kinks(f).features, f.properties.block_code).toHaveLength(0);
    }
  });

  it('tiles the province: the union equals the province within 0.5 %', () => {
    const union = polygonClipping.union(polys(blocks.features[0]), ...blocks.features.slice(1).map(polys));
    const province = areaKm2([[outline]]);
    expect(province).toBeGreaterThan(60_000);
    expect(Math.abs(areaKm2(union) - province) / province).toBeLessThan(0.005);
    // nothing outside the province, nothing of the province left out
    expect(areaKm2(polygonClipping.difference(union, [outline]))).toBeLessThan(0.01);
    expect(areaKm2(polygonClipping.difference([outline], union))).toBeLessThan(0.01);
    // and the union is one piece without holes
    expect(union).toHaveLength(1);
    expect(union[0]).toHaveLength(1);
  });

  it('has no pair of blocks overlapping by more than 0.01 km²', () => {
    const all = blocks.features.map(polys);
    const bbox = all.map((mp) => {
      const pts = mp.flat(2);
      return [
        Math.min(...pts.map((p) => p[0])),
        Math.min(...pts.map((p) => p[1])),
        Math.max(...pts.map((p) => p[0])),
        Math.max(...pts.map((p) => p[1])),
      ];
    });
    let pairs = 0;
    for (let i = 0; i < all.length; i++) {
      for (let j = i + 1; j < all.length; j++) {
        const [a, b] = [bbox[i], bbox[j]];
        if (a[2] < b[0] || b[2] < a[0] || a[3] < b[1] || b[3] < a[1]) continue;
        pairs++;
        expect(areaKm2(polygonClipping.intersection(all[i], all[j])), `${i}/${j}`).toBeLessThan(0.01);
      }
    }
    expect(pairs).toBeGreaterThan(20);
  });

  it('shares vertices exactly: every inner edge is used by exactly two blocks, in opposite directions', () => {
    const key = (p: number[]) => `${p[0]},${p[1]}`;
    const edges = new Map<string, number>();
    for (const f of blocks.features) {
      for (const poly of polys(f)) {
        for (const ring of poly) {
          for (let i = 0; i + 1 < ring.length; i++) {
            const k = `${key(ring[i])}>${key(ring[i + 1])}`;
            edges.set(k, (edges.get(k) ?? 0) + 1);
          }
        }
      }
    }
    const outlineKeys = new Set(outline.map(key));
    const onOutline = (p: string) => {
      if (outlineKeys.has(p)) return true;
      const [x, y] = p.split(',').map(Number);
      for (let i = 0; i + 1 < outline.length; i++) {
        const [x1, y1] = outline[i];
        const [x2, y2] = outline[i + 1];
        const t = ((x - x1) * (x2 - x1) + (y - y1) * (y2 - y1)) / ((x2 - x1) ** 2 + (y2 - y1) ** 2);
        if (t < 0 || t > 1) continue;
        if (Math.hypot(x - (x1 + t * (x2 - x1)), y - (y1 + t * (y2 - y1))) < 2e-6) return true;
      }
      return false;
    };
    let inner = 0;
    for (const [k, n] of edges) {
      expect(n).toBe(1);
      const [p, q] = k.split('>');
      if (edges.has(`${q}>${p}`)) inner++;
      else expect(onOutline(p) && onOutline(q), k).toBe(true);
    }
    expect(inner).toBeGreaterThan(100);
  });
});

describe('block partition for other seeds', () => {
  it('tiles the province for every seed tried', async () => {
    const { generateBlocks } = await import('./blocks.js');
    for (const seed of [1, 2, 3, 42, 99, 12345]) {
      const o = provinceOutline(seed);
      const fc = generateBlocks(seed, o);
      const mps = fc.features.map((f) => polys(f as unknown as Feature<Polygon | MultiPolygon>));
      const sum = mps.reduce((s, mp) => s + areaKm2(mp), 0);
      const union = polygonClipping.union(mps[0], ...mps.slice(1));
      const province = areaKm2([[o]]);
      expect(Math.abs(sum - province) / province, `seed ${seed}`).toBeLessThan(0.005);
      expect(Math.abs(areaKm2(union) - province) / province, `seed ${seed}`).toBeLessThan(0.005);
      for (const f of fc.features) expect(kinks(f as unknown as Feature<Polygon>).features).toHaveLength(0);
    }
  });
});
