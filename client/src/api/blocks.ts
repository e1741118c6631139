import type { BlockView } from '@stormhour/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../config/paths';
import { request } from '../lib/api';
import type { BlockFeatureCollection } from '../lib/geo/blockFeatures';
import { withQuery } from '../lib/queryString';

// Blocks and their outlines are read by several features (admin, intake, later the atlas), so they live here.

/** Narrows a list by district and/or text; empty values mean "all". */
export interface BlockListParams {
  districtId?: number;
  q?: string;
}

export const regionKeys = {
  blocks: (params: BlockListParams) => ['blocks', 'list', params] as const,
  geojson: (params: BlockListParams) => ['blocks', 'geojson', params] as const,
};

export function fetchBlocks(params: BlockListParams = {}): Promise<BlockView[]> {
  return request<BlockView[]>(withQuery(api.blocks, { districtId: params.districtId, q: params.q }));
}
export function getBlocksQueryOptions(params: BlockListParams = {}) {
  return queryOptions({ queryKey: regionKeys.blocks(params), queryFn: () => fetchBlocks(params) });
}
export function useBlocks(params: BlockListParams = {}) {
  return useQuery(getBlocksQueryOptions(params));
}

export function fetchBlocksGeojson(params: BlockListParams = {}): Promise<BlockFeatureCollection> {
  return request<BlockFeatureCollection>(withQuery(api.blocksGeojson, { districtId: params.districtId }));
}
export function getBlocksGeojsonQueryOptions(params: BlockListParams = {}) {
  return queryOptions({ queryKey: regionKeys.geojson(params), queryFn: () => fetchBlocksGeojson(params) });
}
export function useBlocksGeojson(params: BlockListParams = {}) {
  return useQuery(getBlocksGeojsonQueryOptions(params));
}
