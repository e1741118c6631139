import { inflateSync } from 'node:zlib';
import { type GeoTIFFImage, getDecoder } from 'geotiff';
import { FileProblem } from './file-problem.js';

/** The geotiff package's image internals this reader relies on (public in its JavaScript). */
interface ImageInternals {
  fileDirectory: { getValue(tag: string): unknown; loadValue(tag: string): Promise<unknown> };
  /** The whole file, when the image was opened from an ArrayBuffer. */
  source?: { arrayBuffer?: unknown };
  isTiled: boolean;
  planarConfiguration: number;
  littleEndian: boolean;
  getTileWidth(): number;
  getTileHeight(): number;
  getBlockHeight(y: number): number;
  getSampleFormat(sample?: number): number;
  getBitsPerSample(sample?: number): number;
  getTileOrStrip(x: number, y: number, sample: number, decoder: unknown): Promise<{ data: ArrayBuffer }>;
}

type Sample =
  | Uint8Array
  | Int8Array
  | Uint16Array
  | Int16Array
  | Uint32Array
  | Int32Array
  | Float32Array
  | Float64Array;

function viewFor(format: number, bits: number, buffer: ArrayBuffer): Sample | null {
  if (format === 1)
    return bits === 8
      ? new Uint8Array(buffer)
      : bits === 16
        ? new Uint16Array(buffer)
        : bits === 32
          ? new Uint32Array(buffer)
          : null;
  if (format === 2)
    return bits === 8
      ? new Int8Array(buffer)
      : bits === 16
        ? new Int16Array(buffer)
        : bits === 32
          ? new Int32Array(buffer)
          : null;
  if (format === 3)
    return bits === 32 ? new Float32Array(buffer) : bits === 64 ? new Float64Array(buffer) : null;
  return null;
}

export interface BandScaling {
  scale: number[];
  offset: number[];
  nodata: number | null;
}

/**
 * Every band of an image as dBZ in one band-sequential Float32Array (index b·ny·nx + y·nx + x),
 * scale and offset applied and nodata turned into NaN as each strip or tile is decoded. Decoded
 * blocks are read through typed-array views, not value by value; unusual layouts (big-endian, mixed
 * sample types) go through the package's own readRasters.
 */
export async function readBands(image: GeoTIFFImage, s: BandScaling): Promise<Float32Array> {
  const img = image as unknown as ImageInternals;
  const nx = image.getWidth();
  const ny = image.getHeight();
  const bands = image.getSamplesPerPixel();
  const plane = nx * ny;
  const out = new Float32Array(plane * bands);
  const put = (b: number, dst: number, raw: number) => {
    out[b * plane + dst] =
      raw === s.nodata || Number.isNaN(raw) ? Number.NaN : raw * s.scale[b] + s.offset[b];
  };

  const format = img.getSampleFormat(0);
  const bits = img.getBitsPerSample(0);
  const uniform = Array.from(
    { length: bands },
    (_, b) => img.getSampleFormat(b) === format && img.getBitsPerSample(b) === bits,
  ).every(Boolean);
  if (!img.littleEndian || !uniform || bits % 8 !== 0) {
    const rasters = (await image.readRasters({ interleave: false })) as unknown as ArrayLike<number>[];
    for (let b = 0; b < bands; b++) for (let i = 0; i < plane; i++) put(b, i, rasters[b][i]);
    return out;
  }

  const compression = (img.fileDirectory.getValue('Compression') as number | undefined) ?? 1;
  const predictor = (img.fileDirectory.getValue('Predictor') as number | undefined) ?? 1;
  const fileBytes = img.source?.arrayBuffer;
  if (
    fileBytes instanceof ArrayBuffer &&
    (compression === 1 || compression === 8 || compression === 32946) &&
    (predictor === 1 || predictor === 3) &&
    viewFor(format, bits, new ArrayBuffer(0)) !== null
  ) {
    await readBlocksDirectly(img, new Uint8Array(fileBytes), compression, predictor, out, s, {
      nx,
      ny,
      bands,
      format,
      bits,
    });
    return out;
  }
  const tileWidth = img.getTileWidth();
  const tileHeight = img.getTileHeight();
  // The floating-point predictor is undone here, in typed-array loops; the package's own is slower.
  const decoder = await getDecoder(compression, {
    tileWidth,
    tileHeight,
    planarConfiguration: img.planarConfiguration,
    bitsPerSample: img.fileDirectory.getValue('BitsPerSample') as number[],
    predictor: predictor === 3 ? 1 : predictor,
  } as never);
  const samplesPerBlockPixel = separate(img) ? 1 : bands;
  const across = Math.ceil(nx / tileWidth);
  const down = Math.ceil(ny / tileHeight);
  const isSeparate = separate(img);
  for (let ty = 0; ty < down; ty++) {
    const rows = img.getBlockHeight(ty);
    for (let tx = 0; tx < across; tx++) {
      const x0 = tx * tileWidth;
      const width = Math.min(tileWidth, nx - x0);
      for (let sample = 0; sample < (isSeparate ? bands : 1); sample++) {
        const raw = (await img.getTileOrStrip(tx, ty, sample, decoder)).data;
        if (predictor === 3)
          undoFloatingPointPredictor(
            new Uint8Array(raw),
            tileWidth * samplesPerBlockPixel,
            samplesPerBlockPixel,
            bits / 8,
          );
        const block = viewFor(format, bits, raw);
        if (!block) throw new Error(`samples of format ${format} with ${bits} bits are not supported`);
        const nodata = s.nodata ?? Number.NaN;
        for (let b = isSeparate ? sample : 0; b < (isSeparate ? sample + 1 : bands); b++) {
          // One band at a time, written in order: reads stride through the block, writes do not.
          const scale = s.scale[b];
          const offset = s.offset[b];
          const step = isSeparate ? 1 : bands;
          const first = isSeparate ? 0 : b;
          const target = b * plane;
          for (let r = 0; r < rows; r++) {
            const y = ty * tileHeight + r;
            if (y >= ny) break;
            let src = r * tileWidth * step + first;
            let dst = target + y * nx + x0;
            for (let c = 0; c < width; c++, src += step, dst++) {
              const v = block[src];
              out[dst] = v === nodata || Number.isNaN(v) ? Number.NaN : v * scale + offset;
            }
          }
        }
      }
    }
  }
  return out;
}

