import type { AnomalyVariable } from '@stormhour/shared';
import { fromArrayBuffer, type GeoTIFFImage } from 'geotiff';
import { crsFromGeoKeys, FileProblem } from './geotiff-reader.js';
import { readBands } from './tiff-bands.js';

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
  grid: AnomalyGrid;
  days: { date: string; values: Float32Array }[];
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

function unitsOf(text: unknown): AnomalyUnits | null {
  if (typeof text !== 'string') return null;
  const t = text.trim().toLowerCase().replace(/\s+/g, '');
  if (t === 'g/kg' || t === 'gkg-1' || t === 'g kg-1') return 'g/kg';
  if (t === 'kg/kg' || t === 'kgkg-1' || t === '1') return 'kg/kg';
  if (t === 'm/s' || t === 'ms-1' || t === 'm s-1') return 'm/s';
  if (t === 'kt' || t === 'kts' || t === 'knots' || t === 'knot') return 'kt';
  return null;
}

const DATE = /^\d{4}-\d{2}-\d{2}$/;

/**
 * Reads a daily anomaly GeoTIFF: one band per day on a longitude–latitude grid, the date of each band
 * in its metadata (DATE) or in a file-level DATES list, the variable and units from the metadata or
 * from the uploader. Values are converted to g/kg or m/s; nodata becomes NaN.
 */
export async function readAnomalyTiff(
  content: Buffer,
  given: { variable?: AnomalyVariable; units?: AnomalyUnits },
): Promise<AnomalyFile> {
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
  if (crs !== 'EPSG:4326') {
    throw new FileProblem(
      'GeoKeys',
      `anomaly grids must be on longitude–latitude (EPSG:4326); this file is in ${crs}`,
    );
  }
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
  const fileDates = typeof meta.DATES === 'string' ? meta.DATES.split(',').map((d) => d.trim()) : [];
  const dates: string[] = [];
  for (let b = 0; b < bands; b++) {
    const bandMeta = (await image.getGDALMetadata(b)) ?? {};
    const date = typeof bandMeta.DATE === 'string' ? bandMeta.DATE.trim() : fileDates[b];
    if (!date || !DATE.test(date))
      throw new FileProblem(`band ${b + 1}`, 'has no date (DATE as YYYY-MM-DD in its metadata)');
    if (dates.includes(date))
      throw new FileProblem(`band ${b + 1}`, `repeats the date ${date} of band ${dates.indexOf(date) + 1}`);
    dates.push(date);
  }

  const [lonEdge, latEdge] = image.getOrigin();
  const [dLon, dLatSigned] = image.getResolution();
  const nx = image.getWidth();
  const ny = image.getHeight();
  const data = await readBands(image, {
    scale: Array(bands).fill(rule.factor),
    offset: Array(bands).fill(0),
    nodata: image.getGDALNoData(),
  });
  const plane = nx * ny;
  return {
    variable,
    levelHpa,
    conversion:
      rule.factor === 1
        ? `already in ${rule.canonical}`
        : `${units} × ${rule.factor.toPrecision(6)} → ${rule.canonical}`,
    grid: {
      nx,
      ny,
      lon0: lonEdge + dLon / 2,
      lat0: latEdge + dLatSigned / 2,
      dLon,
      dLat: Math.abs(dLatSigned),
    },
    days: dates.map((date, b) => ({ date, values: data.slice(b * plane, (b + 1) * plane) })),
  };
}
