import type { FieldReportRequest, FieldReportView, InboxBulletinView, InboxItem } from '@stormhour/shared';
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../config/paths';
import { request } from '../../lib/api';

export const inboxKeys = {
  all: ['inbox'] as const,
  list: ['inbox', 'list'] as const,
  bulletin: (id: number) => ['inbox', id] as const,
  reports: (id: number) => ['inbox', id, 'reports'] as const,
};

export function fetchInbox(): Promise<InboxItem[]> {
  return request<InboxItem[]>(api.inbox);
}
export function getInboxQueryOptions() {
  return queryOptions({ queryKey: inboxKeys.list, queryFn: fetchInbox });
}
export function useInbox() {
  return useQuery(getInboxQueryOptions());
}

/** Opening a bulletin marks it read on the server. */
export function fetchInboxBulletin(id: number): Promise<InboxBulletinView> {
  return request<InboxBulletinView>(api.inboxBulletin(id));
}
export function getInboxBulletinQueryOptions(id: number) {
  return queryOptions({ queryKey: inboxKeys.bulletin(id), queryFn: () => fetchInboxBulletin(id) });
}
export function useInboxBulletin(id: number) {
  const queryClient = useQueryClient();
  return useQuery({
    ...getInboxBulletinQueryOptions(id),
    queryFn: async () => {
      const bulletin = await fetchInboxBulletin(id);
      // The list's unread mark goes as soon as the bulletin has been opened.
      void queryClient.invalidateQueries({ queryKey: inboxKeys.list });
      return bulletin;
    },
  });
}

export function acknowledgeBulletin(id: number): Promise<InboxBulletinView> {
  return request<InboxBulletinView>(api.inboxAcknowledge(id), { method: 'POST' });
}
export function useAcknowledgeBulletin(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => acknowledgeBulletin(id),
    onSuccess: (bulletin) => {
      queryClient.setQueryData(inboxKeys.bulletin(id), bulletin);
      return queryClient.invalidateQueries({ queryKey: inboxKeys.list });
    },
  });
}

export function fetchFieldReports(id: number): Promise<FieldReportView[]> {
  return request<FieldReportView[]>(api.inboxReports(id));
}
export function getFieldReportsQueryOptions(id: number) {
  return queryOptions({ queryKey: inboxKeys.reports(id), queryFn: () => fetchFieldReports(id) });
}
export function useFieldReports(id: number) {
  return useQuery(getFieldReportsQueryOptions(id));
}

export function fileFieldReport(id: number, body: FieldReportRequest): Promise<FieldReportView> {
  return request<FieldReportView>(api.inboxReports(id), { method: 'POST', body });
}
export function useFileFieldReport(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: FieldReportRequest) => fileFieldReport(id, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: inboxKeys.all }),
  });
}
