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
