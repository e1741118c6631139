import type {
  BulletinDeliveryView,
  BulletinDiffView,
  BulletinListQuery,
  BulletinSummaryView,
  BulletinTextDiff,
  BulletinVersionView,
  BulletinView,
  CreateBulletinRequest,
  FieldReportView,
  SaveBulletinRequest,
} from '@stormhour/shared';
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, type BulletinAction, type BulletinExportFormat } from '../../config/paths';
import { request, requestBlob, requestText, saveBlob } from '../../lib/api';
import { withQuery } from '../../lib/queryString';

export const bulletinKeys = {
  all: ['bulletins'] as const,
  list: (query: BulletinListQuery) => ['bulletins', 'list', query] as const,
  bulletin: (id: number) => ['bulletins', id] as const,
  version: (id: number, version: number) => ['bulletins', id, 'version', version] as const,
  diff: (id: number, version: number) => ['bulletins', id, 'diff', version] as const,
  compare: (id: number, from: number, to: number) => ['bulletins', id, 'compare', from, to] as const,
  reports: (id: number) => ['bulletins', id, 'reports'] as const,
  delivery: (id: number) => ['bulletins', id, 'delivery'] as const,
};

export function fetchBulletins(query: BulletinListQuery): Promise<BulletinSummaryView[]> {
  return request<BulletinSummaryView[]>(withQuery(api.bulletins, { ...query }));
}
export function getBulletinsQueryOptions(query: BulletinListQuery = {}) {
  return queryOptions({ queryKey: bulletinKeys.list(query), queryFn: () => fetchBulletins(query) });
}
export function useBulletins(query: BulletinListQuery = {}) {
  return useQuery(getBulletinsQueryOptions(query));
}

export function fetchBulletin(id: number): Promise<BulletinView> {
  return request<BulletinView>(api.bulletin(id));
}
export function getBulletinQueryOptions(id: number) {
  return queryOptions({ queryKey: bulletinKeys.bulletin(id), queryFn: () => fetchBulletin(id) });
}
export function useBulletin(id: number) {
  return useQuery(getBulletinQueryOptions(id));
}

export function fetchBulletinVersion(id: number, version: number): Promise<BulletinVersionView> {
  return request<BulletinVersionView>(api.bulletinVersion(id, version));
}
export function getBulletinVersionQueryOptions(id: number, version: number) {
  return queryOptions({
    queryKey: bulletinKeys.version(id, version),
    queryFn: () => fetchBulletinVersion(id, version),
    // A saved version never changes.
    staleTime: Number.POSITIVE_INFINITY,
  });
}
export function useBulletinVersion(id: number, version: number | null) {
  return useQuery({ ...getBulletinVersionQueryOptions(id, version ?? 0), enabled: version !== null });
}

/** The shown version (the approved one once approved) against the one before and the last sent bulletin. */
export function fetchBulletinDiff(id: number): Promise<BulletinDiffView> {
  return request<BulletinDiffView>(api.bulletinDiff(id));
}
/** `version` is the version shown now: part of the key, so a new version brings a new comparison. */
export function getBulletinDiffQueryOptions(id: number, version: number) {
  return queryOptions({ queryKey: bulletinKeys.diff(id, version), queryFn: () => fetchBulletinDiff(id) });
}
export function useBulletinDiff(id: number, version: number) {
  return useQuery(getBulletinDiffQueryOptions(id, version));
}

/** Two saved versions of one bulletin: what changed from version `from` to version `to`. */
export function fetchBulletinCompare(id: number, from: number, to: number): Promise<BulletinTextDiff> {
  return request<BulletinTextDiff>(withQuery(api.bulletinCompare(id), { from, to }));
}
export function getBulletinCompareQueryOptions(id: number, from: number, to: number) {
  // Saved versions never change, so neither does their comparison.
  return queryOptions({
    queryKey: bulletinKeys.compare(id, from, to),
    queryFn: () => fetchBulletinCompare(id, from, to),
    staleTime: Number.POSITIVE_INFINITY,
  });
}
/** Null versions (none chosen yet) fetch nothing. */
export function useBulletinCompare(id: number, from: number | null, to: number | null) {
  return useQuery({
    ...getBulletinCompareQueryOptions(id, from ?? 0, to ?? 0),
    enabled: from !== null && to !== null,
  });
}

