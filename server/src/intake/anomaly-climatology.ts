import type { AnomalyVariable, FieldKind } from '@stormhour/shared';
import { FileProblem } from './geotiff-reader.js';

export type { FieldKind };

/** A climatology band is a calendar month ("06") or a day of the year by month and day ("06-15"). */
export type ClimatologyKey = string;

export interface GridDefinition {
  nx: number;
  ny: number;
  lon0: number;
  lat0: number;
  dLon: number;
  dLat: number;
}

export interface ClimatologyField {
  variable: AnomalyVariable;
  levelHpa: number;
  key: ClimatologyKey;
  grid: GridDefinition;
  values: Float32Array;
  sourceFile: string;
}

const pad = (n: number) => String(n).padStart(2, '0');
const MONTHS = [
  'January',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July',
  'August',
  'September',
  'October',
  'November',
  'December',
];

/** Day of the year (1-based) to "MM-DD", in a leap year's calendar for 366-day climatologies. */
export function dayOfYearKey(day: number, daysInYear: 365 | 366): ClimatologyKey {
  const year = daysInYear === 366 ? 2000 : 2001;
  const d = new Date(Date.UTC(year, 0, day));
  return `${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}`;
}

/**
 * The key of each band of a climatology file: from MONTH (1–12) or DAY_OF_YEAR (1–366) in the band's
 * metadata, or, without them, by the band count (12 months from January; 365 or 366 days from 1 January).
 */
export function climatologyKeys(
  bands: number,
  bandMeta: Record<string, unknown>[],
): { keys: ClimatologyKey[]; period: 'monthly' | 'daily' } {
  const month = bandMeta.map((m) => Number(m.MONTH));
  const doy = bandMeta.map((m) => Number(m.DAY_OF_YEAR));
  if (month.every((m) => Number.isInteger(m) && m >= 1 && m <= 12))
    return { keys: month.map(pad), period: 'monthly' };
  if (doy.every((d) => Number.isInteger(d) && d >= 1 && d <= 366)) {
    const leap = doy.includes(366) ? 366 : 365;
    return { keys: doy.map((d) => dayOfYearKey(d, leap)), period: 'daily' };
  }
  if (bands === 12) return { keys: MONTHS.map((_, m) => pad(m + 1)), period: 'monthly' };
  if (bands === 365 || bands === 366)
    return {
      keys: Array.from({ length: bands }, (_, d) => dayOfYearKey(d + 1, bands)),
      period: 'daily',
    };
  throw new FileProblem(
    'bands',
    `a climatology has 12 bands (months from January) or 365/366 (days from 1 January), or MONTH / DAY_OF_YEAR in each band's metadata; this file has ${bands} band(s) without them`,
  );
}

export const sameGrid = (a: GridDefinition, b: GridDefinition) =>
  a.nx === b.nx &&
  a.ny === b.ny &&
  Math.abs(a.lon0 - b.lon0) < 1e-6 &&
  Math.abs(a.lat0 - b.lat0) < 1e-6 &&
  Math.abs(a.dLon - b.dLon) < 1e-9 &&
  Math.abs(a.dLat - b.dLat) < 1e-9;

export const describeGrid = (g: GridDefinition) =>
  `${g.nx} × ${g.ny} cells from ${g.lon0.toFixed(4)}° E, ${g.lat0.toFixed(4)}° N by ${g.dLon}° × ${g.dLat}°`;

/**
 * Turns one day's totals into anomalies: total − climatology of the same variable, level and grid, for
 * the day of the year when a daily climatology is stored (29 February uses 28 February when the
 * climatology has no leap day), else for the month. Cells missing in either are NaN.
 */
export function subtractClimatology(
  day: { date: string; values: Float32Array },
  where: string,
  field: { variable: AnomalyVariable; levelHpa: number; grid: GridDefinition },
  climatology: ClimatologyField[],
): { values: Float32Array; sourceFile: string } {
  const mmdd = day.date.slice(5);
  const month = day.date.slice(5, 7);
  const same = climatology.filter((c) => c.variable === field.variable && c.levelHpa === field.levelHpa);
  if (same.length === 0)
    throw new FileProblem(
      where,
      `there is no climatology of ${field.variable} at ${field.levelHpa} hPa to subtract from these totals: upload the climatology first (field kind "climatology"), then the totals`,
    );
  const onGrid = same.filter((c) => sameGrid(c.grid, field.grid));
  if (onGrid.length === 0)
    throw new FileProblem(
      where,
      `the totals' grid (${describeGrid(field.grid)}) differs from the climatology's (${describeGrid(same[0].grid)}, ${same[0].sourceFile}): both must be on the same grid`,
    );
  const find = (key: string) => onGrid.find((c) => c.key === key);
  const match = find(mmdd) ?? (mmdd === '02-29' ? find('02-28') : undefined) ?? find(month);
  if (!match)
    throw new FileProblem(
      where,
      `the climatology of ${field.variable} at ${field.levelHpa} hPa has neither ${mmdd} nor ${MONTHS[Number(month) - 1]} for ${day.date}: upload a climatology covering it first, then the totals`,
    );
  const values = new Float32Array(day.values.length);
  for (let k = 0; k < values.length; k++) values[k] = day.values[k] - match.values[k];
  return { values, sourceFile: match.sourceFile };
}
