/**
 * A small GeoTIFF encoder: classic little-endian TIFF, one uncompressed strip, pixel-interleaved
 * samples (PlanarConfiguration 1), PhotometricInterpretation 1 (BlackIsZero) with ExtraSamples of
 * length bands − 1, explicit GeoKeys, and the GDAL tags 42112 (GDAL_METADATA XML) and 42113
 * (GDAL_NODATA). This is the layout STACK.md describes for the geotiff package's writer; we write
 * it ourselves because that writer keeps the whole IFD in 1000 bytes (too small for per-band
 * metadata) and writes Int16 samples as zeros. The files are read back with geotiff in the tests.
 */

export type SampleArray = Uint8Array | Uint16Array | Int16Array | Float32Array;

export type GeoKeyValue = number | string | number[];

export interface GeoTiffSpec {
  width: number;
  height: number;
  bands: number;
  /** pixel-interleaved samples: ((row × width) + col) × bands + band */
  data: SampleArray;
  /** model units per pixel in x and y (y positive: rows go south/down) */
  pixelScale: [number, number];
  /** model coordinates of the outer corner of the upper-left pixel */
  origin: [number, number];
  geoKeys: Record<number, GeoKeyValue>;
  gdalMetadataXml?: string;
  gdalNodata?: string;
}

const TYPE = { ASCII: 2, SHORT: 3, LONG: 4, DOUBLE: 12 } as const;
const TYPE_SIZE: Record<number, number> = { 2: 1, 3: 2, 4: 4, 12: 8 };

interface Entry {
  tag: number;
  type: number;
  values: number[] | string;
}

/** GeoKey ids that hold DOUBLE values (everything else numeric is SHORT). */
const DOUBLE_KEYS = new Set([
  2057, 2058, 2059, 2061, 3077, 3078, 3079, 3080, 3081, 3082, 3083, 3084, 3085, 3086, 3087, 3088, 3089, 3090,
  3091, 3092, 3093, 3094, 3095, 4097,
]);

function sampleInfo(data: SampleArray): { bits: number; format: number } {
  if (data instanceof Uint8Array) return { bits: 8, format: 1 };
  if (data instanceof Uint16Array) return { bits: 16, format: 1 };
  if (data instanceof Int16Array) return { bits: 16, format: 2 };
  return { bits: 32, format: 3 };
}

