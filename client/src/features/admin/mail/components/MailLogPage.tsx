import { Button, InlineNotification } from '@carbon/react';
import { PageSection } from '../../../../components/PageSection';
import { messageOf } from '../../../../lib/apiError';
import { useMailSettings, useSendTestMail } from '../api';
import { MessagesTable } from './MessagesTable';
import { OutboxTable } from './OutboxTable';

function MailSettingsLine() {
  const settings = useMailSettings();
  const test = useSendTestMail();
  if (!settings.data) return null;
  const { mode, server, from } = settings.data;
  return (
    <div className="mail-settings">
      <p>
        {mode === 'fake'
          ? `No SMTP server is set (SMTP_URL): mail goes to the local capture server on ${server} and nowhere else. Every message it receives is listed below.`
          : `Mail goes to the SMTP server ${server}. Messages sent there are not listed below; the outbox shows what was handed over.`}{' '}
        Sent as {from}.
      </p>
      <Button kind="tertiary" size="sm" disabled={test.isPending} onClick={() => test.mutate()}>
        Send a test message to myself
      </Button>
      {test.isSuccess ? (
        <InlineNotification
          kind="success"
          lowContrast
          title="Test message queued."
          subtitle={`To ${test.data.recipient}; its state shows in the outbox.`}
          onCloseButtonClick={() => test.reset()}
        />
      ) : null}
      {test.isError ? (
        <InlineNotification
          kind="error"
          lowContrast
          title="Could not queue the test message."
          subtitle={messageOf(test.error)}
          onCloseButtonClick={() => test.reset()}
        />
      ) : null}
    </div>
  );
}

export default function MailLogPage() {
  return (
    <>
      <MailSettingsLine />
      <PageSection title="Outbox" region="the outbox">
        <OutboxTable />
      </PageSection>
      <PageSection title="Received messages" region="the received messages">
        <MessagesTable />
      </PageSection>
    </>
  );
}
