import {
  CELL_TABLE_FIELDS,
  CELL_TABLE_SYNONYMS,
  type CellTableField,
  type CellTableMapping,
  normaliseHeader,
} from '@stormhour/shared';
import Papa from 'papaparse';
import { parseTime } from './times.js';

/** One row of a cell table, in our units. */
export interface CellTableRow {
  /** Line in the file (the header is line 1). */
  line: number;
  time: number;
  trackId: string | null;
  parentTrackId: string | null;
  lon: number;
  lat: number;
  areaKm2: number;
  volumeKm3: number | null;
  maxDbz: number | null;
  top35Km: number | null;
  echoTopKm: number | null;
  core40Km3: number | null;
  vilMaxKgM2: number | null;
}

export interface TableProblem {
  where: string | null;
  problem: string;
}

/** Matches a file's headers to our fields: our own names first, then common spellings. */
export function guessMapping(headers: string[]): CellTableMapping['columns'] {
  const byNormal = new Map(headers.map((h) => [normaliseHeader(h), h]));
  const columns: CellTableMapping['columns'] = {};
  for (const field of CELL_TABLE_FIELDS) {
    const hit = [field, ...CELL_TABLE_SYNONYMS[field]].find((n) => byNormal.has(n));
    if (hit) columns[field] = byNormal.get(hit);
  }
  return columns;
}

export interface ParseOptions {
  /** For x/y positions: file coordinates (m) to lon/lat. */
  xyToLonLat?: (x: number, y: number) => [number, number];
  /** Times after this are refused (a clock or column error). */
  latestTime: number;
  /** At most this many problems are listed; the rest are counted. */
  maxProblems?: number;
}

const RANGES: Partial<Record<keyof CellTableRow, [number, number, string]>> = {
  lat: [-90, 90, 'a latitude between −90 and 90'],
  lon: [-180, 180, 'a longitude between −180 and 180'],
  areaKm2: [0, 1e5, 'an area above 0 and below 100 000 km²'],
  volumeKm3: [0, 1e6, 'a volume of 0 or more'],
  maxDbz: [-30, 90, 'a reflectivity between −30 and 90 dBZ'],
  top35Km: [0, 25, 'a height between 0 and 25 km'],
  echoTopKm: [0, 25, 'a height between 0 and 25 km'],
  core40Km3: [0, 1e6, 'a volume of 0 or more'],
  vilMaxKgM2: [0, 500, 'a VIL between 0 and 500 kg/m²'],
};

/**
 * Parses and checks a whole cell table. Every row is checked; a file with any bad row yields its
 * problems (row and column named) and no rows, so a caller never stores part of a file.
 */
