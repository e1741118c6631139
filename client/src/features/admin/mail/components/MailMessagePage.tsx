import {
  Button,
  InlineLoading,
  InlineNotification,
  Link,
  Tab,
  TabList,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableHeader,
  TableRow,
  TabPanel,
  TabPanels,
  Tabs,
} from '@carbon/react';
import type { MailMessageView } from '@stormhour/shared';
import { useState } from 'react';
import { Link as RouterLink, useParams } from 'react-router';
import { LoadError } from '../../../../components/LoadError';
import { PageSection } from '../../../../components/PageSection';
import { paths } from '../../../../config/paths';
import { messageOf } from '../../../../lib/apiError';
import { formatDateTime } from '../../../../lib/format';
import { downloadAttachment, downloadSource, useMailMessage } from '../api';
import { formatBytes, framedHtml } from '../mailWords';

function Attachments({ message }: { message: MailMessageView }) {
  const [error, setError] = useState<string | null>(null);
  if (message.attachments.length === 0) return <p>No attachments.</p>;
  return (
    <>
      <Table aria-label="Attachments" size="sm">
        <TableHead>
          <TableRow>
            <TableHeader>File</TableHeader>
            <TableHeader>Type</TableHeader>
            <TableHeader>Size</TableHeader>
            <TableHeader>
              <span className="cds--visually-hidden">Download</span>
            </TableHeader>
          </TableRow>
        </TableHead>
        <TableBody>
          {message.attachments.map((a) => {
            const name = a.filename ?? `attachment-${a.index + 1}`;
            return (
              <TableRow key={a.index}>
                <TableCell>{name}</TableCell>
                <TableCell className="mono">{a.contentType}</TableCell>
                <TableCell>{formatBytes(a.size)}</TableCell>
                <TableCell className="row-actions">
                  <Button
                    kind="ghost"
                    size="sm"
                    aria-label={`Download ${name}`}
                    onClick={() => {
                      setError(null);
                      downloadAttachment(message.id, a.index, name).catch((e: unknown) =>
                        setError(messageOf(e)),
                      );
                    }}
                  >
                    Download
                  </Button>
                </TableCell>
              </TableRow>
            );
          })}
        </TableBody>
      </Table>
      {error ? (
        <InlineNotification
          kind="error"
          lowContrast
          title="Could not download the attachment."
          subtitle={error}
          onCloseButtonClick={() => setError(null)}
        />
      ) : null}
    </>
  );
}

function Bodies({ message }: { message: MailMessageView }) {
  return (
    <Tabs>
      <TabList aria-label="Message body">
        <Tab disabled={!message.html}>HTML</Tab>
        <Tab disabled={!message.text}>Plain text</Tab>
      </TabList>
      <TabPanels>
        <TabPanel>
          {message.html ? (
            // sandbox="" runs no scripts, submits no forms and treats the content as another origin.
            <iframe className="mail-html" title="HTML body" sandbox="" srcDoc={framedHtml(message.html)} />
          ) : null}
        </TabPanel>
        <TabPanel>
          <pre className="mail-text">{message.text}</pre>
        </TabPanel>
      </TabPanels>
    </Tabs>
  );
}

function MessageView({ id }: { id: number }) {
  const message = useMailMessage(id);
  if (message.isPending) return <InlineLoading description="Loading the message" />;
  if (message.isError)
    return <LoadError what="the message" error={message.error} onRetry={message.refetch} />;
  const m = message.data;
  return (
    <>
      <h2 className="section-title">{m.subject ?? '(no subject)'}</h2>
      <dl className="job-facts">
        <dt>From</dt>
        <dd>{m.from ?? m.envelopeFrom}</dd>
        <dt>To</dt>
        <dd>{m.to ?? m.envelopeTo.join(', ')}</dd>
        {m.cc ? (
          <>
            <dt>Cc</dt>
            <dd>{m.cc}</dd>
          </>
        ) : null}
        <dt>Date</dt>
        <dd>{formatDateTime(m.date)}</dd>
        <dt>Received</dt>
        <dd>{formatDateTime(m.receivedAt)}</dd>
        <dt>Envelope</dt>
        <dd>
          {m.envelopeFrom} → {m.envelopeTo.join(', ')}
        </dd>
        <dt>Message-ID</dt>
        <dd className="mono">
          {m.messageId ?? '—'}
          {m.sameMessageIdCount > 1 ? ` (received ${m.sameMessageIdCount} times)` : ''}
        </dd>
        <dt>Size</dt>
        <dd>{formatBytes(m.sizeBytes)}</dd>
      </dl>
      <PageSection title="Body" region="the message body">
        <Bodies message={m} />
      </PageSection>
      <PageSection title="Attachments" region="the attachments">
        <Attachments message={m} />
      </PageSection>
      <PageSection title="Headers" region="the headers">
        <pre className="mail-headers">{m.headers.map((h) => h.line).join('\n')}</pre>
        <Button kind="tertiary" size="sm" onClick={() => void downloadSource(m.id)}>
          Download the message as received (.eml)
        </Button>
      </PageSection>
    </>
  );
}

export default function MailMessagePage() {
  const { messageId } = useParams();
  return (
    <>
      <Link as={RouterLink} to={paths.admin.mail}>
        Back to the mail log
      </Link>
      <MessageView id={Number(messageId)} />
    </>
  );
}
