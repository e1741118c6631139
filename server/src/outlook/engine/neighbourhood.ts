import type { Position } from '@stormhour/shared';
import Flatbush from 'flatbush';
import { withinBuffer } from './block-coverage.js';

/** For every event, the blocks it counts for, as compressed rows: blockIndex[offsets[e] … offsets[e+1]). */
export interface EventBlocks {
  offsets: Int32Array;
  blockIndex: Int32Array;
}

/** Each event counts for the one block it was stored in (index, or −1 outside every block). */
export function ownBlock(blockOf: Int32Array): EventBlocks {
  const offsets = new Int32Array(blockOf.length + 1);
  const out: number[] = [];
  for (let e = 0; e < blockOf.length; e++) {
    if (blockOf[e] >= 0) out.push(blockOf[e]);
    offsets[e + 1] = out.length;
  }
  return { offsets, blockIndex: Int32Array.from(out) };
}

/**
 * Each event (a point in the site plane, km) counts for every block it lies in or within r km of
 * (the block buffered by r): a packed R-tree of the blocks' boxes grown by r, then an exact test.
 */
export function blocksWithin(
  xKm: Float64Array,
  yKm: Float64Array,
  blocks: Position[][][][],
  radiusKm: number,
): EventBlocks {
  const offsets = new Int32Array(xKm.length + 1);
  const out: number[] = [];
  if (blocks.length === 0) return { offsets, blockIndex: new Int32Array(0) };
  const index = new Flatbush(blocks.length);
  for (const polygons of blocks) {
    let minX = Infinity;
    let minY = Infinity;
    let maxX = -Infinity;
    let maxY = -Infinity;
    for (const rings of polygons)
      for (const [x, y] of rings[0]) {
        minX = Math.min(minX, x);
        minY = Math.min(minY, y);
        maxX = Math.max(maxX, x);
        maxY = Math.max(maxY, y);
      }
    index.add(minX - radiusKm, minY - radiusKm, maxX + radiusKm, maxY + radiusKm);
  }
  index.finish();
  for (let e = 0; e < xKm.length; e++) {
    const x = xKm[e];
    const y = yKm[e];
    const found = index.search(x, y, x, y).filter((b) => withinBuffer(blocks[b], x, y, radiusKm));
    found.sort((a, b) => a - b);
    out.push(...found);
    offsets[e + 1] = out.length;
  }
  return { offsets, blockIndex: Int32Array.from(out) };
}
