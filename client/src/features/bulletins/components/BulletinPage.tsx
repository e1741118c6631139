import {
  InlineNotification,
  Link,
  Loading,
  Tab,
  TabList,
  TabPanel,
  TabPanels,
  Tabs,
  Tag,
} from '@carbon/react';
import { BULLETIN_STATE_LABELS, type BulletinView } from '@stormhour/shared';
import { useState } from 'react';
import { Link as RouterLink, useParams } from 'react-router';
import { BulletinView as BulletinDocument } from '../../../components/bulletin/BulletinView';
import { FieldReportsTable } from '../../../components/bulletin/FieldReportsTable';
import { LoadError } from '../../../components/LoadError';
import { PageSection } from '../../../components/PageSection';
import { RegionBoundary } from '../../../components/RegionBoundary';
import { paths } from '../../../config/paths';
import { ApiError } from '../../../lib/apiError';
import { useSessionUser } from '../../../lib/auth';
import { useBulletin, useBulletinMutation, useBulletinReports } from '../api';
import {
  type BulletinForm,
  checkBulletinForm,
  formFromBulletin,
  previewContent,
  sameForm,
} from '../bulletinForm';
import { STATE_TAG, weekLabel } from '../bulletinWords';
import { BulletinEditor } from './BulletinEditor';
import { DeliveryPanel } from './DeliveryPanel';
import { ExportsPanel } from './ExportsPanel';
import { ReviewActions } from './ReviewActions';
import { Timeline } from './Timeline';
import { VersionsPanel } from './VersionsPanel';
import { WarningsPanel } from './WarningsPanel';

/** One bulletin: its text and preview, warnings, review steps, versions, history, delivery and exports. */
export default function BulletinPage() {
  const id = Number(useParams().bulletinId);
  const bulletin = useBulletin(id);
  // Kept here: a save brings a new version, which starts the workspace afresh, and its notice must stay.
  const [notice, setNotice] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  if (bulletin.isError)
    return <LoadError what="the bulletin" error={bulletin.error} onRetry={() => bulletin.refetch()} />;
  if (!bulletin.data) return <Loading withOverlay={false} description="Loading the bulletin" />;
  // A new saved version starts the form afresh from what the server stored.
  return (
    <Workspace
      key={bulletin.data.currentVersion}
      bulletin={bulletin.data}
      notice={notice}
      setNotice={setNotice}
      saved={saved}
      setSaved={setSaved}
    />
  );
}

