import {
  ANOMALY_CSV_FIELDS,
  ANOMALY_VARIABLES,
  type AnomalyCsvDateFormat,
  type AnomalyCsvField,
  type AnomalyCsvMapping,
  type AnomalyVariable,
} from '@stormhour/shared';
import Papa from 'papaparse';
import { type AnomalyFile, type AnomalyUnits, unitsOf } from './anomaly-reader.js';
import { FileProblem } from './geotiff-reader.js';

const COLUMNS = ['date', 'lat', 'lon', 'variable', 'level_hpa', 'value'] as const;
const DATE_PATTERNS: Record<AnomalyCsvDateFormat, { re: RegExp; example: string }> = {
  'YYYY-MM-DD': { re: /^(?<y>\d{4})-(?<mo>\d{2})-(?<d>\d{2})$/, example: '2025-06-01' },
  YYYYMMDD: { re: /^(?<y>\d{4})(?<mo>\d{2})(?<d>\d{2})$/, example: '20250601' },
  'DD/MM/YYYY': { re: /^(?<d>\d{1,2})\/(?<mo>\d{1,2})\/(?<y>\d{4})$/, example: '01/06/2025' },
  'MM/DD/YYYY': { re: /^(?<mo>\d{1,2})\/(?<d>\d{1,2})\/(?<y>\d{4})$/, example: '06/01/2025' },
};
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

export interface AnomalyCsvOptions {
  /** The uploader's units, for variables the file gives none for. */
  units?: AnomalyUnits;
  /** The file's columns and names; without it our own column names are expected. */
  mapping?: AnomalyCsvMapping;
  /** The variable of every row, for a file without a variable column. */
  variable?: AnomalyVariable;
}

/** The file's header for each of our fields, or why the header will not do. */
function resolveColumns(
  headers: readonly string[],
  options: AnomalyCsvOptions,
): Partial<Record<AnomalyCsvField, string>> {
  const byName = new Map(headers.map((h) => [h.trim().toLowerCase(), h]));
  const byTrimmed = new Map(headers.map((h) => [h.trim(), h]));
  const resolved: Partial<Record<AnomalyCsvField, string>> = {};
  const unknown: string[] = [];
  for (const field of ANOMALY_CSV_FIELDS) {
    const chosen = options.mapping ? options.mapping.columns[field] : field;
    if (chosen === undefined) continue;
    const header = options.mapping ? byTrimmed.get(chosen.trim()) : byName.get(field);
    if (header !== undefined) resolved[field] = header;
    else if (options.mapping) unknown.push(`"${chosen}" (mapped to ${field})`);
  }
  if (unknown.length)
    throw new FileProblem(
      'header',
      `the mapped column(s) ${unknown.join(', ')} are not in the file, whose columns are ${headers.join(', ')}`,
    );
  const needed: AnomalyCsvField[] = ['date', 'lat', 'lon', 'value'];
  if (!options.variable) needed.splice(3, 0, 'variable');
  if (options.mapping?.levelHpa === undefined) needed.splice(needed.indexOf('value'), 0, 'level_hpa');
  const missing = needed.filter((f) => resolved[f] === undefined);
  if (missing.length)
    throw new FileProblem(
      'header',
      options.mapping
        ? `no column is mapped to ${missing.join(', ')}${missing.includes('variable') ? '; map one, or choose the variable for the whole file' : ''}${missing.includes('level_hpa') ? '; map one, or give the level for the whole file' : ''}`
        : `missing column(s) ${missing.join(', ')}; expected ${COLUMNS.join(', ')}, or map the file's columns onto these`,
    );
  return resolved;
}

/** The date in a cell as YYYY-MM-DD, or null when it is not a real date in the given format. */
export function readDate(text: string, format: AnomalyCsvDateFormat): string | null {
  const pattern = DATE_PATTERNS[format];
  const m = pattern.re.exec(text);
  if (!m?.groups) return null;
  const { y, mo, d } = m.groups;
  const year = Number(y);
  const month = Number(mo);
  const day = Number(d);
  const t = new Date(Date.UTC(year, month - 1, day));
  if (t.getUTCFullYear() !== year || t.getUTCMonth() !== month - 1 || t.getUTCDate() !== day) return null;
  return `${y}-${mo.padStart(2, '0')}-${d.padStart(2, '0')}`;
}

