import { fromArrayBuffer, type GeoTIFFImage } from 'geotiff';
import proj4 from 'proj4';
import type { PlacedGrid } from '../radar/engine/grid.js';
import type { SitePlane } from '../radar/engine/site-plane.js';
import { FileProblem } from './file-problem.js';
import { readBands } from './tiff-bands.js';
import { parseTime, timeFromFileName } from './times.js';
import './zlib-decoder.js';

export { FileProblem };

export interface ReadOptions {
  fileName: string;
  /** 'volume' needs several bands with heights; 'column-max' one band. */
  kind: 'volume' | 'column-max';
  timePattern?: string;
  plane: SitePlane;
  latestTime: number;
}

export interface ReadGrid {
  time: number;
  grid: PlacedGrid;
}

/** proj4 definition of the file's CRS, from its GeoKeys (GeoTIFF 1.1, OGC 19-008r4). */
export function crsFromGeoKeys(keys: Record<string, unknown> | null): string {
  if (!keys || keys.GTModelTypeGeoKey === undefined) {
    throw new FileProblem(
      'GeoKeys',
      'the file has no georeferencing (no GeoKey directory): it is a plain TIFF',
    );
  }
  const model = Number(keys.GTModelTypeGeoKey);
  if (model === 2) {
    const gcs = Number(keys.GeographicTypeGeoKey ?? 4326);
    if (gcs !== 4326 && gcs !== 32767)
      throw new FileProblem(
        'GeographicTypeGeoKey',
        `geographic CRS EPSG:${gcs} is not supported; use WGS 84 (EPSG:4326)`,
      );
    return 'EPSG:4326';
  }
  if (model !== 1)
    throw new FileProblem(
      'GTModelTypeGeoKey',
      `model type ${model} is neither projected (1) nor geographic (2)`,
    );
  const pcs = Number(keys.ProjectedCSTypeGeoKey ?? 32767);
  if (pcs !== 32767) {
    const code = `EPSG:${pcs}`;
    if (!proj4.defs(code))
      throw new FileProblem(
        'ProjectedCSTypeGeoKey',
        `projected CRS ${code} is not known here; UTM zones on WGS 84 are`,
      );
    return code;
  }
  const transform = Number(keys.ProjCoordTransGeoKey);
  // CT_AzimuthalEquidistant = 12 in the GeoTIFF specification's coordinate-transformation codes.
  if (transform !== 12) {
    throw new FileProblem(
      'ProjCoordTransGeoKey',
      `user-defined projection ${transform} is not supported; use azimuthal equidistant (12) or an EPSG code`,
    );
  }
  const lat = Number(keys.ProjCenterLatGeoKey ?? keys.ProjNatOriginLatGeoKey);
  const lon = Number(keys.ProjCenterLongGeoKey ?? keys.ProjNatOriginLongGeoKey);
  if (!Number.isFinite(lat) || !Number.isFinite(lon))
    throw new FileProblem('ProjCenterLatGeoKey', 'the azimuthal equidistant centre is missing');
  const fe = Number(keys.ProjFalseEastingGeoKey ?? 0);
  const fn = Number(keys.ProjFalseNorthingGeoKey ?? 0);
  return `+proj=aeqd +lat_0=${lat} +lon_0=${lon} +x_0=${fe} +y_0=${fn} +datum=WGS84 +units=m +no_defs`;
}

/** The outer corner of the first pixel and the pixel size, in the file's CRS (tie point and pixel scale). */
export function pixelPlacement(image: GeoTIFFImage): { origin: number[]; resolution: number[] } {
  try {
    return { origin: image.getOrigin(), resolution: image.getResolution() };
  } catch {
    throw new FileProblem(
      'ModelTiepointTag',
      'the file has GeoKeys but no tie point and pixel scale to place its pixels',
    );
  }
}

function numberList(v: unknown): number[] | null {
  if (typeof v !== 'string' || v.trim() === '') return null;
  const list = v.split(/[,\s]+/).map(Number);
  return list.every(Number.isFinite) ? list : null;
}

