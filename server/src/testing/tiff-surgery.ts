/**
 * Small edits to a little-endian, single-strip TIFF for bad-input tests: hide a tag by renumbering it
 * to an unused private tag, or overwrite one band's samples. TIFF 6.0 layout: header, then IFD entries
 * of 12 bytes (tag, type, count, value or offset).
 */
function entries(buf: Buffer): { at: number; tag: number; type: number; count: number; value: number }[] {
  if (buf.toString('latin1', 0, 2) !== 'II') throw new Error('only little-endian TIFFs are edited here');
  const ifd = buf.readUInt32LE(4);
  const n = buf.readUInt16LE(ifd);
  return Array.from({ length: n }, (_, k) => {
    const at = ifd + 2 + 12 * k;
    return {
      at,
      tag: buf.readUInt16LE(at),
      type: buf.readUInt16LE(at + 2),
      count: buf.readUInt32LE(at + 4),
      value: buf.readUInt32LE(at + 8),
    };
  });
}

export function hideTags(original: Buffer, tags: number[]): Buffer {
  const buf = Buffer.from(original);
  let spare = 65000;
  for (const e of entries(buf)) if (tags.includes(e.tag)) buf.writeUInt16LE(spare++, e.at);
  // Entries must stay sorted by tag; hidden tags now sort last, so move nothing but re-sort the IFD.
  const list = entries(buf).map((e) => buf.subarray(e.at, e.at + 12).toString('latin1'));
  list.sort((a, b) => Buffer.from(a, 'latin1').readUInt16LE(0) - Buffer.from(b, 'latin1').readUInt16LE(0));
  const first = entries(buf)[0].at;
  list.forEach((raw, k) => {
    buf.write(raw, first + 12 * k, 'latin1');
  });
  return buf;
}

/** Sets every sample of one band (pixel-interleaved 8-bit data) to a value. */
export function fillBand(original: Buffer, band: number, bands: number, value: number): Buffer {
  const buf = Buffer.from(original);
  const strip = entries(buf).find((e) => e.tag === 273);
  const bytes = entries(buf).find((e) => e.tag === 279);
  if (!strip || !bytes || strip.count !== 1) throw new Error('expected one strip');
  for (let i = strip.value + band; i < strip.value + bytes.value; i += bands) buf[i] = value;
  return buf;
}

export const TAG = {
  GeoKeyDirectory: 34735,
  ModelPixelScale: 33550,
  ModelTiepoint: 33922,
  GdalMetadata: 42112,
};

/** Re-encodes a single-strip TIFF's strip with DEFLATE (compression 8), as GDAL would write it. */
export function deflateStrip(original: Buffer, deflate: (b: Buffer) => Buffer): Buffer {
  const list = entries(original);
  const strip = list.find((e) => e.tag === 273);
  const bytes = list.find((e) => e.tag === 279);
  const compression = list.find((e) => e.tag === 259);
  if (!strip || !bytes || !compression || strip.count !== 1) throw new Error('expected one strip');
  const packed = deflate(original.subarray(strip.value, strip.value + bytes.value));
  const out = Buffer.concat([original, packed]);
  out.writeUInt32LE(original.length, strip.at + 8);
  out.writeUInt32LE(packed.length, bytes.at + 8);
  out.writeUInt16LE(8, compression.at + 8);
  return out;
}

/** Adds or replaces one SHORT tag by writing a new IFD at the end of the file (the old one is left). */
export function setShortTag(original: Buffer, tag: number, value: number): Buffer {
  const list = entries(original).filter((e) => e.tag !== tag);
  const raw = list.map((e) => original.subarray(e.at, e.at + 12));
  const extra = Buffer.alloc(12);
  extra.writeUInt16LE(tag, 0);
  extra.writeUInt16LE(3, 2);
  extra.writeUInt32LE(1, 4);
  extra.writeUInt16LE(value, 8);
  raw.push(extra);
  raw.sort((a, b) => a.readUInt16LE(0) - b.readUInt16LE(0));
  const pad = original.length % 2;
  const ifd = Buffer.alloc(2 + 12 * raw.length + 4);
  ifd.writeUInt16LE(raw.length, 0);
  raw.forEach((r, k) => {
    r.copy(ifd, 2 + 12 * k);
  });
  const out = Buffer.concat([original, Buffer.alloc(pad), ifd]);
  out.writeUInt32LE(original.length + pad, 4);
  return out;
}