/** The officers' field reports on a bulletin, for the unit's staff. */
export function fetchBulletinReports(id: number): Promise<FieldReportView[]> {
  return request<FieldReportView[]>(api.bulletinReports(id));
}
export function getBulletinReportsQueryOptions(id: number) {
  return queryOptions({ queryKey: bulletinKeys.reports(id), queryFn: () => fetchBulletinReports(id) });
}
export function useBulletinReports(id: number, enabled: boolean) {
  return useQuery({ ...getBulletinReportsQueryOptions(id), enabled });
}

export function fetchBulletinDelivery(id: number): Promise<BulletinDeliveryView> {
  return request<BulletinDeliveryView>(api.bulletinDelivery(id));
}
export function getBulletinDeliveryQueryOptions(id: number) {
  return queryOptions({
    queryKey: bulletinKeys.delivery(id),
    queryFn: () => fetchBulletinDelivery(id),
    // The outbox sends in the background: follow it while anything is still queued or sending.
    refetchInterval: (query) => {
      const counts = query.state.data?.counts;
      return !counts || counts.queued + counts.sending > 0 ? 3_000 : false;
    },
  });
}
export function useBulletinDelivery(id: number, enabled: boolean) {
  return useQuery({ ...getBulletinDeliveryQueryOptions(id), enabled });
}

export function createBulletin(body: CreateBulletinRequest): Promise<BulletinView> {
  return request<BulletinView>(api.bulletins, { method: 'POST', body });
}
export function useCreateBulletin() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBulletin,
    onSuccess: (created) => {
      queryClient.setQueryData(bulletinKeys.bulletin(created.id), created);
      return queryClient.invalidateQueries({ queryKey: ['bulletins', 'list'] });
    },
  });
}

export function saveBulletin(id: number, body: SaveBulletinRequest): Promise<BulletinView> {
  return request<BulletinView>(api.bulletin(id), { method: 'PUT', body });
}

/** Saves, or takes a review step; either way the page shows the bulletin the server answers with. */
export function useBulletinMutation(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (
      step:
        | { kind: 'save'; body: SaveBulletinRequest }
        | { kind: BulletinAction; body: { comment?: string; reason?: string } },
    ) =>
      step.kind === 'save'
        ? saveBulletin(id, step.body)
        : request<BulletinView>(api.bulletinAction(id, step.kind), { method: 'POST', body: step.body }),
    onSuccess: (bulletin) => {
      queryClient.setQueryData(bulletinKeys.bulletin(id), bulletin);
      return queryClient.invalidateQueries({
        predicate: (q) => q.queryKey[0] === 'bulletins' && !(q.queryKey[1] === id && q.queryKey.length === 2),
      });
    },
  });
}

// The same names the server gives in Content-Disposition.
const EXPORT_NAMES: Record<BulletinExportFormat, (number: string) => string> = {
  pdf: (n) => `${n.toLowerCase()}.pdf`,
  cap: (n) => `${n.toLowerCase()}.cap.xml`,
  text: (n) => `${n.toLowerCase()}.txt`,
  sms: (n) => `${n.toLowerCase()}-sms.txt`,
};

export async function downloadBulletin(id: number, number: string, format: BulletinExportFormat) {
  saveBlob(await requestBlob(api.bulletinExport(id, format)), EXPORT_NAMES[format](number));
}

export function fetchBulletinText(id: number, format: 'text' | 'sms'): Promise<string> {
  return requestText(api.bulletinExport(id, format));
}
