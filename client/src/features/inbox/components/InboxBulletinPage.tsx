import { Button, InlineNotification, Link, Loading } from '@carbon/react';
import { useState } from 'react';
import { Link as RouterLink, useParams } from 'react-router';
import { BulletinView } from '../../../components/bulletin/BulletinView';
import { FieldReportsTable } from '../../../components/bulletin/FieldReportsTable';
import { LoadError } from '../../../components/LoadError';
import { PageSection } from '../../../components/PageSection';
import { paths } from '../../../config/paths';
import { messageOf } from '../../../lib/apiError';
import { formatDateTime } from '../../../lib/format';
import { useAcknowledgeBulletin, useFieldReports, useInboxBulletin } from '../api';
import { FieldReportForm } from './FieldReportForm';

/** One bulletin as the officer received it, with acknowledgement and field reports. */
export default function InboxBulletinPage() {
  const id = Number(useParams().bulletinId);
  const bulletin = useInboxBulletin(id);
  const acknowledge = useAcknowledgeBulletin(id);
  const reports = useFieldReports(id);
  const [filed, setFiled] = useState<string | null>(null);

  if (bulletin.isError)
    return <LoadError what="the bulletin" error={bulletin.error} onRetry={() => bulletin.refetch()} />;
  const b = bulletin.data;
  if (!b) return <Loading withOverlay={false} description="Loading the bulletin" />;

  return (
    <>
      <p>
        <Link as={RouterLink} to={paths.inbox.list}>
          All bulletins
        </Link>
      </p>
      {b.state === 'withdrawn' ? (
        <InlineNotification
          kind="error"
          lowContrast
          hideCloseButton
          title={`Withdrawn ${formatDateTime(b.withdrawnAt)}. Do not act on this bulletin.`}
          subtitle={b.withdrawalReason ?? ''}
        />
      ) : null}
      <div className="acknowledge-bar">
        {b.acknowledgedAt ? (
          <p role="status">Acknowledged {formatDateTime(b.acknowledgedAt)}.</p>
        ) : (
          <>
            <Button size="sm" disabled={acknowledge.isPending} onClick={() => acknowledge.mutate()}>
              Acknowledge
            </Button>
            <span className="cds--label-description">
              Tells the unit you have read it{b.readAt ? `; opened ${formatDateTime(b.readAt)}` : ''}.
            </span>
          </>
        )}
      </div>
      {acknowledge.isError ? (
        <InlineNotification
          kind="error"
          lowContrast
          title="Not acknowledged."
          subtitle={messageOf(acknowledge.error)}
          onCloseButtonClick={() => acknowledge.reset()}
        />
      ) : null}
      <BulletinView content={b.content} />
      <PageSection title="Field reports" region="the field reports">
        <p className="cds--label-description section-intro">
          Report per block what you saw during the week, storm or no storm: the reports score the chances that
          were issued.
        </p>
        {reports.isError ? (
          <LoadError what="the field reports" error={reports.error} onRetry={() => reports.refetch()} />
        ) : (
          <FieldReportsTable reports={reports.data ?? []} loading={reports.isLoading} />
        )}
        <h3 className="bulletin-view__heading">New report</h3>
        {filed ? (
          <InlineNotification
            kind="success"
            lowContrast
            role="status"
            title={`Report for ${filed} filed.`}
            onCloseButtonClick={() => setFiled(null)}
          />
        ) : null}
        <FieldReportForm bulletin={b} onFiled={setFiled} />
      </PageSection>
    </>
  );
}
