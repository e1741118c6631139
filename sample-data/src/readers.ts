/**
 * Readers for the files this package writes, independent of the general-purpose libraries (the
 * tests read every file with these and with geotiff / papaparse, and compare).
 */

export function parseCsv(text: string): { header: string[]; rows: string[][] } {
  const lines = text.split(/\r?\n/).filter((l) => l.length > 0);
  const header = lines[0].split(',');
  const rows = lines.slice(1).map((l) => {
    const cells = l.split(',');
    if (cells.length !== header.length)
      throw new Error(`row "${l}" has ${cells.length} fields, header has ${header.length}`);
    return cells;
  });
  return { header, rows };
}

export function csvRecords(text: string): Record<string, string>[] {
  const { header, rows } = parseCsv(text);
  return rows.map((r) => Object.fromEntries(header.map((h, i) => [h, r[i]])));
}

export const CELL_COLUMNS = [
  'scan_time_utc',
  'track_id',
  'lat',
  'lon',
  'area_km2',
  'volume_km3',
  'max_dbz',
  'top35_km',
  'echo_top_km',
  'core40_km3',
  'vil_max_kg_m2',
  'parent_track_id',
  'merged_into_track_id',
  'max_dbz_height_km',
] as const;

export interface CellRecord {
  scanTimeUtc: string;
  scanMs: number;
  trackId: number;
  lat: number;
  lon: number;
  areaKm2: number;
  volumeKm3: number;
  maxDbz: number;
  top35Km: number;
  echoTopKm: number;
  core40Km3: number;
  vilMaxKgM2: number;
  parentTrackId: number | null;
  mergedIntoTrackId: number | null;
  maxDbzHeightKm: number;
}

const num = (s: string, what: string): number => {
  const v = Number(s);
  if (s === '' || !Number.isFinite(v)) throw new Error(`${what}: "${s}" is not a number`);
  return v;
};
const optInt = (s: string): number | null => (s === '' ? null : Number(s));

export function readCellTable(text: string): CellRecord[] {
  return csvRecords(text).map((r) => ({
    scanTimeUtc: r.scan_time_utc,
    scanMs: Date.parse(r.scan_time_utc),
    trackId: num(r.track_id, 'track_id'),
    lat: num(r.lat, 'lat'),
    lon: num(r.lon, 'lon'),
    areaKm2: num(r.area_km2, 'area_km2'),
    volumeKm3: num(r.volume_km3, 'volume_km3'),
    maxDbz: num(r.max_dbz, 'max_dbz'),
    top35Km: num(r.top35_km, 'top35_km'),
    echoTopKm: num(r.echo_top_km, 'echo_top_km'),
    core40Km3: num(r.core40_km3, 'core40_km3'),
    vilMaxKgM2: num(r.vil_max_kg_m2, 'vil_max_kg_m2'),
    parentTrackId: optInt(r.parent_track_id),
    mergedIntoTrackId: optInt(r.merged_into_track_id),
    maxDbzHeightKm: num(r.max_dbz_height_km, 'max_dbz_height_km'),
  }));
}

export interface ScanRecord {
  scanTimeUtc: string;
  scanMs: number;
  cellCount: number;
}

export function readScanInventory(text: string): ScanRecord[] {
  return csvRecords(text).map((r) => ({
    scanTimeUtc: r.scan_time_utc,
    scanMs: Date.parse(r.scan_time_utc),
    cellCount: num(r.cell_count, 'cell_count'),
  }));
}

export interface AnomalyRecord {
  date: string;
  lat: number;
  lon: number;
  variable: string;
  levelHpa: number;
  value: number;
}

export function readAnomalyCsv(text: string): AnomalyRecord[] {
  return csvRecords(text).map((r) => ({
    date: r.date,
    lat: num(r.lat, 'lat'),
    lon: num(r.lon, 'lon'),
    variable: r.variable,
    levelHpa: num(r.level_hpa, 'level_hpa'),
    value: num(r.value, 'value'),
  }));
}

// ---------------------------------------------------------------------------------------------
// A baseline TIFF reader for uncompressed strip images (either byte order), with GeoKeys and the
// GDAL metadata/nodata tags.

