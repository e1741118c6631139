import type { CellType, TracksQuery } from '@stormhour/shared';
import { localDayEndIso, localDayStartIso } from '../siteTime';

export type TrackSort = NonNullable<TracksQuery['sort']>;
export type SortOrder = 'asc' | 'desc';

/**
 * GET /api/tracks parameters as the client sends them. Shared's TracksQuery input type reads its
 * coerced numbers as `unknown`, so the client names the types it sends.
 */
export interface TracksParams {
  siteId: number;
  from?: string;
  to?: string;
  blockId?: number;
  onsetOnly?: 'true';
  type?: CellType;
  minDurationMin?: number;
  sort: TrackSort;
  order: SortOrder;
  offset: number;
  limit: number;
}

export const PAGE_SIZES = [25, 50, 100] as const;

/** The tracks page keeps its filters in the address, so a link or Back restores the same view. */
export interface TracksView {
  siteId: number | null;
  blockId: number | null;
  type: CellType | null;
  onsetOnly: boolean;
  minDurationMin: number | null;
  /** Local days "YYYY-MM-DD" at the site, both inclusive. */
  fromDay: string | null;
  toDay: string | null;
  sort: TrackSort;
  order: SortOrder;
  page: number;
  pageSize: number;
}

const SORTS: TrackSort[] = ['firstTime', 'durationMin', 'maxVolumeKm3', 'maxEchoTopKm', 'speedMs'];
const TYPES: CellType[] = ['shallow', 'congestus', 'deep'];

function positiveInt(text: string | null): number | null {
  const n = Number(text);
  return text !== null && Number.isInteger(n) && n > 0 ? n : null;
}

function day(text: string | null): string | null {
  return text && /^\d{4}-\d{2}-\d{2}$/.test(text) ? text : null;
}

export function viewFromSearch(search: URLSearchParams): TracksView {
  const minDuration = Number(search.get('minDurationMin'));
  const pageSize = positiveInt(search.get('pageSize'));
  return {
    siteId: positiveInt(search.get('siteId')),
    blockId: positiveInt(search.get('blockId')),
    type: TYPES.find((t) => t === search.get('type')) ?? null,
    onsetOnly: search.get('onsetOnly') === 'true',
    minDurationMin: search.has('minDurationMin') && minDuration >= 0 ? minDuration : null,
    fromDay: day(search.get('from')),
    toDay: day(search.get('to')),
    sort: SORTS.find((s) => s === search.get('sort')) ?? 'firstTime',
    order: search.get('order') === 'desc' ? 'desc' : 'asc',
    page: positiveInt(search.get('page')) ?? 1,
    pageSize: PAGE_SIZES.find((s) => s === pageSize) ?? PAGE_SIZES[1],
  };
}

/** The address form of a view; defaults are left out to keep links short. */
export function searchFromView(view: TracksView): URLSearchParams {
  const search = new URLSearchParams();
  const put = (key: string, value: string | number | null, skip?: string | number) => {
    if (value !== null && value !== skip) search.set(key, String(value));
  };
  put('siteId', view.siteId);
  put('blockId', view.blockId);
  put('type', view.type);
  if (view.onsetOnly) search.set('onsetOnly', 'true');
  put('minDurationMin', view.minDurationMin);
  put('from', view.fromDay);
  put('to', view.toDay);
  put('sort', view.sort, 'firstTime');
  put('order', view.order, 'asc');
  put('page', view.page, 1);
  put('pageSize', view.pageSize, PAGE_SIZES[1]);
  return search;
}

/** GET /api/tracks parameters for a view; the local days become UTC instants at the site's offset. */
export function tracksQuery(view: TracksView & { siteId: number }, offsetMinutes: number): TracksParams {
  return {
    siteId: view.siteId,
    ...(view.blockId ? { blockId: view.blockId } : {}),
    ...(view.type ? { type: view.type } : {}),
    ...(view.onsetOnly ? { onsetOnly: 'true' as const } : {}),
    ...(view.minDurationMin !== null ? { minDurationMin: view.minDurationMin } : {}),
    ...(view.fromDay ? { from: localDayStartIso(view.fromDay, offsetMinutes) } : {}),
    ...(view.toDay ? { to: localDayEndIso(view.toDay, offsetMinutes) } : {}),
    sort: view.sort,
    order: view.order,
    offset: (view.page - 1) * view.pageSize,
    limit: view.pageSize,
  };
}

/** A click on a column header: the same column flips its order; another starts ascending. */
export function nextSort(view: TracksView, column: TrackSort): Pick<TracksView, 'sort' | 'order' | 'page'> {
  if (view.sort === column) return { sort: column, order: view.order === 'asc' ? 'desc' : 'asc', page: 1 };
  return { sort: column, order: 'asc', page: 1 };
}
