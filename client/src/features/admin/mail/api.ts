import type {
  MailMessageSummary,
  MailMessageView,
  MailSettingsView,
  OutboxEntry,
  OutboxState,
  Page,
} from '@stormhour/shared';
import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../config/paths';
import { request, requestBlob, saveBlob } from '../../../lib/api';
import { withQuery } from '../../../lib/queryString';

export function fetchMailSettings(): Promise<MailSettingsView> {
  return request<MailSettingsView>(api.mailSettings);
}
export function getMailSettingsQueryOptions() {
  return queryOptions({ queryKey: ['mail', 'settings'] as const, queryFn: fetchMailSettings });
}
export function useMailSettings() {
  return useQuery(getMailSettingsQueryOptions());
}

export interface OutboxParams {
  offset: number;
  limit: number;
  state?: OutboxState;
}
export function fetchOutbox(params: OutboxParams): Promise<Page<OutboxEntry>> {
  return request<Page<OutboxEntry>>(withQuery(api.mailOutbox, { ...params }));
}
export function getOutboxQueryOptions(params: OutboxParams) {
  return queryOptions({
    queryKey: ['mail', 'outbox', params] as const,
    queryFn: () => fetchOutbox(params),
    placeholderData: keepPreviousData,
    // The sender works in the background: keep the states current while the page is open.
    refetchInterval: 5_000,
  });
}
export function useOutbox(params: OutboxParams) {
  return useQuery(getOutboxQueryOptions(params));
}

export interface MailMessagesParams {
  offset: number;
  limit: number;
  q?: string;
}
export function fetchMailMessages(params: MailMessagesParams): Promise<Page<MailMessageSummary>> {
  return request<Page<MailMessageSummary>>(withQuery(api.mailMessages, { ...params }));
}
export function getMailMessagesQueryOptions(params: MailMessagesParams) {
  return queryOptions({
    queryKey: ['mail', 'messages', params] as const,
    queryFn: () => fetchMailMessages(params),
    placeholderData: keepPreviousData,
    refetchInterval: 5_000,
  });
}
export function useMailMessages(params: MailMessagesParams) {
  return useQuery(getMailMessagesQueryOptions(params));
}

export function fetchMailMessage(id: number): Promise<MailMessageView> {
  return request<MailMessageView>(api.mailMessage(id));
}
export function getMailMessageQueryOptions(id: number) {
  return queryOptions({ queryKey: ['mail', 'message', id] as const, queryFn: () => fetchMailMessage(id) });
}
export function useMailMessage(id: number) {
  return useQuery(getMailMessageQueryOptions(id));
}

export function retryOutbox(id: number): Promise<OutboxEntry> {
  return request<OutboxEntry>(api.mailOutboxRetry(id), { method: 'POST' });
}
export function useRetryOutbox() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: retryOutbox,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['mail'] }),
  });
}

export function sendTestMail(): Promise<OutboxEntry> {
  return request<OutboxEntry>(api.mailTest, { method: 'POST' });
}
export function useSendTestMail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: sendTestMail,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['mail'] }),
  });
}

export async function downloadAttachment(messageId: number, index: number, filename: string): Promise<void> {
  saveBlob(await requestBlob(api.mailAttachment(messageId, index)), filename);
}
export async function downloadSource(messageId: number): Promise<void> {
  saveBlob(await requestBlob(api.mailMessageSource(messageId)), `message-${messageId}.eml`);
}