export interface TiffRaster {
  width: number;
  height: number;
  bands: number;
  bitsPerSample: number;
  sampleFormat: number;
  /** pixel-interleaved samples */
  data: Uint8Array | Uint16Array | Int16Array | Float32Array;
  pixelScale: number[];
  tiepoint: number[];
  geoKeys: Record<number, number | string | number[]>;
  gdalMetadata: string | null;
  gdalNodata: string | null;
}

export function readTiff(bytes: Uint8Array): TiffRaster {
  const dv = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const le = bytes[0] === 0x49;
  if (!(le ? bytes[1] === 0x49 : bytes[0] === 0x4d && bytes[1] === 0x4d)) throw new Error('not a TIFF');
  if (dv.getUint16(2, le) !== 42) throw new Error('not a classic TIFF');
  const ifd = dv.getUint32(4, le);
  const n = dv.getUint16(ifd, le);
  const tags = new Map<number, number[] | string>();
  const size: Record<number, number> = { 1: 1, 2: 1, 3: 2, 4: 4, 5: 8, 11: 4, 12: 8 };
  for (let e = 0; e < n; e++) {
    const p = ifd + 2 + e * 12;
    const tag = dv.getUint16(p, le);
    const type = dv.getUint16(p + 2, le);
    const count = dv.getUint32(p + 4, le);
    const bytesLen = count * (size[type] ?? 1);
    const at = bytesLen <= 4 ? p + 8 : dv.getUint32(p + 8, le);
    if (type === 2) {
      let s = '';
      for (let i = 0; i < count; i++) s += String.fromCharCode(bytes[at + i]);
      tags.set(tag, s.replace(/\0+$/, ''));
      continue;
    }
    const vals: number[] = [];
    for (let i = 0; i < count; i++) {
      if (type === 3) vals.push(dv.getUint16(at + 2 * i, le));
      else if (type === 4) vals.push(dv.getUint32(at + 4 * i, le));
      else if (type === 12) vals.push(dv.getFloat64(at + 8 * i, le));
      else if (type === 1) vals.push(bytes[at + i]);
      else if (type === 11) vals.push(dv.getFloat32(at + 4 * i, le));
      else throw new Error(`tag ${tag}: field type ${type} not supported`);
    }
    tags.set(tag, vals);
  }
  const nums = (t: number): number[] => {
    const v = tags.get(t);
    if (!Array.isArray(v)) throw new Error(`tag ${t} missing`);
    return v;
  };
  if (nums(259)[0] !== 1) throw new Error('compressed TIFF not supported');
  const width = nums(256)[0];
  const height = nums(257)[0];
  const bands = nums(277)[0];
  const bits = nums(258)[0];
  const format = tags.has(339) ? nums(339)[0] : 1;
  const offsets = nums(273);
  const counts = nums(279);
  const total = width * height * bands;
  const raw = new Uint8Array(total * (bits / 8));
  let o = 0;
  offsets.forEach((off, i) => {
    raw.set(bytes.subarray(off, off + counts[i]), o);
    o += counts[i];
  });
  const rdv = new DataView(raw.buffer);
  let data: TiffRaster['data'];
  if (bits === 8) data = raw;
  else if (bits === 16 && format === 2)
    data = Int16Array.from({ length: total }, (_, i) => rdv.getInt16(2 * i, le));
  else if (bits === 16) data = Uint16Array.from({ length: total }, (_, i) => rdv.getUint16(2 * i, le));
  else if (bits === 32 && format === 3)
    data = Float32Array.from({ length: total }, (_, i) => rdv.getFloat32(4 * i, le));
  else throw new Error(`${bits}-bit samples of format ${format} not supported`);

  const geoKeys: TiffRaster['geoKeys'] = {};
  const dir = tags.get(34735);
  if (Array.isArray(dir)) {
    const doubles = (tags.get(34736) as number[] | undefined) ?? [];
    const ascii = (tags.get(34737) as string | undefined) ?? '';
    for (let i = 4; i < 4 + dir[3] * 4; i += 4) {
      const [id, loc, count, value] = dir.slice(i, i + 4);
      if (loc === 0) geoKeys[id] = value;
      else if (loc === 34736) geoKeys[id] = doubles.slice(value, value + count);
      else if (loc === 34737) geoKeys[id] = ascii.slice(value, value + count - 1);
    }
  }
  return {
    width,
    height,
    bands,
    bitsPerSample: bits,
    sampleFormat: format,
    data,
    pixelScale: (tags.get(33550) as number[]) ?? [],
    tiepoint: (tags.get(33922) as number[]) ?? [],
    geoKeys,
    gdalMetadata: (tags.get(42112) as string | undefined) ?? null,
    gdalNodata: (tags.get(42113) as string | undefined) ?? null,
  };
}

