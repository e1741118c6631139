import type { JobView } from '@stormhour/shared';
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../config/paths';
import { request, uploadForm } from '../../../lib/api';
import { withQuery } from '../../../lib/queryString';

export const jobKeys = {
  all: ['jobs'] as const,
  list: ['jobs', 'list'] as const,
  one: (id: number) => ['jobs', 'one', id] as const,
};

/** A job still working; its figures change, so it is asked again. */
export function isActive(job: Pick<JobView, 'state'>): boolean {
  return job.state === 'queued' || job.state === 'running';
}

export function fetchJobs(): Promise<JobView[]> {
  return request<JobView[]>(withQuery(api.jobs, { limit: 50 }));
}
export function getJobsQueryOptions() {
  return queryOptions({
    queryKey: jobKeys.list,
    queryFn: fetchJobs,
    // The list follows running jobs less often than the job's own page does.
    refetchInterval: (query) => (query.state.data?.some(isActive) ? 5_000 : false),
  });
}
export function useJobs() {
  return useQuery(getJobsQueryOptions());
}

export function fetchJob(id: number): Promise<JobView> {
  return request<JobView>(api.job(id));
}
export function getJobQueryOptions(id: number) {
  return queryOptions({
    queryKey: jobKeys.one(id),
    queryFn: () => fetchJob(id),
    staleTime: 0,
    // Every second while it works, as the stage text and progress move; then never again.
    refetchInterval: (query) => (query.state.data && !isActive(query.state.data) ? false : 1_000),
  });
}
export function useJob(id: number | null) {
  return useQuery({ ...getJobQueryOptions(id ?? 0), enabled: id !== null });
}

export function startIntake(form: FormData, onProgress: (fraction: number) => void): Promise<JobView> {
  return uploadForm<JobView>(api.intake, form, onProgress);
}
export function useStartIntake(onProgress: (fraction: number) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (form: FormData) => startIntake(form, onProgress),
    onSuccess: (job) => {
      queryClient.setQueryData(jobKeys.one(job.id), job);
      return queryClient.invalidateQueries({ queryKey: jobKeys.list });
    },
  });
}
