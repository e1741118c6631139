import type { DistrictView } from '@stormhour/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../config/paths';
import { request } from '../lib/api';

/** Districts are read by several features (blocks, people, later bulletins), so they live here. */
export const districtsKey = ['districts'] as const;

export function fetchDistricts(): Promise<DistrictView[]> {
  return request<DistrictView[]>(api.districts);
}

export function getDistrictsQueryOptions() {
  return queryOptions({ queryKey: districtsKey, queryFn: fetchDistricts, staleTime: 5 * 60_000 });
}

export function useDistricts() {
  return useQuery(getDistrictsQueryOptions());
}