/** GDAL metadata items: dataset-level (sample null) or of one band. */
export function gdalItems(xml: string, sample: number | null): Record<string, string> {
  const out: Record<string, string> = {};
  const re = /<Item\s+([^>]*)>([\s\S]*?)<\/Item>/g;
  for (let m = re.exec(xml); m; m = re.exec(xml)) {
    const attrs = Object.fromEntries([...m[1].matchAll(/(\w+)="([^"]*)"/g)].map((a) => [a[1], a[2]]));
    const s = attrs.sample === undefined ? null : Number(attrs.sample);
    if (s !== sample) continue;
    out[attrs.name] = m[2]
      .replace(/&lt;/g, '<')
      .replace(/&gt;/g, '>')
      .replace(/&quot;/g, '"')
      .replace(/&amp;/g, '&');
  }
  return out;
}

/** One band of a pixel-interleaved raster as a row-major plane. */
export function bandOf(r: TiffRaster, band: number): Float64Array {
  const out = new Float64Array(r.width * r.height);
  for (let q = 0; q < out.length; q++) out[q] = r.data[q * r.bands + band];
  return out;
}

export interface TruthRecord extends Omit<CellRecord, 'trackId'> {
  /** null for cells with a 35 dBZ region that fail the 3-D identification rules (not in the cell table) */
  trackId: number | null;
  inCellTable: boolean;
  modelCellId: number;
  xKm: number;
  yKm: number;
  semiMajorKm: number;
  semiMinorKm: number;
  orientationDeg: number;
  peakDbz: number;
  hmaxKm: number;
  top35ExactKm: number;
  echoTopExactKm: number;
  truncatedByRange: boolean;
}

/** The truth file of a radar run (run-YYYYMMDD/truth-cells.csv). */
export function readTruthCells(text: string): TruthRecord[] {
  return csvRecords(text).map((r) => ({
    scanTimeUtc: r.scan_time_utc,
    scanMs: Date.parse(r.scan_time_utc),
    trackId: optInt(r.track_id),
    inCellTable: r.in_cell_table === '1',
    modelCellId: num(r.model_cell_id, 'model_cell_id'),
    lat: num(r.lat, 'lat'),
    lon: num(r.lon, 'lon'),
    xKm: num(r.x_km, 'x_km'),
    yKm: num(r.y_km, 'y_km'),
    areaKm2: num(r.area_km2, 'area_km2'),
    volumeKm3: num(r.volume_km3, 'volume_km3'),
    maxDbz: num(r.max_dbz, 'max_dbz'),
    top35Km: num(r.top35_km, 'top35_km'),
    echoTopKm: num(r.echo_top_km, 'echo_top_km'),
    core40Km3: num(r.core40_km3, 'core40_km3'),
    vilMaxKgM2: num(r.vil_max_kg_m2, 'vil_max_kg_m2'),
    parentTrackId: optInt(r.parent_track_id),
    mergedIntoTrackId: optInt(r.merged_into_track_id),
    maxDbzHeightKm: num(r.max_dbz_height_km, 'max_dbz_height_km'),
    semiMajorKm: num(r.semi_major_km, 'semi_major_km'),
    semiMinorKm: num(r.semi_minor_km, 'semi_minor_km'),
    orientationDeg: num(r.orientation_deg, 'orientation_deg'),
    peakDbz: num(r.peak_dbz, 'peak_dbz'),
    hmaxKm: num(r.hmax_km, 'hmax_km'),
    top35ExactKm: num(r.top35_exact_km, 'top35_exact_km'),
    echoTopExactKm: num(r.echo_top_exact_km, 'echo_top_exact_km'),
    truncatedByRange: r.truncated_by_range === '1',
  }));
}
