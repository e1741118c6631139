import { Button, CopyButton, InlineNotification } from '@carbon/react';
import type { BulletinSummaryView } from '@stormhour/shared';
import { useState } from 'react';
import type { BulletinExportFormat } from '../../../config/paths';
import { messageOf } from '../../../lib/apiError';
import { downloadBulletin, fetchBulletinText } from '../api';

/** Downloads (PDF, CAP 1.2 XML, plain text) and the SMS text to copy, all rendered by the server. */
export function ExportsPanel({ bulletin }: { bulletin: Pick<BulletinSummaryView, 'id' | 'number'> }) {
  const [error, setError] = useState<unknown>(null);
  const [sms, setSms] = useState<string | null>(null);

  async function download(format: BulletinExportFormat) {
    setError(null);
    try {
      await downloadBulletin(bulletin.id, bulletin.number, format);
    } catch (e) {
      setError(e);
    }
  }

  async function showSms() {
    setError(null);
    try {
      setSms(await fetchBulletinText(bulletin.id, 'sms'));
    } catch (e) {
      setError(e);
    }
  }

  return (
    <div className="form-stack">
      <div className="button-row">
        <Button kind="tertiary" size="sm" onClick={() => download('pdf')}>
          Download PDF
        </Button>
        <Button kind="tertiary" size="sm" onClick={() => download('cap')}>
          Download CAP XML
        </Button>
        <Button kind="tertiary" size="sm" onClick={() => download('text')}>
          Download plain text
        </Button>
        <Button kind="tertiary" size="sm" onClick={showSms}>
          Show SMS text
        </Button>
      </div>
      {error ? (
        <InlineNotification
          kind="error"
          lowContrast
          title="Could not fetch the export."
          subtitle={messageOf(error)}
          onCloseButtonClick={() => setError(null)}
        />
      ) : null}
      {sms !== null ? (
        <div className="sms-text">
          <figure aria-label="SMS text">
            <pre>{sms}</pre>
          </figure>
          <CopyButton
            iconDescription="Copy the SMS text"
            feedback="Copied"
            onClick={() => navigator.clipboard?.writeText(sms)}
          />
        </div>
      ) : null}
    </div>
  );
}