export function parseCellTable(
  text: string,
  mapping: CellTableMapping,
  opts: ParseOptions,
): { rows: CellTableRow[]; problems: TableProblem[] } {
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: 'greedy' });
  const headers = parsed.meta.fields ?? [];
  const problems: TableProblem[] = [];
  const max = opts.maxProblems ?? 50;
  let unlisted = 0;
  const problem = (where: string | null, text: string) => {
    if (problems.length < max) problems.push({ where, problem: text });
    else unlisted++;
  };

  const cols = mapping.columns;
  const needed: CellTableField[] = [
    'scan_time',
    'area',
    ...(mapping.position === 'xy' ? (['x', 'y'] as const) : (['lat', 'lon'] as const)),
  ];
  for (const field of needed) {
    if (!cols[field]) problem(`column for ${field}`, `no column is mapped to ${field}, which is required`);
  }
  for (const [field, header] of Object.entries(cols)) {
    if (header && !headers.includes(header))
      problem(
        `column "${header}"`,
        `mapped to ${field} but not in the file; its columns are ${headers.join(', ')}`,
      );
  }
  if (mapping.position === 'xy' && !opts.xyToLonLat)
    problem('mapping.crs', 'x/y positions need the coordinates’ CRS');
  if (problems.length) return { rows: [], problems };
  if (parsed.data.length === 0)
    return { rows: [], problems: [{ where: null, problem: 'the file has a header but no rows' }] };

  const rows: CellTableRow[] = [];
  const areaFactor = mapping.areaUnit === 'm2' ? 1e-6 : 1;
  parsed.data.forEach((record, i) => {
    const line = i + 2;
    const where = (field: CellTableField) => `row ${line}, column "${cols[field]}"`;
    const raw = (field: CellTableField) => {
      const header = cols[field];
      const v = header ? record[header] : undefined;
      return v === undefined || v.trim() === '' ? null : v.trim();
    };
    let ok = true;
    const num = (field: CellTableField, required: boolean): number | null => {
      const v = raw(field);
      if (v === null) {
        if (required) {
          problem(where(field), 'is empty');
          ok = false;
        }
        return null;
      }
      const n = Number(v);
      if (!Number.isFinite(n)) {
        problem(where(field), `"${v}" is not a number`);
        ok = false;
        return null;
      }
      return n;
    };
    const timeText = raw('scan_time');
    const time = timeText === null ? null : parseTime(timeText, mapping.timeZone);
    if (timeText === null) {
      problem(where('scan_time'), 'is empty');
      ok = false;
    } else if (time === null) {
      problem(where('scan_time'), `"${timeText}" is not a time (use e.g. 2031-07-14T09:30:00Z)`);
      ok = false;
    } else if (time > opts.latestTime) {
      problem(where('scan_time'), `${timeText} is in the future`);
      ok = false;
    }
    let lon: number | null;
    let lat: number | null;
    if (mapping.position === 'xy') {
      const x = num('x', true);
      const y = num('y', true);
      [lon, lat] = x !== null && y !== null && opts.xyToLonLat ? opts.xyToLonLat(x, y) : [null, null];
    } else {
      lat = num('lat', true);
      lon = num('lon', true);
    }
    const area = num('area', true);
    const row: CellTableRow = {
      line,
      time: time ?? 0,
      trackId: raw('track_id'),
      parentTrackId: raw('parent_track_id'),
      lon: lon ?? 0,
      lat: lat ?? 0,
      areaKm2: area === null ? 0 : area * areaFactor,
      volumeKm3: num('volume_km3', false),
      maxDbz: num('max_dbz', false),
      top35Km: num('top35_km', false),
      echoTopKm: num('echo_top_km', false),
      core40Km3: num('core40_km3', false),
      vilMaxKgM2: num('vil_max_kg_m2', false),
    };
    if (!ok) return;
    const fieldOf: Partial<Record<keyof CellTableRow, CellTableField>> = {
      lat: mapping.position === 'xy' ? 'y' : 'lat',
      lon: mapping.position === 'xy' ? 'x' : 'lon',
      areaKm2: 'area',
      volumeKm3: 'volume_km3',
      maxDbz: 'max_dbz',
      top35Km: 'top35_km',
      echoTopKm: 'echo_top_km',
      core40Km3: 'core40_km3',
      vilMaxKgM2: 'vil_max_kg_m2',
    };
    for (const [key, [lo, hi, expect]] of Object.entries(RANGES) as [
      keyof CellTableRow,
      [number, number, string],
    ][]) {
      const v = row[key] as number | null;
      if (v === null) continue;
      const bad = key === 'areaKm2' ? !(v > lo && v <= hi) : !(v >= lo && v <= hi);
      if (bad) {
        problem(where(fieldOf[key] as CellTableField), `${v} is impossible: expected ${expect}`);
        ok = false;
      }
    }
    if (ok) rows.push(row);
  });
  if (unlisted) problems.push({ where: null, problem: `… and ${unlisted} more problems not listed` });
  return problems.length ? { rows: [], problems } : { rows, problems };
}

/** A scan inventory: one scan time per row, in the first column or one named like a time. */
export function parseScanInventory(
  text: string,
  latestTime: number,
): { times: number[]; problems: TableProblem[] } {
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: 'greedy' });
  const headers = parsed.meta.fields ?? [];
  const column =
    headers.find((h) => ['scan_time', ...CELL_TABLE_SYNONYMS.scan_time].includes(normaliseHeader(h))) ??
    (headers.length === 1 ? headers[0] : undefined);
  if (!column)
    return {
      times: [],
      problems: [
        {
          where: 'header',
          problem: `no scan time column: name it scan_time_utc (columns are ${headers.join(', ')})`,
        },
      ],
    };
  const times: number[] = [];
  const problems: TableProblem[] = [];
  parsed.data.forEach((record, i) => {
    const text = (record[column] ?? '').trim();
    const t = parseTime(text, 'UTC');
    if (t === null) {
      if (problems.length < 50) problems.push({ where: `row ${i + 2}`, problem: `"${text}" is not a time` });
    } else if (t > latestTime) {
      if (problems.length < 50) problems.push({ where: `row ${i + 2}`, problem: `${text} is in the future` });
    } else times.push(t);
  });
  if (!problems.length && times.length === 0)
    problems.push({ where: null, problem: 'the file lists no scans' });
  return problems.length ? { times: [], problems } : { times, problems };
}
