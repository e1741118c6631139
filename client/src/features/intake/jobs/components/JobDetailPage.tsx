import { InlineLoading, Link } from '@carbon/react';
import { DEFAULT_SITE_SETTINGS, type IntakeKind } from '@stormhour/shared';
import { Link as RouterLink, useParams } from 'react-router';
import { LoadError } from '../../../../components/LoadError';
import { RegionBoundary } from '../../../../components/RegionBoundary';
import { paths } from '../../../../config/paths';
import { formatDateTime } from '../../../../lib/format';
import { useSites } from '../../sites/api';
import { KIND_LABELS } from '../../uploads/intakeRequest';
import { isActive, useJob } from '../api';
import { jobSiteId } from '../jobSummary';
import { JobFilesTable } from './JobFilesTable';
import { JobProblemsTable } from './JobProblemsTable';
import { JobProgressBar } from './JobProgressBar';
import { JobStateTag } from './JobStateTag';
import { QualityReportView } from './QualityReportView';

function JobDetail({ id }: { id: number }) {
  const job = useJob(id);
  const sites = useSites();
  if (job.isPending) return <InlineLoading description="Loading the job" />;
  if (job.isError) return <LoadError what="the job" error={job.error} onRetry={job.refetch} />;
  const data = job.data;
  const siteId = jobSiteId(data);
  const site = sites.data?.find((s) => s.id === siteId);
  const onError = data.params.onError === 'fail' ? 'Stop the job; store nothing' : 'Skip the file and go on';
  return (
    <>
      <h2 className="section-title">
        Job {data.id}: {KIND_LABELS[data.kind as IntakeKind] ?? data.kind}
      </h2>
      <dl className="job-facts">
        <dt>State</dt>
        <dd>
          <JobStateTag state={data.state} />
        </dd>
        <dt>Site</dt>
        <dd>{site ? `${site.code} — ${site.name}` : siteId === null ? '—' : `#${siteId}`}</dd>
        <dt>On a bad file</dt>
        <dd>{onError}</dd>
        <dt>Created</dt>
        <dd>{formatDateTime(data.createdAt)}</dd>
        <dt>Started</dt>
        <dd>{formatDateTime(data.startedAt)}</dd>
        <dt>Finished</dt>
        <dd>{formatDateTime(data.finishedAt)}</dd>
      </dl>
      {isActive(data) || data.state === 'failed' ? <JobProgressBar job={data} /> : null}

      <h3 className="section-title">Files</h3>
      <JobFilesTable files={data.files} />
      <h3 className="section-title">Problems</h3>
      <JobProblemsTable problems={data.problems} />
      <h3 className="section-title">Quality report</h3>
      {data.report ? (
        <RegionBoundary region="the quality report">
          <QualityReportView
            report={data.report}
            utcOffsetMinutes={site?.utcOffsetMinutes ?? 0}
            minAvailability={site?.settings.minAvailability ?? DEFAULT_SITE_SETTINGS.minAvailability}
          />
        </RegionBoundary>
      ) : data.summary ? (
        <p>{data.summary}</p>
      ) : (
        <p>{isActive(data) ? 'The report appears when the job is done.' : 'This job has no report.'}</p>
      )}
    </>
  );
}

export default function JobDetailPage() {
  const { jobId } = useParams();
  return (
    <>
      <Link as={RouterLink} to={paths.intake.uploads}>
        Back to uploads and jobs
      </Link>
      <JobDetail id={Number(jobId)} />
    </>
  );
}