/**
 * Reads long-form anomaly CSV (date, lat, lon, variable, level_hpa, value; one row per day, point and
 * field) into one daily grid per variable and level. The grid is the regular lattice the points form;
 * points missing on a day are NaN. Units are not in the file: the uploader's choice applies, otherwise
 * g/kg for q and m/s for u and v, and the summary says so. A mapping names the file's own columns,
 * variable names and date format.
 */
export function parseAnomalyCsv(text: string, options: AnomalyCsvOptions = {}): AnomalyFile[] {
  const { units, mapping } = options;
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: 'greedy' });
  const column = resolveColumns(parsed.meta.fields ?? [], options);
  const dateFormat = mapping?.dateFormat ?? 'YYYY-MM-DD';
  // The file's own names for q, u and v, compared without case.
  const variableOf = new Map<string, AnomalyVariable>(
    ANOMALY_VARIABLES.map((v) => [v, v] as [string, AnomalyVariable]),
  );
  for (const [v, name] of Object.entries(mapping?.variableNames ?? {}))
    variableOf.set((name as string).trim().toLowerCase(), v as AnomalyVariable);
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
    const cell = (f: AnomalyCsvField) => {
      const header = column[f];
      return header === undefined ? undefined : (raw[header] ?? '').trim();
    };
    const r = {
      date: cell('date') ?? '',
      lat: cell('lat') ?? '',
      lon: cell('lon') ?? '',
      variable: cell('variable'),
      level_hpa: cell('level_hpa'),
      value: cell('value') ?? '',
      units: cell('units'),
    };
    const where = (f: AnomalyCsvField) => `row ${i + 2}, column "${column[f] ?? f}"`;
    const bad = (f: AnomalyCsvField, p: string) =>
      problems.length < 50 && problems.push({ where: where(f), problem: p });
    const date = readDate(r.date, dateFormat);
    const lat = Number(r.lat);
    const lon = Number(r.lon);
    const level = r.level_hpa === undefined ? (mapping?.levelHpa as number) : Number(r.level_hpa);
    const value = r.value === '' ? Number.NaN : Number(r.value);
    const variable = r.variable === undefined ? options.variable : variableOf.get(r.variable.toLowerCase());
    let ok = true;
    if (!date)
      ok = !bad(
        'date',
        `"${r.date}" is not a date written ${dateFormat} (e.g. ${DATE_PATTERNS[dateFormat].example})`,
      );
    if (!(r.lat !== '' && lat >= -90 && lat <= 90))
      ok = !bad('lat', `"${r.lat}" is not a latitude between −90 and 90`);
    if (!(r.lon !== '' && lon >= -180 && lon <= 360)) ok = !bad('lon', `"${r.lon}" is not a longitude`);
    if (!variable)
      ok = !bad(
        'variable',
        `"${r.variable}" is not one of q, u, v${variableOf.size > 3 ? ` or the names mapped to them (${[...variableOf.keys()].slice(3).join(', ')})` : ''}`,
      );
    if (!(r.level_hpa !== '' && Number.isFinite(level)))
      ok = !bad('level_hpa', `"${r.level_hpa}" is not a number`);
    if (r.value !== '' && !Number.isFinite(value)) ok = !bad('value', `"${r.value}" is not a number`);
    let factorUnits: AnomalyUnits | undefined;
    if (ok && r.units !== undefined && r.units !== '') {
      const stated = unitsOf(r.units);
      if (!stated) ok = !bad('units', `"${r.units}" is not one of g/kg, kg/kg, m/s, kt`);
      else if ((variable === 'q') !== (stated === 'g/kg' || stated === 'kg/kg'))
        ok = !bad('units', `${stated} are not units of ${variable}`);
      else {
        const first = unitsByVariable.get(variable as string);
        if (!first) unitsByVariable.set(variable as string, { units: stated, row: i + 2 });
        else if (first.units !== stated)
          ok = !bad(
            'units',
            `mixed units for ${variable} in one upload: ${stated} here, ${first.units} on row ${first.row}; convert the file to one unit per variable`,
          );
        factorUnits = stated;
      }
    }
    if (ok)
      rows.push({
        date: date as string,
        lat,
        lon,
        variable: variable as AnomalyVariable,
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
