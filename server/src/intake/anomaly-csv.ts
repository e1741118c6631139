import type { AnomalyVariable } from '@stormhour/shared';
import Papa from 'papaparse';
import { type AnomalyFile, type AnomalyUnits, unitsOf } from './anomaly-reader.js';
import { FileProblem } from './geotiff-reader.js';

const COLUMNS = ['date', 'lat', 'lon', 'variable', 'level_hpa', 'value'] as const;
const DATE = /^\d{4}-\d{2}-\d{2}$/;
const FACTOR: Record<AnomalyUnits, number> = { 'g/kg': 1, 'kg/kg': 1000, 'm/s': 1, kt: 1852 / 3600 };

/** Sorted distinct values, and whether they are evenly spaced (a regular grid axis). */
function axis(values: Set<number>, name: string): number[] {
  const sorted = [...values].sort((a, b) => a - b);
  if (sorted.length < 2) return sorted;
  const step = sorted[1] - sorted[0];
  sorted.forEach((v, k) => {
    if (Math.abs(v - (sorted[0] + k * step)) > 1e-6 * Math.max(1, Math.abs(step)))
      throw new FileProblem(
        `column ${name}`,
        `the ${name} values are not evenly spaced (${sorted[k - 1]} then ${v}): a regular grid is needed`,
      );
  });
  return sorted;
}

/**
 * Reads long-form anomaly CSV (date, lat, lon, variable, level_hpa, value; one row per day, point and
 * field) into one daily grid per variable and level. The grid is the regular lattice the points form;
 * points missing on a day are NaN. Units are not in the file: the uploader's choice applies, otherwise
 * g/kg for q and m/s for u and v, and the summary says so.
 */