export function encodeGeoTiff(spec: GeoTiffSpec): Buffer {
  const { width, height, bands, data } = spec;
  if (data.length !== width * height * bands)
    throw new Error('data length does not match width × height × bands');
  const { bits, format } = sampleInfo(data);
  const bytesPerSample = bits / 8;
  const stripBytes = width * height * bands * bytesPerSample;

  // GeoKey directory, with ASCII keys in GeoAsciiParams ('|'-terminated) and DOUBLE keys in GeoDoubleParams.
  const keyIds = Object.keys(spec.geoKeys)
    .map(Number)
    .sort((a, b) => a - b);
  const directory: number[] = [1, 1, 0, keyIds.length];
  let ascii = '';
  const doubles: number[] = [];
  for (const id of keyIds) {
    const v = spec.geoKeys[id];
    if (typeof v === 'string') {
      const s = `${v}|`;
      directory.push(id, 34737, s.length, ascii.length);
      ascii += s;
    } else if (Array.isArray(v) || DOUBLE_KEYS.has(id)) {
      const arr = Array.isArray(v) ? v : [v];
      directory.push(id, 34736, arr.length, doubles.length);
      doubles.push(...arr);
    } else {
      directory.push(id, 0, 1, v);
    }
  }

  const entries: Entry[] = [
    { tag: 256, type: TYPE.LONG, values: [width] },
    { tag: 257, type: TYPE.LONG, values: [height] },
    { tag: 258, type: TYPE.SHORT, values: new Array(bands).fill(bits) },
    { tag: 259, type: TYPE.SHORT, values: [1] },
    { tag: 262, type: TYPE.SHORT, values: [1] },
    { tag: 273, type: TYPE.LONG, values: [0] }, // patched below
    { tag: 277, type: TYPE.SHORT, values: [bands] },
    { tag: 278, type: TYPE.LONG, values: [height] },
    { tag: 279, type: TYPE.LONG, values: [stripBytes] },
    { tag: 284, type: TYPE.SHORT, values: [1] },
    { tag: 305, type: TYPE.ASCII, values: 'stormhour sample-data\0' },
  ];
  if (bands > 1) entries.push({ tag: 338, type: TYPE.SHORT, values: new Array(bands - 1).fill(0) });
  entries.push({ tag: 339, type: TYPE.SHORT, values: new Array(bands).fill(format) });
  entries.push({ tag: 33550, type: TYPE.DOUBLE, values: [spec.pixelScale[0], spec.pixelScale[1], 0] });
  entries.push({ tag: 33922, type: TYPE.DOUBLE, values: [0, 0, 0, spec.origin[0], spec.origin[1], 0] });
  entries.push({ tag: 34735, type: TYPE.SHORT, values: directory });
  if (doubles.length) entries.push({ tag: 34736, type: TYPE.DOUBLE, values: doubles });
  if (ascii.length) entries.push({ tag: 34737, type: TYPE.ASCII, values: `${ascii}\0` });
  if (spec.gdalMetadataXml)
    entries.push({ tag: 42112, type: TYPE.ASCII, values: `${spec.gdalMetadataXml}\0` });
  if (spec.gdalNodata !== undefined)
    entries.push({ tag: 42113, type: TYPE.ASCII, values: `${spec.gdalNodata}\0` });
  entries.sort((a, b) => a.tag - b.tag);

  const count = (e: Entry) =>
    typeof e.values === 'string' ? Buffer.byteLength(e.values, 'latin1') : e.values.length;
  const ifdOffset = 8;
  const ifdSize = 2 + entries.length * 12 + 4;
  let extra = ifdOffset + ifdSize;
  const extraOffsets = entries.map((e) => {
    const size = count(e) * TYPE_SIZE[e.type];
    if (size <= 4) return -1;
    const at = extra;
    extra += size + (size & 1);
    return at;
  });
  // Align the strip to 8 bytes.
  const stripOffset = Math.ceil(extra / 8) * 8;
  const strip = entries.find((e) => e.tag === 273);
  if (strip) strip.values = [stripOffset];

  const buf = Buffer.alloc(stripOffset + stripBytes);
  buf.write('II', 0, 'latin1');
  buf.writeUInt16LE(42, 2);
  buf.writeUInt32LE(ifdOffset, 4);
  buf.writeUInt16LE(entries.length, ifdOffset);
  const writeValues = (e: Entry, at: number) => {
    if (typeof e.values === 'string') {
      buf.write(e.values, at, 'latin1');
      return;
    }
    e.values.forEach((v, i) => {
      if (e.type === TYPE.SHORT) buf.writeUInt16LE(v, at + 2 * i);
      else if (e.type === TYPE.LONG) buf.writeUInt32LE(v, at + 4 * i);
      else buf.writeDoubleLE(v, at + 8 * i);
    });
  };
  entries.forEach((e, i) => {
    const p = ifdOffset + 2 + i * 12;
    buf.writeUInt16LE(e.tag, p);
    buf.writeUInt16LE(e.type, p + 2);
    buf.writeUInt32LE(count(e), p + 4);
    if (extraOffsets[i] < 0) writeValues(e, p + 8);
    else {
      buf.writeUInt32LE(extraOffsets[i], p + 8);
      writeValues(e, extraOffsets[i]);
    }
  });
  buf.writeUInt32LE(0, ifdOffset + 2 + entries.length * 12);

  const bytes = new Uint8Array(data.buffer, data.byteOffset, data.byteLength);
  if (bytesPerSample === 1) buf.set(bytes, stripOffset);
  else {
    // Typed arrays are in the machine's byte order; write little-endian explicitly.
    const view = new DataView(buf.buffer, buf.byteOffset + stripOffset, stripBytes);
    for (let i = 0; i < data.length; i++) {
      if (format === 3) view.setFloat32(i * 4, data[i], true);
      else if (format === 2) view.setInt16(i * 2, data[i], true);
      else view.setUint16(i * 2, data[i], true);
    }
  }
  return buf;
}

