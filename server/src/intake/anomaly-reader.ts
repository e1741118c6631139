import type { AnomalyVariable } from '@stormhour/shared';
import { fromArrayBuffer, type GeoTIFFImage } from 'geotiff';
import { climatologyKeys, type FieldKind } from './anomaly-climatology.js';
import { crsFromGeoKeys, FileProblem, pixelPlacement } from './geotiff-reader.js';
import { bilinearWeights, lonLatGridFor, resampleBand } from './lonlat-resample.js';
import { readBands } from './tiff-bands.js';
import { timeFromFileName } from './times.js';

export type AnomalyUnits = 'g/kg' | 'kg/kg' | 'm/s' | 'kt';

export interface AnomalyGrid {
  nx: number;
  ny: number;
  /** Centre of the first column and of the first (northern) row, degrees; spacing in degrees. */
  lon0: number;
  lat0: number;
  dLon: number;
  dLat: number;
}

export interface AnomalyFile {
  variable: AnomalyVariable;
  levelHpa: number;
  /** What was done to the values to reach g/kg or m/s, in words, for the job's report. */
  conversion: string;
  /** How a projected file was put on the lon–lat grid, in words; null when it already was lon–lat. */
  reprojection: string | null;
  /** A climatology's bands are months or days of the year (`date` then holds "MM" or "MM-DD"). */
  climatology: 'monthly' | 'daily' | null;
  grid: AnomalyGrid;
  /** `where` names the band or the CSV date the day came from, for messages. */
  days: { date: string; where: string; values: Float32Array }[];
}

const VARIABLE_NAMES: Record<string, AnomalyVariable> = {
  q: 'q',
  q850: 'q',
  specific_humidity: 'q',
  specific_humidity_anomaly: 'q',
  u: 'u',
  u850: 'u',
  v: 'v',
  v850: 'v',
};

/** Factors to our units: g/kg for humidity, m/s for wind (1 kt = 1852 m / 3600 s, by definition). */
const TO_CANONICAL: Record<
  AnomalyUnits,
  { factor: number; canonical: string; variables: AnomalyVariable[] }
> = {
  'g/kg': { factor: 1, canonical: 'g/kg', variables: ['q'] },
  'kg/kg': { factor: 1000, canonical: 'g/kg', variables: ['q'] },
  'm/s': { factor: 1, canonical: 'm/s', variables: ['u', 'v'] },
  kt: { factor: 1852 / 3600, canonical: 'm/s', variables: ['u', 'v'] },
};

export function unitsOf(text: unknown): AnomalyUnits | null {
  if (typeof text !== 'string') return null;
  const t = text.trim().toLowerCase().replace(/\s+/g, '');
  if (t === 'g/kg' || t === 'gkg-1' || t === 'g kg-1') return 'g/kg';
  if (t === 'kg/kg' || t === 'kgkg-1' || t === '1') return 'kg/kg';
  if (t === 'm/s' || t === 'ms-1' || t === 'm s-1') return 'm/s';
  if (t === 'kt' || t === 'kts' || t === 'knots' || t === 'knot') return 'kt';
  return null;
}

const DATE = /^\d{4}-\d{2}-\d{2}$/;

export interface AnomalyReadOptions {
  variable?: AnomalyVariable;
  units?: AnomalyUnits;
  fieldKind?: FieldKind;
  /** For dates from the file name: the name and a pattern such as "q850_YYYYMMDD.tif" (the first band's day). */
  fileName?: string;
  timePattern?: string;
}

/** Each band's date: its DATE metadata, the file's DATES list, or consecutive days from the file name. */
async function bandDates(
  image: GeoTIFFImage,
  bands: number,
  meta: Record<string, unknown>,
  opts: AnomalyReadOptions,
): Promise<string[]> {
  const fileDates = typeof meta.DATES === 'string' ? meta.DATES.split(',').map((d) => d.trim()) : [];
  let firstFromName: number | null = null;
  if (opts.timePattern && opts.fileName) {
    firstFromName = timeFromFileName(opts.fileName, opts.timePattern, true);
    if (firstFromName === null)
      throw new FileProblem('file name', `does not match the date pattern ${opts.timePattern}`);
  }
  const dates: string[] = [];
  for (let b = 0; b < bands; b++) {
    const bandMeta = (await image.getGDALMetadata(b)) ?? {};
    const date =
      typeof bandMeta.DATE === 'string'
        ? bandMeta.DATE.trim()
        : (fileDates[b] ??
          (firstFromName !== null
            ? new Date(firstFromName + b * 86_400_000).toISOString().slice(0, 10)
            : undefined));
    if (!date)
      throw new FileProblem(
        `band ${b + 1}`,
        'has no date: give DATE (YYYY-MM-DD) in its metadata or DATES for the file, or a file-name pattern such as q850_YYYYMMDD.tif for the first band (one day per band)',
      );
    if (!DATE.test(date) || Number.isNaN(Date.parse(date)))
      throw new FileProblem(`band ${b + 1}`, `"${date}" is not a date such as 2025-06-01`);
    if (dates.includes(date))
      throw new FileProblem(`band ${b + 1}`, `repeats the date ${date} of band ${dates.indexOf(date) + 1}`);
    dates.push(date);
  }
  return dates;
}