export function parseAnomalyCsv(text: string, units?: AnomalyUnits): AnomalyFile[] {
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: 'greedy' });
  const headers = (parsed.meta.fields ?? []).map((h) => h.trim().toLowerCase());
  const missing = COLUMNS.filter((c) => !headers.includes(c));
  if (missing.length)
    throw new FileProblem(
      'header',
      `missing column(s) ${missing.join(', ')}; expected ${COLUMNS.join(', ')}`,
    );
  const problems: { where: string; problem: string }[] = [];
  const rows: {
    date: string;
    lat: number;
    lon: number;
    variable: AnomalyVariable;
    level: number;
    value: number;
    row: number;
  }[] = [];
  // An optional "units" column: one unit per variable in a file, so values are never mixed up.
  const unitsByVariable = new Map<string, { units: AnomalyUnits; row: number }>();
  parsed.data.forEach((raw, i) => {
    const r = Object.fromEntries(
      Object.entries(raw).map(([k, v]) => [k.trim().toLowerCase(), (v ?? '').trim()]),
    );
    const where = (c: string) => `row ${i + 2}, column "${c}"`;
    const bad = (c: string, p: string) =>
      problems.length < 50 && problems.push({ where: where(c), problem: p });
    const lat = Number(r.lat);
    const lon = Number(r.lon);
    const level = Number(r.level_hpa);
    const value = r.value === '' ? Number.NaN : Number(r.value);
    let ok = true;
    if (!DATE.test(r.date)) ok = !bad('date', `"${r.date}" is not a date such as 2025-06-01`);
    if (!(lat >= -90 && lat <= 90)) ok = !bad('lat', `"${r.lat}" is not a latitude between −90 and 90`);
    if (!(lon >= -180 && lon <= 360)) ok = !bad('lon', `"${r.lon}" is not a longitude`);
    if (!['q', 'u', 'v'].includes(r.variable)) ok = !bad('variable', `"${r.variable}" is not one of q, u, v`);
    if (!Number.isFinite(level)) ok = !bad('level_hpa', `"${r.level_hpa}" is not a number`);
    if (r.value !== '' && !Number.isFinite(value)) ok = !bad('value', `"${r.value}" is not a number`);
    let factorUnits: AnomalyUnits | undefined;
    if (ok && r.units !== undefined && r.units !== '') {
      const stated = unitsOf(r.units);
      if (!stated) ok = !bad('units', `"${r.units}" is not one of g/kg, kg/kg, m/s, kt`);
      else if ((r.variable === 'q') !== (stated === 'g/kg' || stated === 'kg/kg'))
        ok = !bad('units', `${stated} are not units of ${r.variable}`);
      else {
        const first = unitsByVariable.get(r.variable);
        if (!first) unitsByVariable.set(r.variable, { units: stated, row: i + 2 });
        else if (first.units !== stated)
          ok = !bad(
            'units',
            `mixed units for ${r.variable} in one upload: ${stated} here, ${first.units} on row ${first.row}; convert the file to one unit per variable`,
          );
        factorUnits = stated;
      }
    }
    if (ok)
      rows.push({
        date: r.date,
        lat,
        lon,
        variable: r.variable as AnomalyVariable,
        level,
        value: factorUnits ? value * FACTOR[factorUnits] : value,
        row: i + 2,
      });
  });
  if (problems.length) throw new FileProblem(problems[0].where, problems[0].problem, problems);
  if (rows.length === 0) throw new FileProblem(null, 'the file has a header but no rows');

  const lats = axis(new Set(rows.map((r) => r.lat)), 'lat').reverse();
  const lons = axis(new Set(rows.map((r) => r.lon)), 'lon');
  const col = new Map(lons.map((v, k) => [v, k]));
  const row = new Map(lats.map((v, k) => [v, k]));
  const nx = lons.length;
  const ny = lats.length;
  // One unit choice cannot fit humidity and wind at once: it applies to the variables it fits.
  const fits = (v: AnomalyVariable, u: AnomalyUnits) => (v === 'q') === (u === 'g/kg' || u === 'kg/kg');
  const groups = new Map<
    string,
    {
      file: AnomalyFile;
      factor: number;
      days: Map<string, Float32Array>;
      rowOf: Map<string, Map<number, number>>;
    }
  >();
  for (const r of rows) {
    const key = `${r.variable}@${r.level}`;
    let group = groups.get(key);
    if (!group) {
      const canonical: AnomalyUnits = r.variable === 'q' ? 'g/kg' : 'm/s';
      const inFile = unitsByVariable.get(r.variable)?.units;
      const unit = inFile ?? (units && fits(r.variable, units) ? units : canonical);
      const conversion =
        !inFile && (!units || !fits(r.variable, units))
          ? `no units given: read as ${canonical}`
          : FACTOR[unit] === 1
            ? `already in ${canonical}`
            : `${unit} × ${FACTOR[unit].toPrecision(6)} → ${canonical}`;
      group = {
        // Values with a units column were converted row by row above.
        factor: inFile ? 1 : FACTOR[unit],
        days: new Map(),
        rowOf: new Map(),
        file: {
          variable: r.variable,
          levelHpa: r.level,
          conversion,
          reprojection: null,
          climatology: null,
          grid: {
            nx,
            ny,
            lon0: lons[0],
            lat0: lats[0],
            dLon: nx > 1 ? lons[1] - lons[0] : 0.25,
            dLat: ny > 1 ? lats[0] - lats[1] : 0.25,
          },
          days: [],
        },
      };
      groups.set(key, group);
    }
    let values = group.days.get(r.date);
    if (!values) {
      values = new Float32Array(nx * ny).fill(Number.NaN);
      group.days.set(r.date, values);
      group.file.days.push({ date: r.date, where: `date ${r.date}`, values });
      group.rowOf.set(r.date, new Map());
    }
    const cell = (row.get(r.lat) as number) * nx + (col.get(r.lon) as number);
    const seen = group.rowOf.get(r.date) as Map<number, number>;
    const earlier = seen.get(cell);
    if (earlier !== undefined && problems.length < 50)
      problems.push({
        where: `row ${r.row}`,
        problem: `repeats ${r.date}, ${r.lat}° N, ${r.lon}° E, ${r.variable} at ${r.level} hPa of row ${earlier}`,
      });
    seen.set(cell, r.row);
    values[cell] = r.value * group.factor;
  }
  if (problems.length) throw new FileProblem(problems[0].where, problems[0].problem, problems);
  const files = [...groups.values()].map((g) => g.file);
  for (const f of files) f.days.sort((a, b) => a.date.localeCompare(b.date));
  return files;
}
