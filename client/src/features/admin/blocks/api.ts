import type {
  BlockImportResult,
  BlockView,
  CreateDistrictRequest,
  DistrictView,
  UpdateBlockRequest,
  UpdateDistrictRequest,
} from '@stormhour/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { districtsKey } from '../../../api/districts';
import { api } from '../../../config/paths';
import { request, uploadFile } from '../../../lib/api';

export {
  type BlockListParams,
  fetchBlocks,
  fetchBlocksGeojson,
  getBlocksGeojsonQueryOptions,
  getBlocksQueryOptions,
  regionKeys,
  useBlocks,
  useBlocksGeojson,
} from '../../../api/blocks';

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

export function renameDistrict(id: number, body: UpdateDistrictRequest): Promise<DistrictView> {
  return request<DistrictView>(api.district(id), { method: 'PATCH', body });
}
export function useRenameDistrict() {
  const invalidate = useInvalidateRegions();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: UpdateDistrictRequest }) => renameDistrict(id, body),
    onSuccess: invalidate,
  });
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
