import type { BulletinSummaryView, ScorecardSource, ScorecardView } from '@stormhour/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../config/paths';
import { request, requestBlob, saveBlob } from '../../lib/api';
import { withQuery } from '../../lib/queryString';

/** What the Scorecard screen asks for: one district, one season (local dates), one source of outcomes. */
export interface ScorecardParams {
  districtId: number;
  from: string;
  to: string;
  source: ScorecardSource;
  /** Bootstrap resamples over days for the intervals; 0 leaves them out. */
  resamples: number;
}

export const scorecardKeys = {
  all: ['scorecard'] as const,
  view: (params: ScorecardParams) => ['scorecard', params] as const,
  sentBulletins: (districtId: number) => ['scorecard', 'sent-bulletins', districtId] as const,
};

const query = (p: ScorecardParams) => ({
  districtId: p.districtId,
  from: p.from,
  to: p.to,
  source: p.source,
  resamples: p.resamples,
});

export function fetchScorecard(params: ScorecardParams): Promise<ScorecardView> {
  return request<ScorecardView>(withQuery(api.scorecard, query(params)));
}
export function getScorecardQueryOptions(params: ScorecardParams) {
  return queryOptions({ queryKey: scorecardKeys.view(params), queryFn: () => fetchScorecard(params) });
}
export function useScorecard(params: ScorecardParams | null) {
  return useQuery({
    ...getScorecardQueryOptions(params ?? ({ districtId: 0 } as ScorecardParams)),
    enabled: params !== null,
    // The last scorecard stays on screen while the next one is scored.
    placeholderData: keepPreviousData,
  });
}

/**
 * The district's sent bulletins, to propose a season that holds them. Read here rather than through
 * the bulletins feature, so that features stay independent.
 */
export function fetchSentBulletins(districtId: number): Promise<BulletinSummaryView[]> {
  return request<BulletinSummaryView[]>(withQuery(api.bulletins, { districtId, state: 'sent' }));
}
export function getSentBulletinsQueryOptions(districtId: number) {
  return queryOptions({
    queryKey: scorecardKeys.sentBulletins(districtId),
    queryFn: () => fetchSentBulletins(districtId),
  });
}
export function useSentBulletins(districtId: number | null) {
  return useQuery({ ...getSentBulletinsQueryOptions(districtId ?? 0), enabled: districtId !== null });
}

/** Saves the season's pairs (CSV) or its report (PDF), fetched with the session. */
export async function downloadScorecard(params: ScorecardParams, format: 'csv' | 'pdf', filename: string) {
  const path = format === 'csv' ? api.scorecardCsv : api.scorecardPdf;
  saveBlob(await requestBlob(withQuery(path, query(params))), filename);
}
