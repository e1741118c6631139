import { aeqdKeys, encodeGeoTiff, GEOKEY, gdalMetadataXml } from '@stormhour/sample-data';
import proj4 from 'proj4';
import { describe, expect, it } from 'vitest';
import { readAnomalyTiff } from './anomaly-reader.js';
import { bilinearWeights, lonLatGridFor, resampleBand } from './lonlat-resample.js';

const dms = (d: number, m: number, s: number) => d + m / 60 + s / 3600;

describe('proj4, the projection library the resampler relies on', () => {
  it('reproduces the EPSG worked examples (REFERENCES §6)', () => {
    // EPSG Guidance Note 7-2, Transverse Mercator, British National Grid on Airy 1830 (published).
    const bng =
      '+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996012717 +x_0=400000 +y_0=-100000 +a=6377563.396 +rf=299.3249646 +units=m +no_defs';
    const [e, n] = proj4('EPSG:4326', bng, [0.5, 50.5]);
    expect(Math.abs(e - 577_274.99)).toBeLessThan(0.02);
    expect(Math.abs(n - 69_740.5)).toBeLessThan(0.02);
    // EPSG GN 7-2, azimuthal equidistant, Guam 1963 / Yap Islands on Clarke 1866 (published; PROJ aeqd).
    const yap = `+proj=aeqd +lat_0=${dms(9, 32, 48.15)} +lon_0=${dms(138, 10, 7.48)} +x_0=40000 +y_0=60000 +ellps=clrk66 +units=m +no_defs`;
    const [x, y] = proj4('EPSG:4326', yap, [dms(138, 11, 34.908), dms(9, 35, 47.493)]);
    expect(Math.abs(x - 42_665.9)).toBeLessThan(0.02);
    expect(Math.abs(y - 65_509.82)).toBeLessThan(0.02);
  });

  it('takes a UTM zone on WGS 84 there and back to the millimetre (EPSG:32645)', () => {
    const utm = proj4('EPSG:4326', 'EPSG:32645');
    for (const p of [
      [87, 14],
      [85.3, 12.1],
      [89.9, 16.4],
    ]) {
      const [lon, lat] = utm.inverse(utm.forward(p));
      // 1e-8° is about a millimetre.
      expect(Math.abs(lon - p[0])).toBeLessThan(1e-8);
      expect(Math.abs(lat - p[1])).toBeLessThan(1e-8);
    }
    // On the central meridian a UTM easting is the false easting, 500 000 m (EPSG UTM definition).
    expect(utm.forward([87, 14])[0]).toBeCloseTo(500_000, 6);
  });
});

/** A field linear in longitude and latitude: bilinear interpolation of it should lose very little. */
const linear = (lon: number, lat: number) => 2 + 0.5 * (lon - 88) - 0.3 * (lat - 14);

/** A GeoTIFF of the linear field on a projected grid: each pixel holds the field at its centre. */
function projectedTiff(crs: string, geoKeys: Record<number, number | string | number[]>) {
  const nx = 40;
  const ny = 36;
  const size = 10_000;
  const toLonLat = proj4(crs, 'EPSG:4326');
  const centre = proj4('EPSG:4326', crs).forward([88, 14]);
  const x0 = Math.round(centre[0] / size) * size - (nx / 2) * size;
  const y0 = Math.round(centre[1] / size) * size + (ny / 2) * size;
  const bands = 2;
  const data = new Float32Array(nx * ny * bands);
  for (let j = 0; j < ny; j++)
    for (let i = 0; i < nx; i++) {
      const [lon, lat] = toLonLat.forward([x0 + (i + 0.5) * size, y0 - (j + 0.5) * size]);
      const k = j * nx + i;
      data[k * bands] = linear(lon, lat);
      data[k * bands + 1] = 10 * linear(lon, lat);
    }
  const file = encodeGeoTiff({
    width: nx,
    height: ny,
    bands,
    data,
    pixelScale: [size, size],
    origin: [x0, y0],
    geoKeys,
    gdalNodata: '-9999',
    gdalMetadataXml: gdalMetadataXml([
      { name: 'VARIABLE', value: 'q' },
      { name: 'UNITS', value: 'g/kg' },
      { name: 'DATES', value: '2025-06-01,2025-06-02' },
    ]),
  });
  return { file, nx, ny, size, x0, y0 };
}

