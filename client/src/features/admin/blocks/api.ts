import type {
  BlockImportResult,
  BlockView,
  CreateDistrictRequest,
  DistrictView,
  UpdateBlockRequest,
} from '@stormhour/shared';
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { districtsKey } from '../../../api/districts';
import { api } from '../../../config/paths';
import { request, uploadFile } from '../../../lib/api';
import type { BlockFeatureCollection } from '../../../lib/geo/blockFeatures';
import { withQuery } from '../../../lib/queryString';

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

/** Blocks, their outlines and the district totals all change together. */
function useInvalidateRegions() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: ['blocks'] }),
      queryClient.invalidateQueries({ queryKey: districtsKey }),
    ]);
}

export function createDistrict(body: CreateDistrictRequest): Promise<DistrictView> {
  return request<DistrictView>(api.districts, { method: 'POST', body });
}
export function useCreateDistrict() {
  const invalidate = useInvalidateRegions();
  return useMutation({ mutationFn: createDistrict, onSuccess: invalidate });
}

export function updateBlock(id: number, body: UpdateBlockRequest): Promise<BlockView> {
  return request<BlockView>(api.block(id), { method: 'PATCH', body });
}
export function useUpdateBlock() {
  const invalidate = useInvalidateRegions();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: UpdateBlockRequest }) => updateBlock(id, body),
    onSuccess: invalidate,
  });
}

export function importBlocks(file: File, onProgress: (fraction: number) => void): Promise<BlockImportResult> {
  return uploadFile<BlockImportResult>(api.blocksImport, file, onProgress);
}
export function useImportBlocks(onProgress: (fraction: number) => void) {
  const invalidate = useInvalidateRegions();
  return useMutation({ mutationFn: (file: File) => importBlocks(file, onProgress), onSuccess: invalidate });
}
