import type { BlockView } from '@stormhour/shared';
import type { FeatureCollection, MultiPolygon, Polygon } from 'geojson';

/** What each feature of `GET /api/blocks/geojson` carries (not in the shared contracts yet). */
export type BlockFeatureProperties = Pick<
  BlockView,
  'id' | 'code' | 'name' | 'districtId' | 'districtCode' | 'districtName' | 'areaKm2'
>;

export type BlockFeatureCollection = FeatureCollection<Polygon | MultiPolygon, BlockFeatureProperties>;
