import type {
  AtlasDistributionsResponse,
  AtlasDiurnalResponse,
  AtlasMapResponse,
  AtlasMotionResponse,
  AtlasTimeDistanceResponse,
} from '@stormhour/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../config/paths';
import { request } from '../../lib/api';
import { withQuery } from '../../lib/queryString';

/** The filter every Atlas view shares; null or empty means "all". */
export interface AtlasParams {
  siteId: number;
  from: string | null;
  to: string | null;
  regime: string | null;
  districtId: number | null;
  cellType: string | null;
  source: string | null;
}

export interface MapParams extends AtlasParams {
  binHours: number;
  bin: number | null;
  bandwidthKm: number;
}

export interface AxisParams {
  fromLat: number;
  fromLon: number;
  toLat: number;
  toLon: number;
  halfWidthKm: number;
}

export type TimeDistanceParams = AtlasParams & AxisParams;

export const atlasKeys = {
  all: ['atlas'] as const,
  map: (p: MapParams) => ['atlas', 'map', p] as const,
  diurnal: (p: AtlasParams) => ['atlas', 'diurnal', p] as const,
  distributions: (p: AtlasParams) => ['atlas', 'distributions', p] as const,
  timeDistance: (p: TimeDistanceParams) => ['atlas', 'time-distance', p] as const,
  motion: (p: AtlasParams) => ['atlas', 'motion', p] as const,
};

const query = (p: object) => p as Record<string, string | number | null | undefined>;

export function fetchAtlasMap(p: MapParams): Promise<AtlasMapResponse> {
  return request<AtlasMapResponse>(withQuery(api.atlas.map, query(p)));
}
export function getAtlasMapQueryOptions(p: MapParams) {
  return queryOptions({ queryKey: atlasKeys.map(p), queryFn: () => fetchAtlasMap(p) });
}
export function useAtlasMap(p: MapParams) {
  // The previous drawing stays while the next filter loads, so the page does not jump.
  return useQuery({ ...getAtlasMapQueryOptions(p), placeholderData: keepPreviousData });
}

export function fetchAtlasDiurnal(p: AtlasParams): Promise<AtlasDiurnalResponse> {
  return request<AtlasDiurnalResponse>(withQuery(api.atlas.diurnal, query(p)));
}
export function getAtlasDiurnalQueryOptions(p: AtlasParams) {
  return queryOptions({ queryKey: atlasKeys.diurnal(p), queryFn: () => fetchAtlasDiurnal(p) });
}
export function useAtlasDiurnal(p: AtlasParams) {
  return useQuery({ ...getAtlasDiurnalQueryOptions(p), placeholderData: keepPreviousData });
}

export function fetchAtlasDistributions(p: AtlasParams): Promise<AtlasDistributionsResponse> {
  return request<AtlasDistributionsResponse>(withQuery(api.atlas.distributions, query(p)));
}
export function getAtlasDistributionsQueryOptions(p: AtlasParams) {
  return queryOptions({ queryKey: atlasKeys.distributions(p), queryFn: () => fetchAtlasDistributions(p) });
}
export function useAtlasDistributions(p: AtlasParams) {
  return useQuery({ ...getAtlasDistributionsQueryOptions(p), placeholderData: keepPreviousData });
}

export function fetchAtlasTimeDistance(p: TimeDistanceParams): Promise<AtlasTimeDistanceResponse> {
  return request<AtlasTimeDistanceResponse>(withQuery(api.atlas.timeDistance, query(p)));
}
export function getAtlasTimeDistanceQueryOptions(p: TimeDistanceParams) {
  return queryOptions({ queryKey: atlasKeys.timeDistance(p), queryFn: () => fetchAtlasTimeDistance(p) });
}
export function useAtlasTimeDistance(p: TimeDistanceParams) {
  return useQuery({ ...getAtlasTimeDistanceQueryOptions(p), placeholderData: keepPreviousData });
}

export function fetchAtlasMotion(p: AtlasParams): Promise<AtlasMotionResponse> {
  return request<AtlasMotionResponse>(withQuery(api.atlas.motion, query(p)));
}
export function getAtlasMotionQueryOptions(p: AtlasParams) {
  return queryOptions({ queryKey: atlasKeys.motion(p), queryFn: () => fetchAtlasMotion(p) });
}
export function useAtlasMotion(p: AtlasParams) {
  return useQuery({ ...getAtlasMotionQueryOptions(p), placeholderData: keepPreviousData });
}
