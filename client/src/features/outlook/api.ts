import type {
  ExpectedRegimeResponse,
  IntervalMethod,
  OutlookMeasure,
  OutlookResponse,
} from '@stormhour/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../config/paths';
import { request, requestText } from '../../lib/api';
import { ApiError } from '../../lib/apiError';
import { withQuery } from '../../lib/queryString';
import { regimeKeys } from '../regimes/api';

/** What the Outlook screen asks for; empty dates mean the whole record. */
export interface OutlookParams {
  siteId: number;
  regime: string;
  from: string | null;
  to: string | null;
  binHours: number;
  measure: OutlookMeasure;
  /** Count events within this many km of a block's boundary too. */
  radiusKm: number;
  interval: IntervalMethod;
  afternoonFrom: number;
  afternoonTo: number;
}

export const outlookKeys = {
  all: ['outlook'] as const,
  outlook: (params: OutlookParams) => ['outlook', params] as const,
};

const query = (p: OutlookParams) => ({
  siteId: p.siteId,
  regime: p.regime,
  from: p.from,
  to: p.to,
  binHours: p.binHours,
  measure: p.measure,
  radiusKm: p.radiusKm,
  interval: p.interval,
  afternoonFrom: p.afternoonFrom,
  afternoonTo: p.afternoonTo,
});

export function fetchOutlook(params: OutlookParams): Promise<OutlookResponse> {
  return request<OutlookResponse>(withQuery(api.outlook, query(params)));
}
export function getOutlookQueryOptions(params: OutlookParams) {
  return queryOptions({ queryKey: outlookKeys.outlook(params), queryFn: () => fetchOutlook(params) });
}
export function useOutlook(params: OutlookParams | null) {
  return useQuery({
    ...getOutlookQueryOptions(params ?? ({ siteId: 0 } as OutlookParams)),
    enabled: params !== null,
    // The last table stays on screen while the next one loads.
    placeholderData: keepPreviousData,
  });
}

export function fetchOutlookCsv(params: OutlookParams): Promise<string> {
  return requestText(withQuery(api.outlookCsv, query(params)));
}

/**
 * The regime classified from uploaded forecast grids for a coming week, or null when none is
 * uploaded (the endpoint answers 404 until forecast grids exist, or finds no forecast days).
 */
export async function fetchExpectedRegime(siteId: number, from: string, to: string) {
  try {
    const res = await request<ExpectedRegimeResponse>(withQuery(api.regimeExpected, { siteId, from, to }));
    return res.days.length > 0 ? res : null;
  } catch (error) {
    if (error instanceof ApiError && error.status === 404) return null;
    throw error;
  }
}
export function getExpectedRegimeQueryOptions(siteId: number, from: string, to: string) {
  return queryOptions({
    // Under the regimes' key, so new regime settings (which invalidate every regimes query) reach it.
    queryKey: regimeKeys.expected({ siteId, from, to }),
    queryFn: () => fetchExpectedRegime(siteId, from, to),
  });
}
export function useExpectedWeekRegime(week: { siteId: number; from: string; to: string } | null) {
  return useQuery({
    ...getExpectedRegimeQueryOptions(week?.siteId ?? 0, week?.from ?? '', week?.to ?? ''),
    enabled: week !== null,
  });
}
