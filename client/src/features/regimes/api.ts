import type { AnomalySource, RegimeComposite, RegimeSettings, RegimesResponse } from '@stormhour/shared';
import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../config/paths';
import { request } from '../../lib/api';
import { withQuery } from '../../lib/queryString';

/** The site and the local days (YYYY-MM-DD, both included) the regimes are read for; empty days mean "all". */
export interface RegimesParams {
  siteId: number;
  from: string | null;
  to: string | null;
}

export interface CompositeParams extends RegimesParams {
  regime: string;
}

export const regimeKeys = {
  all: ['regimes'] as const,
  days: (params: RegimesParams) => ['regimes', 'days', params] as const,
  composite: (params: CompositeParams) => ['regimes', 'composite', params] as const,
  settings: (siteId: number) => ['regimes', 'settings', siteId] as const,
  expected: (params: ExpectedRegimeParams) => ['regimes', 'expected', params] as const,
  sources: ['regimes', 'sources'] as const,
};

/** A coming period (local days, both included) to read the expected regime for. */
export interface ExpectedRegimeParams {
  siteId: number;
  from: string;
  to: string;
}

export function fetchRegimes(params: RegimesParams): Promise<RegimesResponse> {
  return request<RegimesResponse>(
    withQuery(api.regimes, { siteId: params.siteId, from: params.from, to: params.to }),
  );
}
export function getRegimesQueryOptions(params: RegimesParams) {
  return queryOptions({ queryKey: regimeKeys.days(params), queryFn: () => fetchRegimes(params) });
}
export function useRegimes(params: RegimesParams | null) {
  return useQuery({
    ...getRegimesQueryOptions(params ?? { siteId: 0, from: null, to: null }),
    enabled: params !== null,
  });
}

export function fetchComposite(params: CompositeParams): Promise<RegimeComposite> {
  return request<RegimeComposite>(
    withQuery(api.regimeComposite, {
      siteId: params.siteId,
      regime: params.regime,
      from: params.from,
      to: params.to,
    }),
  );
}
export function getCompositeQueryOptions(params: CompositeParams) {
  return queryOptions({ queryKey: regimeKeys.composite(params), queryFn: () => fetchComposite(params) });
}
export function useComposite(params: CompositeParams | null) {
  return useQuery({
    ...getCompositeQueryOptions(params ?? { siteId: 0, from: null, to: null, regime: '' }),
    enabled: params !== null,
    // The previous map stays while the next regime loads, so the page does not jump.
    placeholderData: keepPreviousData,
  });
}

/** A site's regime settings; each save makes a new version. */
export interface VersionedRegimeSettings {
  version: number;
  settings: RegimeSettings;
}

export function fetchRegimeSettings(siteId: number): Promise<VersionedRegimeSettings> {
  return request<VersionedRegimeSettings>(withQuery(api.regimeSettings, { siteId }));
}
export function getRegimeSettingsQueryOptions(siteId: number) {
  return queryOptions({ queryKey: regimeKeys.settings(siteId), queryFn: () => fetchRegimeSettings(siteId) });
}
export function useRegimeSettings(siteId: number) {
  return useQuery(getRegimeSettingsQueryOptions(siteId));
}

export function updateRegimeSettings(siteId: number, body: RegimeSettings): Promise<VersionedRegimeSettings> {
  return request<VersionedRegimeSettings>(withQuery(api.regimeSettings, { siteId }), { method: 'PUT', body });
}
export function useUpdateRegimeSettings(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: RegimeSettings) => updateRegimeSettings(siteId, body),
    // New settings classify every day again: the calendar, counts and composites all change.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: regimeKeys.all }),
  });
}

/** Which anomaly fields are stored: analysis or forecast, as uploaded or totals − climatology. */
export function fetchAnomalySources(): Promise<AnomalySource[]> {
  return request<AnomalySource[]>(api.regimeSources);
}
export function getAnomalySourcesQueryOptions() {
  return queryOptions({ queryKey: regimeKeys.sources, queryFn: fetchAnomalySources });
}
export function useAnomalySources() {
  return useQuery(getAnomalySourcesQueryOptions());
}
