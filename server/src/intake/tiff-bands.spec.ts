import { deflateSync } from 'node:zlib';
import { fromArrayBuffer } from 'geotiff';
import { describe, expect, it } from 'vitest';
import { littleEndianFloatTiff, predictAndDeflate } from '../testing/tiff-surgery.js';
import { readBands } from './tiff-bands.js';

const asArrayBuffer = (b: Buffer) => b.buffer.slice(b.byteOffset, b.byteOffset + b.byteLength) as ArrayBuffer;

function floatTiff(width: number, height: number, bands: number): { file: Buffer; values: Float32Array } {
  const values = new Float32Array(width * height * bands);
  for (let i = 0; i < values.length; i++) values[i] = Math.sin(i * 0.37) * 40 + (i % 7) - 3.25;
  return { file: littleEndianFloatTiff(width, height, bands, values), values };
}

describe('readBands', () => {
  it.each([1, 3, 4, 20])(
    'undoes the floating-point predictor exactly as the geotiff package does (%d band(s); 4 and 20 take the four-bytes-at-a-time path)',
    async (bands) => {
      const { file } = floatTiff(37, 11, bands);
      const packed = predictAndDeflate(file, 37, bands, (b) => deflateSync(b));
      const image = await (await fromArrayBuffer(asArrayBuffer(packed))).getImage();
      // The geotiff package's own predictor and inflate are the reference.
      const reference = (await image.readRasters({ interleave: false })) as unknown as Float32Array[];
      const ours = await readBands(image, {
        scale: Array(bands).fill(1),
        offset: Array(bands).fill(0),
        nodata: null,
      });
      for (let b = 0; b < bands; b++)
        expect(Array.from(ours.subarray(b * 37 * 11, (b + 1) * 37 * 11))).toEqual(Array.from(reference[b]));
    },
  );

  it('reads an uncompressed image to the written values, with scale, offset and nodata applied', async () => {
    const values = new Float32Array(20 * 5 * 2).map((_, i) => i / 3);
    values[3] = -999;
    const image = await (
      await fromArrayBuffer(asArrayBuffer(littleEndianFloatTiff(20, 5, 2, values)))
    ).getImage();
    // The geotiff package reads the same file as the reference.
    const reference = (await image.readRasters({ interleave: false })) as unknown as Float32Array[];
    const out = await readBands(image, { scale: [2, 1], offset: [1, 0], nodata: -999 });
    expect(out[0]).toBeCloseTo(reference[0][0] * 2 + 1, 5);
    expect(out[100 + 5]).toBeCloseTo(reference[1][5], 6);
    // values[3] is pixel 1 of band 1, the nodata value.
    expect(out[100 + 1]).toBeNaN();
  });
});