const utmKeys = {
  [GEOKEY.GTModelType]: 1,
  [GEOKEY.GTRasterType]: 1,
  [GEOKEY.ProjectedCSType]: 32645,
  [GEOKEY.ProjLinearUnits]: 9001,
};

describe('readAnomalyTiff on a projected grid', () => {
  it('reads a linear lon–lat field written on UTM 45N back to the same values on a lon–lat grid', async () => {
    const { file } = projectedTiff('EPSG:32645', utmKeys);
    const read = await readAnomalyTiff(file, {});
    // 10 km pixels near 14° N: about 0.09° of latitude and 0.093° of longitude.
    expect(read.grid.dLat).toBeCloseTo(10_000 / 111_195, 3);
    expect(read.grid.dLon).toBeCloseTo(10_000 / (111_195 * Math.cos((14 * Math.PI) / 180)), 3);
    expect(read.reprojection).toMatch(/^EPSG:32645 resampled bilinearly/);
    const g = read.grid;
    let compared = 0;
    for (let j = 0; j < g.ny; j++)
      for (let i = 0; i < g.nx; i++) {
        const v = read.days[0].values[j * g.nx + i];
        if (Number.isNaN(v)) continue;
        compared++;
        // Interpolation tolerance: the field is linear in lon/lat, nearly linear across a 10 km pixel.
        expect(Math.abs(v - linear(g.lon0 + i * g.dLon, g.lat0 - j * g.dLat))).toBeLessThan(2e-4);
      }
    // The UTM footprint is a slightly turned rectangle: most of its lon–lat box has data.
    expect(compared).toBeGreaterThan(0.85 * g.nx * g.ny);
    expect(read.days.map((d) => d.date)).toEqual(['2025-06-01', '2025-06-02']);
  });

  it('reads a user-defined azimuthal equidistant grid (as the radar files use) the same way', async () => {
    const crs = '+proj=aeqd +lat_0=14.18 +lon_0=87.95 +x_0=0 +y_0=0 +datum=WGS84 +units=m +no_defs';
    const { file } = projectedTiff(crs, aeqdKeys(14.18, 87.95, 'test aeqd'));
    const read = await readAnomalyTiff(file, {});
    const g = read.grid;
    let worst = 0;
    for (let j = 0; j < g.ny; j++)
      for (let i = 0; i < g.nx; i++) {
        const v = read.days[1].values[j * g.nx + i];
        if (!Number.isNaN(v))
          worst = Math.max(worst, Math.abs(v - 10 * linear(g.lon0 + i * g.dLon, g.lat0 - j * g.dLat)));
      }
    expect(worst).toBeLessThan(2e-3);
  });

  it('keeps nodata out: cells next to a missing pixel take only the neighbours with data', () => {
    const src = { nx: 3, ny: 3, x0: 0, y0: 3, dx: 1, dy: -1 };
    // A plane in plate carrée metres (degrees as units) so lon–lat and source coincide.
    const crs = 'EPSG:4326';
    const target = { nx: 2, ny: 1, lon0: 1, lat0: 2, dLon: 1, dLat: 1 };
    const w = bilinearWeights(src, crs, target);
    const band = Float32Array.from([0, 1, 2, 10, Number.NaN, 12, 20, 21, 22]);
    const out = resampleBand(band, 3, 3, w);
    // Halfway between rows 0 and 1 at column 0.5 → neighbours 0, 1, 10 and NaN: mean of the three weighted.
    expect(out[0]).toBeCloseTo((0 + 1 + 10) / 3, 5);
    expect(lonLatGridFor(src, crs).nx).toBeGreaterThan(0);
  });
});
