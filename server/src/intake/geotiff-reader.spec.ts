import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { deflateSync } from 'node:zlib';
import { encodeGeoTiff, gdalMetadataXml, geographicKeys } from '@stormhour/sample-data';
import { fromArrayBuffer } from 'geotiff';
import { describe, expect, it } from 'vitest';
import { sitePlane } from '../radar/engine/site-plane.js';
import { deflateStrip, fillBand, hideTags, TAG } from '../testing/tiff-surgery.js';
import { crsFromGeoKeys, readReflectivityTiff } from './geotiff-reader.js';

const demo = fileURLToPath(new URL('../../../sample-data/vessary/', import.meta.url));
const site = JSON.parse(readFileSync(join(demo, 'site.json'), 'utf8'));
const runDir = join(demo, readdirSync(demo).find((f) => f.startsWith('run-')) as string);
const volumeName = readdirSync(runDir).find((f) => f.startsWith('volume-')) as string;
const volume = readFileSync(join(runDir, volumeName));
const plane = sitePlane(site.location);
const read = (content: Buffer, over = {}) =>
  readReflectivityTiff(content, {
    fileName: volumeName,
    kind: 'volume',
    plane,
    latestTime: Date.now(),
    ...over,
  });

describe('readReflectivityTiff', () => {
  it('agrees with the geotiff package on every value (raw × scale + offset, nodata → NaN)', async () => {
    const { grid } = await read(volume);
    const image = await (
      await fromArrayBuffer(
        volume.buffer.slice(volume.byteOffset, volume.byteOffset + volume.byteLength) as ArrayBuffer,
      )
    ).getImage();
    const raw = (await image.readRasters({ interleave: false, samples: [3] })) as unknown as Uint8Array[];
    const plane2 = grid.nx * grid.ny;
    // The scale and offset the file declares (GDAL metadata), applied by hand.
    for (let i = 0; i < plane2; i += 997) {
      const v = raw[0][i];
      if (v === 255) expect(grid.data[3 * plane2 + i]).toBeNaN();
      else expect(grid.data[3 * plane2 + i]).toBeCloseTo(v * 0.5 - 32, 6);
    }
  });

  it('reads a DEFLATE-compressed copy to the same values (zlib decoder)', async () => {
    const plain = await read(volume);
    const packed = deflateStrip(volume, (b) => deflateSync(b));
    // The compressed strip is appended (the old one stays behind, unreferenced): it is much smaller.
    expect(packed.length - volume.length).toBeLessThan(volume.length / 5);
    const unpacked = await read(packed);
    expect(unpacked.grid.data).toEqual(plain.grid.data);
  });

  it('places the centre pixel on the radar (its own azimuthal equidistant grid)', async () => {
    const { grid } = await read(volume);
    const centre = Math.floor(grid.ny / 2) * grid.nx + Math.floor(grid.nx / 2);
    expect(grid.xKm[centre]).toBeCloseTo(0, 6);
    expect(grid.yKm[centre]).toBeCloseTo(0, 6);
    expect(grid.areaKm2[centre]).toBeCloseTo(1, 9);
  });

  it.each([
    ['a text file', Buffer.from('scan_time_utc\n2025-08-01T00:00:00Z\n'), null, /not a GeoTIFF file/],
    ['a TIFF without GeoKeys', hideTags(volume, [TAG.GeoKeyDirectory]), 'GeoKeys', /no georeferencing/],
    [
      'GeoKeys without tie points',
      hideTags(volume, [TAG.ModelTiepoint, TAG.ModelPixelScale]),
      'ModelTiepointTag',
      /no tie point/,
    ],
    ['levels without heights', hideTags(volume, [TAG.GdalMetadata]), 'band 1', /15 bands but no height/],
    ['an all-nodata band', fillBand(volume, 6, 15, 255), 'band 7', /every value is nodata/],
  ])('refuses %s, saying where', async (_what, content, where, problem) => {
    await expect(read(content)).rejects.toMatchObject({ where, message: expect.stringMatching(problem) });
  });

  it('refuses a band holding infinite values, saying which band and where the first is', async () => {
    // A float32 column-maximum field around the demo radar (GeoTIFF 1.1 geographic keys), one band.
    const nx = 20;
    const ny = 16;
    const values = new Float32Array(nx * ny).fill(20);
    values[3 * nx + 7] = Number.POSITIVE_INFINITY;
    values[9 * nx + 2] = Number.NEGATIVE_INFINITY;
    const tiff = (data: Float32Array) =>
      encodeGeoTiff({
        width: nx,
        height: ny,
        bands: 1,
        data,
        pixelScale: [0.01, 0.01],
        origin: [site.location.lon - 0.1, site.location.lat + 0.08],
        geoKeys: geographicKeys(),
        gdalMetadataXml: gdalMetadataXml([{ name: 'SCAN_TIME_UTC', value: '2025-08-01T09:00:00Z' }]),
      });
    const readField = (content: Buffer) => read(content, { kind: 'column-max', fileName: 'field.tif' });
    await expect(readField(tiff(values))).rejects.toMatchObject({
      where: 'band 1',
      message: expect.stringMatching(/holds 2 infinite values \(the first at column 8, row 4\)/),
    });
    // The same field with those two values finite is read.
    values[3 * nx + 7] = 40;
    values[9 * nx + 2] = 0;
    expect((await readField(tiff(values))).grid.data[3 * nx + 7]).toBe(40);
  });

  it('refuses a volume given as a column-maximum field, and a scan time in the future', async () => {
    await expect(read(volume, { kind: 'column-max' })).rejects.toThrow(/one band, this file has 15/);
    await expect(read(volume, { latestTime: Date.UTC(2020, 0, 1) })).rejects.toThrow(/in the future/);
  });

  it.each([
    // GeoTIFF 1.1 (OGC 19-008r4): model type 2 geographic, 1 projected; CT code 12 azimuthal equidistant.
    [{ GTModelTypeGeoKey: 2, GeographicTypeGeoKey: 4326 }, 'EPSG:4326'],
    [{ GTModelTypeGeoKey: 1, ProjectedCSTypeGeoKey: 32645 }, 'EPSG:32645'],
    [
      {
        GTModelTypeGeoKey: 1,
        ProjectedCSTypeGeoKey: 32767,
        ProjCoordTransGeoKey: 12,
        ProjCenterLatGeoKey: 14.18,
        ProjCenterLongGeoKey: 87.95,
      },
      '+proj=aeqd +lat_0=14.18 +lon_0=87.95 +x_0=0 +y_0=0 +datum=WGS84 +units=m +no_defs',
    ],
  ])('turns GeoKeys %o into %s', (keys, crs) => {
    expect(crsFromGeoKeys(keys)).toBe(crs);
  });

  it('refuses a projection it cannot place', () => {
    expect(() =>
      crsFromGeoKeys({ GTModelTypeGeoKey: 1, ProjectedCSTypeGeoKey: 32767, ProjCoordTransGeoKey: 7 }),
    ).toThrow(/user-defined projection 7 is not supported/);
  });
});