/**
 * The usual case, read without the package's per-block machinery: each strip or tile is inflated by
 * Node's zlib straight from the file's bytes into one buffer of the block's known size, and the
 * floating-point predictor is undone row by row on the way into the output, with no intermediate copy.
 */
async function readBlocksDirectly(
  img: ImageInternals,
  file: Uint8Array,
  compression: number,
  predictor: number,
  out: Float32Array,
  s: BandScaling,
  { nx, ny, bands, format, bits }: { nx: number; ny: number; bands: number; format: number; bits: number },
): Promise<void> {
  const tileWidth = img.getTileWidth();
  const tileHeight = img.getTileHeight();
  const isSeparate = separate(img);
  const samplesPerBlockPixel = isSeparate ? 1 : bands;
  const bytesPerSample = bits / 8;
  const across = Math.ceil(nx / tileWidth);
  const down = Math.ceil(ny / tileHeight);
  const offsets = (await img.fileDirectory.loadValue(
    img.isTiled ? 'TileOffsets' : 'StripOffsets',
  )) as ArrayLike<number | bigint>;
  const counts = (await img.fileDirectory.loadValue(
    img.isTiled ? 'TileByteCounts' : 'StripByteCounts',
  )) as ArrayLike<number | bigint>;
  const plane = nx * ny;
  const nodata = s.nodata ?? Number.NaN;
  const rowSamples = tileWidth * samplesPerBlockPixel;
  const rowBytes = rowSamples * bytesPerSample;
  // One row of reassembled samples when the floating-point predictor is undone on the way.
  const rowWords = new ArrayBuffer(rowBytes);
  const rowFloats = viewFor(format, bits, rowWords) as Sample;
  for (let sample = 0; sample < (isSeparate ? bands : 1); sample++) {
    for (let ty = 0; ty < down; ty++) {
      const rows = img.getBlockHeight(ty);
      for (let tx = 0; tx < across; tx++) {
        const index = (sample * down + ty) * across + tx;
        const where = `${img.isTiled ? 'tile' : 'strip'} ${index + 1}`;
        const offset = Number(offsets[index]);
        const count = Number(counts[index]);
        const expected = rows * rowBytes;
        let block: Uint8Array;
        if (compression === 1) {
          if (offset + expected > file.length) throw new FileProblem(where, 'the file ends inside it');
          block = file.slice(offset, offset + expected);
        } else {
          try {
            // One output chunk a little larger than the block: no concatenation, no copy.
            block = inflateSync(file.subarray(offset, offset + count), {
              chunkSize: Math.max(expected + 64, 1024),
              maxOutputLength: Math.max(expected + 64, 1024),
            });
          } catch (e) {
            throw new FileProblem(where, `its DEFLATE data cannot be read (${(e as Error).message})`);
          }
          if (block.length < expected)
            throw new FileProblem(where, `holds ${block.length} bytes, not the ${expected} its size needs`);
        }
        const x0 = tx * tileWidth;
        const width = Math.min(tileWidth, nx - x0);
        const firstBand = isSeparate ? sample : 0;
        const lastBand = isSeparate ? sample + 1 : bands;
        const aligned = block.byteOffset % bytesPerSample === 0;
        const blockSamples =
          predictor === 1 && aligned
            ? (viewFor(format, bits, block.buffer as ArrayBuffer) as Sample).subarray(
                block.byteOffset / bytesPerSample,
                block.byteOffset / bytesPerSample + rows * rowSamples,
              )
            : null;
        for (let r = 0; r < rows; r++) {
          const y = ty * tileHeight + r;
          if (y >= ny) break;
          let source: Sample;
          let first: number;
          if (blockSamples) {
            source = blockSamples;
            first = r * rowSamples;
          } else if (predictor === 1) {
            new Uint8Array(rowWords).set(block.subarray(r * rowBytes, (r + 1) * rowBytes));
            source = rowFloats;
            first = 0;
          } else {
            undoPredictorRow(block, r * rowBytes, rowSamples, samplesPerBlockPixel, bytesPerSample, rowWords);
            source = rowFloats;
            first = 0;
          }
          for (let b = firstBand; b < lastBand; b++) {
            const scale = s.scale[b];
            const offsetB = s.offset[b];
            let src = first + (isSeparate ? 0 : b);
            let dst = b * plane + y * nx + x0;
            for (let c = 0; c < width; c++, src += samplesPerBlockPixel, dst++) {
              const v = source[src];
              out[dst] = v === nodata || Number.isNaN(v) ? Number.NaN : v * scale + offsetB;
            }
          }
        }
      }
    }
  }
}

