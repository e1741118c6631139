import type { CreateSiteRequest, SiteView, UpdateSiteRequest } from '@stormhour/shared';
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Feature, Polygon } from 'geojson';
import { api } from '../../../config/paths';
import { request } from '../../../lib/api';

/** What GET /api/radar-sites/:id/coverage answers (not in the shared contracts yet). */
export type CoverageFeature = Feature<Polygon>;

export const siteKeys = {
  all: ['radar-sites'] as const,
  list: ['radar-sites', 'list'] as const,
  one: (id: number) => ['radar-sites', 'one', id] as const,
  coverage: (id: number) => ['radar-sites', 'coverage', id] as const,
};

export function fetchSites(): Promise<SiteView[]> {
  return request<SiteView[]>(api.radarSites);
}
export function getSitesQueryOptions() {
  return queryOptions({ queryKey: siteKeys.list, queryFn: fetchSites });
}
export function useSites() {
  return useQuery(getSitesQueryOptions());
}

export function fetchSite(id: number): Promise<SiteView> {
  return request<SiteView>(api.radarSite(id));
}
export function getSiteQueryOptions(id: number) {
  return queryOptions({ queryKey: siteKeys.one(id), queryFn: () => fetchSite(id) });
}
export function useSite(id: number) {
  return useQuery(getSiteQueryOptions(id));
}

export function fetchCoverage(id: number): Promise<CoverageFeature> {
  return request<CoverageFeature>(api.radarSiteCoverage(id));
}
export function getCoverageQueryOptions(id: number) {
  return queryOptions({ queryKey: siteKeys.coverage(id), queryFn: () => fetchCoverage(id) });
}
export function useCoverage(id: number | null) {
  return useQuery({ ...getCoverageQueryOptions(id ?? 0), enabled: id !== null });
}

export function createSite(body: CreateSiteRequest): Promise<SiteView> {
  return request<SiteView>(api.radarSites, { method: 'POST', body });
}
export function useCreateSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createSite,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: siteKeys.all }),
  });
}

export function updateSite(id: number, body: UpdateSiteRequest): Promise<SiteView> {
  return request<SiteView>(api.radarSite(id), { method: 'PATCH', body });
}
export function useUpdateSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: UpdateSiteRequest }) => updateSite(id, body),
    // Range and blockage change the coverage, so every view of sites is refreshed.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: siteKeys.all }),
  });
}