/**
 * Reads a daily anomaly GeoTIFF: one band per day (or, for a climatology, per month or day of the
 * year), the date of each band in its metadata (DATE), in a file-level DATES list or from a file-name
 * pattern, the variable and units from the metadata or from the uploader. Values are converted to g/kg
 * or m/s; nodata becomes NaN. A file in a projected CRS (an EPSG code proj4 knows, or a user-defined
 * azimuthal equidistant one) is resampled bilinearly onto a lon–lat grid over its footprint.
 */
export async function readAnomalyTiff(content: Buffer, given: AnomalyReadOptions): Promise<AnomalyFile> {
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
  const crs = crsFromGeoKeys(image.getGeoKeys() as Record<string, unknown> | null);
  const { origin, resolution } = pixelPlacement(image);
  const meta = (await image.getGDALMetadata(null)) ?? {};
  const named =
    typeof meta.VARIABLE === 'string' ? VARIABLE_NAMES[meta.VARIABLE.trim().toLowerCase()] : undefined;
  const variable = given.variable ?? named;
  if (!variable)
    throw new FileProblem(
      'metadata VARIABLE',
      'the file does not say which field it holds: choose q, u or v',
    );
  const units = given.units ?? unitsOf(meta.UNITS);
  if (!units)
    throw new FileProblem(
      'metadata UNITS',
      `the units "${String(meta.UNITS ?? '')}" are not known: choose g/kg, kg/kg, m/s or kt`,
    );
  const rule = TO_CANONICAL[units];
  if (!rule.variables.includes(variable))
    throw new FileProblem('units', `${units} are not units of ${variable}`);
  const levelHpa = Number(meta.LEVEL_HPA ?? 850);

  const bands = image.getSamplesPerPixel();
  let keys: string[];
  let climatology: AnomalyFile['climatology'] = null;
  if (given.fieldKind === 'climatology') {
    const bandMeta: Record<string, unknown>[] = [];
    for (let b = 0; b < bands; b++) bandMeta.push((await image.getGDALMetadata(b)) ?? {});
    const found = climatologyKeys(bands, bandMeta);
    keys = found.keys;
    climatology = found.period;
  } else keys = await bandDates(image, bands, meta, given);

  const [x0, y0] = origin;
  const [dx, dy] = resolution;
  const nx = image.getWidth();
  const ny = image.getHeight();
  const data = await readBands(image, {
    scale: Array(bands).fill(rule.factor),
    offset: Array(bands).fill(0),
    nodata: image.getGDALNoData(),
  });
  const plane = nx * ny;
  const conversion =
    rule.factor === 1
      ? `already in ${rule.canonical}`
      : `${units} × ${rule.factor.toPrecision(6)} → ${rule.canonical}`;
  const where = (b: number) => (climatology ? `band ${b + 1} (${keys[b]})` : `band ${b + 1}`);
  if (crs === 'EPSG:4326') {
    return {
      variable,
      levelHpa,
      conversion,
      reprojection: null,
      climatology,
      grid: { nx, ny, lon0: x0 + dx / 2, lat0: y0 + dy / 2, dLon: dx, dLat: Math.abs(dy) },
      days: keys.map((date, b) => ({
        date,
        where: where(b),
        values: data.slice(b * plane, (b + 1) * plane),
      })),
    };
  }
  // Projected: one set of bilinear weights, applied to every band.
  const source = { nx, ny, x0, y0, dx, dy };
  const grid = lonLatGridFor(source, crs);
  const weights = bilinearWeights(source, crs, grid);
  return {
    variable,
    levelHpa,
    conversion,
    reprojection: `${crs.startsWith('EPSG:') ? crs : 'azimuthal equidistant'} resampled bilinearly to ${grid.dLon}° × ${grid.dLat}° lon–lat`,
    climatology,
    grid,
    days: keys.map((date, b) => ({
      date,
      where: where(b),
      values: resampleBand(data.subarray(b * plane, (b + 1) * plane), nx, ny, weights),
    })),
  };
}
