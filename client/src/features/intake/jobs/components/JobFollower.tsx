import { InlineLoading, Link } from '@carbon/react';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { Link as RouterLink } from 'react-router';
import { LoadError } from '../../../../components/LoadError';
import { paths } from '../../../../config/paths';
import { isActive, jobKeys, useJob } from '../api';
import { JobProgressBar } from './JobProgressBar';

/** Follows a job just started: polls it every second and, once it ends, points to its report. */
export function JobFollower({ jobId }: { jobId: number }) {
  const job = useJob(jobId);
  const queryClient = useQueryClient();
  const finished = job.data !== undefined && !isActive(job.data);

  useEffect(() => {
    if (!finished) return;
    // A finished job changes the jobs list and may have made new tracks.
    void queryClient.invalidateQueries({ queryKey: jobKeys.list });
    void queryClient.invalidateQueries({ queryKey: ['tracks'] });
  }, [finished, queryClient]);

  if (job.isPending) return <InlineLoading description="Asking for the job’s progress" />;
  if (job.isError) return <LoadError what="the job’s progress" error={job.error} onRetry={job.refetch} />;
  return (
    <div className="form-stack" aria-live="polite">
      <JobProgressBar job={job.data} />
      <Link as={RouterLink} to={paths.intake.job(jobId)}>
        {finished ? `Open the quality report of job ${jobId}` : `Open job ${jobId}`}
      </Link>
    </div>
  );
}