/**
 * Undoes the floating-point predictor (Adobe TIFF Technical Note 3) for one row of `block` starting
 * at byte `start`, writing the little-endian samples into `target`: first the horizontal byte
 * differences, in place (four bytes at a time when the stride allows), then the byte planes back
 * into samples.
 */
function undoPredictorRow(
  block: Uint8Array,
  start: number,
  samplesPerRow: number,
  stride: number,
  bytesPerSample: number,
  target: ArrayBuffer,
): void {
  const rowBytes = samplesPerRow * bytesPerSample;
  const end = start + rowBytes;
  if (stride % 4 === 0 && (block.byteOffset + start) % 4 === 0) {
    // Byte-wise sums of four lanes in one 32-bit word, without carries between lanes.
    const words = new Int32Array(block.buffer, block.byteOffset + start, rowBytes >> 2);
    const step = stride >> 2;
    for (let i = step; i < words.length; i++) {
      const a = words[i];
      const b = words[i - step];
      words[i] = ((a & 0x7f7f7f7f) + (b & 0x7f7f7f7f)) ^ ((a ^ b) & 0x80808080);
    }
  } else {
    for (let i = start + stride; i < end; i++) block[i] += block[i - stride];
  }
  const n = samplesPerRow;
  if (bytesPerSample === 4) {
    const words = new Uint32Array(target);
    for (let k = 0, i = start; k < n; k++, i++)
      words[k] = ((block[i] << 24) | (block[i + n] << 16) | (block[i + 2 * n] << 8) | block[i + 3 * n]) >>> 0;
    return;
  }
  const bytes = new Uint8Array(target);
  for (let k = 0; k < n; k++)
    for (let b = 0; b < bytesPerSample; b++)
      bytes[k * bytesPerSample + b] = block[start + (bytesPerSample - b - 1) * n + k];
}

const separate = (img: ImageInternals) => img.planarConfiguration === 2;

/**
 * TIFF floating-point predictor (Adobe Photoshop TIFF Technical Note 3): each row holds the byte
 * planes of its samples, most significant first, differenced horizontally with the sample stride.
 * Undoes both steps in place, leaving little-endian samples.
 */
export function undoFloatingPointPredictor(
  block: Uint8Array,
  samplesPerRow: number,
  stride: number,
  bytesPerSample: number,
): void {
  const rowBytes = samplesPerRow * bytesPerSample;
  const copy = new Uint8Array(rowBytes);
  const aligned = bytesPerSample === 4 && block.byteOffset % 4 === 0;
  const words = aligned ? new Uint32Array(block.buffer, block.byteOffset, block.length >> 2) : null;
  for (let start = 0; start + rowBytes <= block.length; start += rowBytes) {
    for (let i = start + stride; i < start + rowBytes; i++) block[i] = (block[i] + block[i - stride]) & 0xff;
    copy.set(block.subarray(start, start + rowBytes));
    if (words) {
      // Four byte planes, most significant first, into little-endian 32-bit words.
      const n = samplesPerRow;
      const w0 = start >> 2;
      for (let k = 0; k < n; k++)
        words[w0 + k] =
          ((copy[k] << 24) | (copy[n + k] << 16) | (copy[2 * n + k] << 8) | copy[3 * n + k]) >>> 0;
      continue;
    }
    for (let k = 0; k < samplesPerRow; k++)
      for (let b = 0; b < bytesPerSample; b++)
        block[start + k * bytesPerSample + b] = copy[(bytesPerSample - b - 1) * samplesPerRow + k];
  }
}