function Workspace({
  bulletin,
  notice,
  setNotice,
  saved,
  setSaved,
}: {
  bulletin: BulletinView;
  /** What the last review step did, shown at the top beside the steps. */
  notice: string | null;
  setNotice: (notice: string | null) => void;
  /** What the last save did, shown beside the save button where the writer is looking. */
  saved: string | null;
  setSaved: (saved: string | null) => void;
}) {
  const [form, setForm] = useState<BulletinForm>(() => formFromBulletin(bulletin));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const save = useBulletinMutation(bulletin.id);
  const dirty = bulletin.can.edit && !sameForm(form, formFromBulletin(bulletin));
  const lastReturn = [...bulletin.events].reverse().find((e) => e.transition === 'return');
  const sentOrAfter = bulletin.state === 'sent' || bulletin.state === 'withdrawn';
  // The server gives the officers' reports to scientists and administrators, who score the chances.
  const canSeeReports = useSessionUser().role !== 'writer';

  async function submitSave() {
    const checked = checkBulletinForm(form, bulletin.currentVersion);
    if (!checked.ok) {
      setErrors(checked.errors);
      return;
    }
    setErrors({});
    // Awaited rather than a per-call callback: the saved version re-keys this workspace, and a callback
    // of an unmounted component never runs.
    try {
      setSaved(null);
      const next = await save.mutateAsync({ kind: 'save', body: checked.body });
      setSaved(`Saved as version ${next.currentVersion}.`);
    } catch (error) {
      if (error instanceof ApiError) setErrors(error.fieldErrors);
    }
  }

  return (
    <>
      <p>
        <Link as={RouterLink} to={paths.bulletins.list}>
          All bulletins
        </Link>
      </p>
      <header className="bulletin-head">
        <h2 className="section-title">
          {bulletin.number}: {bulletin.districtName}
        </h2>
        <Tag type={STATE_TAG[bulletin.state]}>{BULLETIN_STATE_LABELS[bulletin.state]}</Tag>
        <p className="cds--label-description">
          {weekLabel(bulletin.weekStart)}. Written by {bulletin.authorEmail}; version{' '}
          {bulletin.currentVersion}
          {bulletin.approvedVersion ? `, approved version ${bulletin.approvedVersion}` : ''}.
        </p>
      </header>

      {notice ? (
        <InlineNotification
          kind="success"
          lowContrast
          role="status"
          title={notice}
          onCloseButtonClick={() => setNotice(null)}
        />
      ) : null}
      {bulletin.state === 'returned' && lastReturn?.comment ? (
        <InlineNotification
          kind="info"
          lowContrast
          hideCloseButton
          title={`Returned by ${lastReturn.actor}:`}
          subtitle={lastReturn.comment}
        />
      ) : null}
      {bulletin.outlookChangedSinceDraft ? (
        <InlineNotification
          kind="warning"
          lowContrast
          hideCloseButton
          title="The outlook’s data changed since this draft was made."
          subtitle="Its numbers are those of the draft. Draft the week again if the new data should count."
        />
      ) : null}

      <RegionBoundary region="the review steps">
        <ReviewActions bulletin={bulletin} unsaved={dirty} onDone={setNotice} />
      </RegionBoundary>

      <div className={bulletin.can.edit ? 'bulletin-workspace' : undefined}>
        {bulletin.can.edit ? (
          <PageSection title="Text" region="the bulletin editor">
            <BulletinEditor
              bulletin={bulletin}
              form={form}
              onChange={setForm}
              errors={errors}
              saving={save.isPending}
              saveError={save.error}
              dirty={dirty}
              savedMessage={dirty ? null : saved}
              onSave={submitSave}
              onReset={() => {
                setForm(formFromBulletin(bulletin));
                setErrors({});
              }}
            />
          </PageSection>
        ) : null}
        <PageSection
          title={bulletin.can.edit ? 'Preview as officers will see it' : 'The bulletin'}
          region="the preview"
        >
          <WarningsPanel warnings={bulletin.warnings} />
          {dirty ? <p className="cds--label-description">Warnings are checked again when you save.</p> : null}
          <BulletinDocument content={previewContent(bulletin.content, form)} />
        </PageSection>
      </div>

      <Tabs defaultSelectedIndex={sentOrAfter ? 2 : 0}>
        <TabList aria-label="Bulletin details" className="bulletin-tabs">
          <Tab>History</Tab>
          <Tab>Versions and changes</Tab>
          <Tab disabled={!sentOrAfter}>Delivery</Tab>
          <Tab>Downloads</Tab>
          {canSeeReports ? <Tab disabled={!sentOrAfter}>Field reports</Tab> : null}
        </TabList>
        <TabPanels>
          <TabPanel>
            <RegionBoundary region="the history">
              <Timeline events={bulletin.events} />
            </RegionBoundary>
          </TabPanel>
          <TabPanel>
            <RegionBoundary region="the versions">
              <VersionsPanel bulletin={bulletin} />
            </RegionBoundary>
          </TabPanel>
          <TabPanel>
            <RegionBoundary region="the delivery">
              {sentOrAfter ? <DeliveryPanel bulletinId={bulletin.id} /> : <p>Not sent yet.</p>}
            </RegionBoundary>
          </TabPanel>
          <TabPanel>
            <RegionBoundary region="the downloads">
              <ExportsPanel bulletin={bulletin} />
            </RegionBoundary>
          </TabPanel>
          {canSeeReports ? (
            <TabPanel>
              <RegionBoundary region="the field reports">
                <StaffReports bulletinId={bulletin.id} enabled={sentOrAfter} />
              </RegionBoundary>
            </TabPanel>
          ) : null}
        </TabPanels>
      </Tabs>
    </>
  );
}

function StaffReports({ bulletinId, enabled }: { bulletinId: number; enabled: boolean }) {
  const reports = useBulletinReports(bulletinId, enabled);
  if (reports.isError)
    return <LoadError what="the field reports" error={reports.error} onRetry={() => reports.refetch()} />;
  return <FieldReportsTable reports={reports.data ?? []} loading={reports.isLoading} withOfficer />;
}
