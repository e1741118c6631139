import { InlineNotification, ProgressBar } from '@carbon/react';
import type { JobView } from '@stormhour/shared';

/** The job's own progress: its stage in words and how far it is, or how it ended. */
export function JobProgressBar({ job }: { job: JobView }) {
  const status = job.state === 'done' ? 'finished' : job.state === 'failed' ? 'error' : 'active';
  const helper =
    job.state === 'queued'
      ? 'Waiting for a free worker'
      : job.state === 'done'
        ? 'Done'
        : job.state === 'failed'
          ? 'Stopped'
          : (job.stage ?? 'Working');
  return (
    <div className="form-stack">
      <ProgressBar
        label={`Job ${job.id}: ${job.state === 'running' && job.stage ? job.stage : 'processing'}`}
        value={Math.round(job.progress * 100)}
        max={100}
        status={status}
        helperText={`${helper} — ${Math.round(job.progress * 100)} %`}
      />
      {job.state === 'failed' ? (
        <InlineNotification
          kind="error"
          lowContrast
          hideCloseButton
          title="The job failed; nothing of it was stored."
          subtitle={job.error ?? 'See the problems below.'}
        />
      ) : null}
    </div>
  );
}
