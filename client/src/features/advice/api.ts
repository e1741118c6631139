import type {
  AdviceRuleRequest,
  AdviceRuleView,
  CropCalendarImportResult,
  CropCalendarRequest,
  CropCalendarView,
} from '@stormhour/shared';
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../config/paths';
import { request, uploadFile } from '../../lib/api';

export const adviceKeys = {
  calendars: ['crop-calendar'] as const,
  calendar: (districtId: number) => ['crop-calendar', districtId] as const,
  rules: ['advice-rules'] as const,
};

export function fetchCropCalendar(districtId: number): Promise<CropCalendarView> {
  return request<CropCalendarView>(api.cropCalendar(districtId));
}
export function getCropCalendarQueryOptions(districtId: number | null) {
  return queryOptions({
    queryKey: adviceKeys.calendar(districtId ?? 0),
    queryFn: () => fetchCropCalendar(districtId as number),
    enabled: districtId !== null,
  });
}
export function useCropCalendar(districtId: number | null) {
  return useQuery(getCropCalendarQueryOptions(districtId));
}

export function saveCropCalendar(districtId: number, body: CropCalendarRequest): Promise<CropCalendarView> {
  return request<CropCalendarView>(api.cropCalendar(districtId), { method: 'PUT', body });
}
export function useSaveCropCalendar(districtId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CropCalendarRequest) => saveCropCalendar(districtId, body),
    onSuccess: (saved) => queryClient.setQueryData(adviceKeys.calendar(districtId), saved),
  });
}

export function importCropCalendars(
  file: File,
  onProgress: (fraction: number) => void,
): Promise<CropCalendarImportResult> {
  return uploadFile<CropCalendarImportResult>(api.cropCalendarsImport, file, onProgress);
}
export function useImportCropCalendars(onProgress: (fraction: number) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => importCropCalendars(file, onProgress),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: adviceKeys.calendars }),
  });
}

export function fetchAdviceRules(): Promise<AdviceRuleView[]> {
  return request<AdviceRuleView[]>(api.adviceRules);
}
export function getAdviceRulesQueryOptions() {
  return queryOptions({ queryKey: adviceKeys.rules, queryFn: fetchAdviceRules });
}
export function useAdviceRules() {
  return useQuery(getAdviceRulesQueryOptions());
}

/** Creates a rule (no id) or replaces one. */
export function saveAdviceRule(id: number | null, body: AdviceRuleRequest): Promise<AdviceRuleView> {
  return id === null
    ? request<AdviceRuleView>(api.adviceRules, { method: 'POST', body })
    : request<AdviceRuleView>(api.adviceRule(id), { method: 'PUT', body });
}
export function useSaveAdviceRule() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: number | null; body: AdviceRuleRequest }) => saveAdviceRule(id, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: adviceKeys.rules }),
  });
}
