import type { Page, TrackDetail, TrackView } from '@stormhour/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../config/paths';
import { request } from '../../../lib/api';
import { withQuery } from '../../../lib/queryString';
import type { TracksParams } from './tracksSearch';

export const trackKeys = {
  list: (query: TracksParams) => ['tracks', 'list', query] as const,
  one: (id: number) => ['tracks', 'one', id] as const,
};

export function fetchTracks(query: TracksParams): Promise<Page<TrackView>> {
  return request<Page<TrackView>>(withQuery(api.tracks, { ...query }));
}
export function getTracksParamsOptions(query: TracksParams) {
  return queryOptions({
    queryKey: trackKeys.list(query),
    queryFn: () => fetchTracks(query),
    // Keep the current page on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });
}
export function useTracks(query: TracksParams | null) {
  return useQuery({
    ...getTracksParamsOptions(query ?? { siteId: 0, sort: 'firstTime', order: 'asc', offset: 0, limit: 1 }),
    enabled: query !== null,
  });
}

export function fetchTrack(id: number): Promise<TrackDetail> {
  return request<TrackDetail>(api.track(id));
}
export function getTrackQueryOptions(id: number) {
  return queryOptions({ queryKey: trackKeys.one(id), queryFn: () => fetchTrack(id) });
}
export function useTrack(id: number) {
  return useQuery(getTrackQueryOptions(id));
}
