import type { GeoPolygonal } from '@stormhour/shared';
import booleanPointInPolygon from '@turf/boolean-point-in-polygon';
import Flatbush from 'flatbush';

export interface LocatableBlock {
  id: number;
  bbox: [number, number, number, number];
  geometry: GeoPolygonal;
}

/** Finds the block a point lies in: a packed R-tree of block boxes, then an exact point-in-polygon test. */
export class BlockLocator {
  private readonly index: Flatbush | null;

  constructor(private readonly blocks: LocatableBlock[]) {
    if (blocks.length === 0) {
      this.index = null;
      return;
    }
    this.index = new Flatbush(blocks.length);
    for (const b of blocks) this.index.add(b.bbox[0], b.bbox[1], b.bbox[2], b.bbox[3]);
    this.index.finish();
  }

  /** The id of the block containing (lon, lat), or null outside every block. */
  locate(lon: number, lat: number): number | null {
    if (!this.index) return null;
    for (const i of this.index.search(lon, lat, lon, lat)) {
      if (booleanPointInPolygon([lon, lat], this.blocks[i].geometry)) return this.blocks[i].id;
    }
    return null;
  }
}