async function levelHeightsM(
  image: GeoTIFFImage,
  bands: number,
  fileMeta: Record<string, unknown>,
): Promise<number[]> {
  const perBand: number[] = [];
  for (let b = 0; b < bands; b++) {
    const meta = (await image.getGDALMetadata(b)) ?? {};
    const km = Number(meta.HEIGHT_KM);
    const m = Number(meta.HEIGHT_M);
    if (Number.isFinite(km)) perBand.push(km * 1000);
    else if (Number.isFinite(m)) perBand.push(m);
    else break;
  }
  if (perBand.length === bands) return perBand;
  const listKm = numberList(fileMeta.LEVEL_HEIGHTS_KM);
  if (listKm?.length === bands) return listKm.map((k) => k * 1000);
  const listM = numberList(fileMeta.LEVEL_HEIGHTS_M);
  if (listM?.length === bands) return listM;
  throw new FileProblem(
    perBand.length < bands ? `band ${perBand.length + 1}` : 'metadata',
    `the file has ${bands} bands but no height for each: give HEIGHT_KM per band or LEVEL_HEIGHTS_KM for the file`,
  );
}

function scanTime(fileMeta: Record<string, unknown>, opts: ReadOptions): number {
  for (const key of ['SCAN_TIME_UTC', 'SCAN_TIME', 'TIME_UTC', 'DATETIME']) {
    const v = fileMeta[key];
    if (typeof v === 'string' && v.trim()) {
      const t = parseTime(v.trim().endsWith('Z') || /[+-]\d{2}:?\d{2}$/.test(v.trim()) ? v : `${v}Z`);
      if (t === null) throw new FileProblem(`metadata ${key}`, `"${v}" is not a time`);
      return t;
    }
  }
  if (opts.timePattern) {
    const t = timeFromFileName(opts.fileName, opts.timePattern);
    if (t === null) throw new FileProblem('file name', `does not match the time pattern ${opts.timePattern}`);
    return t;
  }
  throw new FileProblem(
    'metadata',
    'the scan time is not in the metadata (SCAN_TIME_UTC); give a file-name time pattern',
  );
}

/**
 * Reads a reflectivity GeoTIFF (one band per height level, or one band for a 2-D field) into a grid
 * on the site's plane: values to dBZ with the bands' scale and offset, nodata to NaN, every column
 * placed by the file's own georeferencing and reprojected with proj4.
 */