/**
 * The encoder side of the TIFF floating-point predictor (Technical Note 3), for tests: split each
 * row's little-endian samples into byte planes, most significant first, then difference bytes
 * with the given stride.
 */
export function applyFloatingPointPredictor(
  block: Uint8Array,
  samplesPerRow: number,
  stride: number,
  bytesPerSample: number,
) {
  const rowBytes = samplesPerRow * bytesPerSample;
  for (let start = 0; start + rowBytes <= block.length; start += rowBytes) {
    const row = block.slice(start, start + rowBytes);
    for (let k = 0; k < samplesPerRow; k++)
      for (let b = 0; b < bytesPerSample; b++)
        block[start + (bytesPerSample - b - 1) * samplesPerRow + k] = row[k * bytesPerSample + b];
    for (let i = start + rowBytes - 1; i >= start + stride; i--)
      block[i] = (block[i] - block[i - stride]) & 0xff;
  }
}

/** Re-encodes the single strip of a float TIFF with the floating-point predictor and DEFLATE. */
export function predictAndDeflate(
  original: Buffer,
  width: number,
  bands: number,
  deflate: (b: Buffer) => Buffer,
): Buffer {
  const strip = entries(original).find((e) => e.tag === 273);
  const bytes = entries(original).find((e) => e.tag === 279);
  if (!strip || !bytes) throw new Error('expected one strip');
  const data = Uint8Array.from(original.subarray(strip.value, strip.value + bytes.value));
  applyFloatingPointPredictor(data, width * bands, bands, 4);
  const staged = Buffer.from(original);
  Buffer.from(data).copy(staged, strip.value);
  return setShortTag(deflateStrip(staged, deflate), 317, 3);
}

/**
 * A minimal little-endian TIFF of float32 samples, pixel-interleaved, one strip, no georeferencing:
 * just enough for decoder tests (the geotiff package's own writer writes big-endian files).
 */
export function littleEndianFloatTiff(
  width: number,
  height: number,
  bands: number,
  values: Float32Array,
): Buffer {
  const data = Buffer.from(values.buffer, values.byteOffset, values.byteLength);
  const tags: [number, number, number[]][] = [
    [256, 4, [width]],
    [257, 4, [height]],
    [258, 3, Array(bands).fill(32)],
    [259, 3, [1]],
    [262, 3, [1]],
    [273, 4, [0]],
    [277, 3, [bands]],
    [278, 4, [height]],
    [279, 4, [data.length]],
    [284, 3, [1]],
    ...(bands > 1 ? ([[338, 3, Array(bands - 1).fill(0)]] as [number, number, number[]][]) : []),
    [339, 3, Array(bands).fill(3)],
  ];
  const ifdAt = 8;
  const ifdSize = 2 + 12 * tags.length + 4;
  let extraAt = ifdAt + ifdSize;
  const extras: Buffer[] = [];
  const ifd = Buffer.alloc(ifdSize);
  ifd.writeUInt16LE(tags.length, 0);
  const dataAt =
    extraAt +
    tags.reduce(
      (n, [, type, v]) => n + (v.length * (type === 3 ? 2 : 4) > 4 ? v.length * (type === 3 ? 2 : 4) : 0),
      0,
    );
  tags.forEach(([tag, type, v], k) => {
    const at = 2 + 12 * k;
    ifd.writeUInt16LE(tag, at);
    ifd.writeUInt16LE(type, at + 2);
    ifd.writeUInt32LE(v.length, at + 4);
    const size = type === 3 ? 2 : 4;
    const vals = tag === 273 ? [dataAt] : v;
    if (vals.length * size <= 4) {
      for (const [i, x] of vals.entries()) {
        if (size === 2) ifd.writeUInt16LE(x, at + 8 + 2 * i);
        else ifd.writeUInt32LE(x, at + 8);
      }
    } else {
      const b = Buffer.alloc(vals.length * size);
      for (const [i, x] of vals.entries()) {
        if (size === 2) b.writeUInt16LE(x, 2 * i);
        else b.writeUInt32LE(x, 4 * i);
      }
      ifd.writeUInt32LE(extraAt, at + 8);
      extraAt += b.length;
      extras.push(b);
    }
  });
  const header = Buffer.from([0x49, 0x49, 42, 0, ifdAt, 0, 0, 0]);
  return Buffer.concat([header, ifd, ...extras, data]);
}
