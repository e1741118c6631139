import { InlineLoading, Link } from '@carbon/react';
import type { IntakeKind, JobState, JobView, SiteView } from '@stormhour/shared';
import { Link as RouterLink } from 'react-router';
import { LoadError } from '../../../../components/LoadError';
import { SortableTable } from '../../../../components/SortableTable';
import { paths } from '../../../../config/paths';
import { formatDateTime } from '../../../../lib/format';
import { useSites } from '../../sites/api';
import { KIND_LABELS } from '../../uploads/intakeRequest';
import { useJobs } from '../api';
import { jobSiteId } from '../jobSummary';
import { JobStateTag } from './JobStateTag';

const HEADERS = [
  { key: 'job', header: 'Job' },
  { key: 'kind', header: 'Kind' },
  { key: 'site', header: 'Site' },
  { key: 'files', header: 'Files' },
  { key: 'state', header: 'State' },
  { key: 'progress', header: 'Progress (%)' },
  { key: 'startedAt', header: 'Started' },
  { key: 'finishedAt', header: 'Finished' },
];

function toRow(job: JobView, sites: SiteView[]) {
  const siteId = jobSiteId(job);
  return {
    id: String(job.id),
    job: job.id,
    kind: KIND_LABELS[job.kind as IntakeKind] ?? job.kind,
    site: sites.find((s) => s.id === siteId)?.code ?? (siteId === null ? '—' : `#${siteId}`),
    files: job.files.length,
    state: job.state,
    progress: Math.round(job.progress * 100),
    // ISO text sorts in time order; it is formatted when drawn.
    startedAt: job.startedAt ?? '',
    finishedAt: job.finishedAt ?? '',
  };
}

function cellContent(header: string, value: unknown) {
  if (header === 'job')
    return (
      <Link as={RouterLink} to={paths.intake.job(String(value))}>
        Job {String(value)}
      </Link>
    );
  if (header === 'state') return <JobStateTag state={value as JobState} />;
  if (header === 'startedAt' || header === 'finishedAt') return formatDateTime(String(value) || null);
  return String(value);
}

/** The latest jobs, newest first as the server sends them; every column sorts. */
export function JobsTable() {
  const jobs = useJobs();
  const sites = useSites();
  if (jobs.isPending) return <InlineLoading description="Loading the jobs" />;
  if (jobs.isError) return <LoadError what="the jobs" error={jobs.error} onRetry={jobs.refetch} />;
  return (
    <SortableTable
      rows={jobs.data.map((j) => toRow(j, sites.data ?? []))}
      headers={HEADERS}
      label="Jobs"
      description={`The latest ${jobs.data.length} jobs, newest first`}
      empty="No jobs yet. Upload files above to start one."
      renderCell={cellContent}
    />
  );
}