export async function readReflectivityTiff(content: Buffer, opts: ReadOptions): Promise<ReadGrid> {
  let image: GeoTIFFImage;
  try {
    const buffer = content.buffer.slice(
      content.byteOffset,
      content.byteOffset + content.byteLength,
    ) as ArrayBuffer;
    image = await (await fromArrayBuffer(buffer)).getImage(0);
  } catch (e) {
    throw new FileProblem(null, `it is not a GeoTIFF file (${(e as Error).message})`);
  }
  const nx = image.getWidth();
  const ny = image.getHeight();
  const bands = image.getSamplesPerPixel();
  const crs = crsFromGeoKeys(image.getGeoKeys() as Record<string, unknown> | null);
  const { origin, resolution } = pixelPlacement(image);
  const fileMeta = (await image.getGDALMetadata(null)) ?? {};
  if (opts.kind === 'column-max' && bands !== 1)
    throw new FileProblem(null, `a column-maximum field has one band, this file has ${bands}`);
  if (opts.kind === 'volume' && bands < 2)
    throw new FileProblem(
      null,
      'a volume needs one band per height level; this file has one band (upload it as a column-maximum field)',
    );
  const heights = opts.kind === 'volume' ? await levelHeightsM(image, bands, fileMeta) : [];
  const time = scanTime(fileMeta, opts);
  if (time > opts.latestTime)
    throw new FileProblem('metadata SCAN_TIME_UTC', `${new Date(time).toISOString()} is in the future`);

  const scale: number[] = [];
  const offset: number[] = [];
  for (let b = 0; b < bands; b++) {
    const meta = (await image.getGDALMetadata(b)) ?? {};
    scale.push(Number(meta.SCALE ?? fileMeta.SCALE ?? 1));
    offset.push(Number(meta.OFFSET ?? fileMeta.OFFSET ?? 0));
  }
  const data = await readBands(image, { scale, offset, nodata: image.getGDALNoData() });
  const plane = nx * ny;
  for (let b = 0; b < bands; b++) {
    let valid = false;
    let infinite = 0;
    let firstInfinite = -1;
    for (let i = b * plane; i < (b + 1) * plane; i++) {
      const v = data[i];
      if (v === Number.POSITIVE_INFINITY || v === Number.NEGATIVE_INFINITY) {
        if (infinite++ === 0) firstInfinite = i - b * plane;
      } else if (!Number.isNaN(v)) valid = true;
    }
    if (!valid) throw new FileProblem(`band ${b + 1}`, 'has no data: every value is nodata');
    // An infinite value is no reflectivity: a damaged file, or missing values not marked as nodata.
    if (infinite > 0)
      throw new FileProblem(
        `band ${b + 1}`,
        `holds ${infinite} infinite ${infinite === 1 ? 'value' : 'values'} (the first at column ${(firstInfinite % nx) + 1}, row ${Math.floor(firstInfinite / nx) + 1}): reflectivity must be finite; mark missing values with the file's nodata value`,
      );
  }

  const toSite = sameAsPlane(crs, opts.plane) ? null : proj4(crs, 'EPSG:4326');
  const xKm = new Float64Array(plane);
  const yKm = new Float64Array(plane);
  const areaKm2 = new Float64Array(plane);
  const [x0, y0] = origin;
  const [sx, sy] = resolution; // sy is negative for north-up images
  const geographic = crs === 'EPSG:4326';
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const X = x0 + (i + 0.5) * sx;
      const Y = y0 + (j + 0.5) * sy;
      const k = j * nx + i;
      if (!toSite) {
        xKm[k] = X / 1000;
        yKm[k] = Y / 1000;
      } else {
        const [lon, lat] = geographic ? [X, Y] : toSite.forward([X, Y]);
        [xKm[k], yKm[k]] = opts.plane.toKm(lon, lat);
      }
      areaKm2[k] = geographic
        ? geographicCellAreaKm2(Y, Math.abs(sx), Math.abs(sy))
        : Math.abs(sx * sy) / 1e6;
    }
  }
  return {
    time,
    grid: {
      nx,
      ny,
      nz: bands,
      data,
      levelHeightsM: heights,
      xKm,
      yKm,
      areaKm2,
      toLonLat: opts.plane.toLonLat,
    },
  };
}

/** A radar-centred file on the site's own plane needs no reprojection, only metres to km. */
function sameAsPlane(crs: string, plane: SitePlane): boolean {
  if (crs === plane.definition) return true;
  const param = (def: string, key: string) =>
    Number(new RegExp(`\\+${key}=([-0-9.e]+)`).exec(def)?.[1] ?? Number.NaN);
  return (
    crs.includes('+proj=aeqd') &&
    ['lat_0', 'lon_0'].every((k) => Math.abs(param(crs, k) - param(plane.definition, k)) < 1e-9) &&
    (param(crs, 'x_0') || 0) === 0 &&
    (param(crs, 'y_0') || 0) === 0
  );
}

/** Area of a lon/lat cell on WGS84 from the meridian and prime-vertical radii (Snyder 1987). */
function geographicCellAreaKm2(latDeg: number, dLonDeg: number, dLatDeg: number): number {
  const a = 6378.137;
  const e2 = 0.00669437999014;
  const phi = (latDeg * Math.PI) / 180;
  const w = 1 - e2 * Math.sin(phi) ** 2;
  const M = (a * (1 - e2)) / w ** 1.5;
  const N = a / Math.sqrt(w);
  return M * N * Math.cos(phi) * ((dLonDeg * Math.PI) / 180) * ((dLatDeg * Math.PI) / 180);
}
