import type { AuditEntry, Page } from '@stormhour/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../config/paths';
import { request } from '../../../lib/api';
import { withQuery } from '../../../lib/queryString';

export interface AuditParams {
  offset: number;
  limit: number;
  action?: string;
}

export function fetchAudit(params: AuditParams): Promise<Page<AuditEntry>> {
  return request<Page<AuditEntry>>(withQuery(api.audit, { ...params }));
}
export function getAuditQueryOptions(params: AuditParams) {
  return queryOptions({
    queryKey: ['audit', params] as const,
    queryFn: () => fetchAudit(params),
    // Keep the current page on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });
}
export function useAudit(params: AuditParams) {
  return useQuery(getAuditQueryOptions(params));
}