export const GEOKEY = {
  GTModelType: 1024,
  GTRasterType: 1025,
  GTCitation: 1026,
  GeographicType: 2048,
  GeogCitation: 2049,
  GeogAngularUnits: 2054,
  ProjectedCSType: 3072,
  PCSCitation: 3073,
  Projection: 3074,
  ProjCoordTrans: 3075,
  ProjLinearUnits: 3076,
  ProjFalseEasting: 3082,
  ProjFalseNorthing: 3083,
  ProjCenterLong: 3088,
  ProjCenterLat: 3089,
} as const;

/** GeoKeys of a WGS 84 geographic (EPSG:4326) raster, pixel-is-area. */
export function geographicKeys(): Record<number, GeoKeyValue> {
  return {
    [GEOKEY.GTModelType]: 2,
    [GEOKEY.GTRasterType]: 1,
    [GEOKEY.GeographicType]: 4326,
    [GEOKEY.GeogCitation]: 'WGS 84',
    [GEOKEY.GeogAngularUnits]: 9102,
  };
}

/**
 * GeoKeys of a user-defined azimuthal equidistant projection on WGS 84 (metres), centred on the radar:
 * ProjectedCSTypeGeoKey = ProjectionGeoKey = 32767 (user-defined), ProjCoordTransGeoKey = 12
 * (CT_AzimuthalEquidistant), ProjCenterLong/LatGeoKey = the site, false easting/northing 0.
 */
export function aeqdKeys(lat0: number, lon0: number, citation: string): Record<number, GeoKeyValue> {
  return {
    [GEOKEY.GTModelType]: 1,
    [GEOKEY.GTRasterType]: 1,
    [GEOKEY.GTCitation]: citation,
    [GEOKEY.GeographicType]: 4326,
    [GEOKEY.GeogCitation]: 'WGS 84',
    [GEOKEY.GeogAngularUnits]: 9102,
    [GEOKEY.ProjectedCSType]: 32767,
    [GEOKEY.PCSCitation]: citation,
    [GEOKEY.Projection]: 32767,
    [GEOKEY.ProjCoordTrans]: 12,
    [GEOKEY.ProjLinearUnits]: 9001,
    [GEOKEY.ProjFalseEasting]: [0],
    [GEOKEY.ProjFalseNorthing]: [0],
    [GEOKEY.ProjCenterLong]: [lon0],
    [GEOKEY.ProjCenterLat]: [lat0],
  };
}

const xmlEscape = (s: string) =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

export interface GdalItem {
  name: string;
  value: string | number;
  /** 0-based band index; absent for dataset-level items */
  sample?: number;
  role?: 'scale' | 'offset' | 'description' | 'unittype';
}

/** GDAL_METADATA XML as GDAL writes it: <GDALMetadata><Item name=".." [sample=".." role=".."]>value</Item>…</GDALMetadata>. */
export function gdalMetadataXml(items: GdalItem[]): string {
  const lines = items.map((it) => {
    const attrs = [`name="${xmlEscape(it.name)}"`];
    if (it.sample !== undefined) attrs.push(`sample="${it.sample}"`);
    if (it.role) attrs.push(`role="${it.role}"`);
    return `  <Item ${attrs.join(' ')}>${xmlEscape(String(it.value))}</Item>`;
  });
  return `<GDALMetadata>\n${lines.join('\n')}\n</GDALMetadata>`;
}
