import { Tag } from '@carbon/react';
import type { OutboxRecipientStatus } from '@stormhour/shared';
import { LoadError } from '../../../components/LoadError';
import { SortableTable } from '../../../components/SortableTable';
import { formatDateTime } from '../../../lib/format';
import { outboxStateTagType, outboxStateText } from '../../admin/mail/mailWords';
import { useBulletinDelivery } from '../api';

const HEADERS = [
  { key: 'recipient', header: 'Officer' },
  { key: 'state', header: 'State' },
  { key: 'attempts', header: 'Tries' },
  { key: 'when', header: 'Sent / next try' },
  { key: 'lastError', header: 'Last error' },
];

function rowsOf(recipients: OutboxRecipientStatus[]) {
  return recipients.map((r) => ({
    id: String(r.id),
    recipient: r.recipient,
    state: outboxStateText(r.state, r.attempts),
    attempts: r.attempts,
    when: formatDateTime(r.sentAt ?? r.nextAttemptAt, ''),
    lastError: r.lastError ?? '',
  }));
}

function renderCell(header: string, value: unknown) {
  if (header === 'state') return <Tag type={outboxStateTagType(String(value))}>{String(value)}</Tag>;
  return String(value);
}

/** Delivery per officer, followed live while messages are still queued or being sent. */
export function DeliveryPanel({ bulletinId }: { bulletinId: number }) {
  const delivery = useBulletinDelivery(bulletinId, true);
  if (delivery.isError)
    return <LoadError what="the delivery" error={delivery.error} onRetry={() => delivery.refetch()} />;
  const d = delivery.data;
  if (!d) return <p>Loading…</p>;
  return (
    <>
      <p role="status">
        {d.counts.sent} sent, {d.counts.queued + d.counts.sending} on the way, {d.counts.failed} failed.
        Failed tries are retried on their own; an administrator can retry a failed message from Admin › Mail
        log.
      </p>
      <SortableTable
        label="Delivery"
        headers={HEADERS}
        rows={rowsOf(d.recipients)}
        empty="Not sent yet."
        renderCell={renderCell}
      />
      {d.withdrawalKey ? (
        <SortableTable
          label="Correction notice delivery"
          title="Correction notice"
          headers={HEADERS}
          rows={rowsOf(d.withdrawal)}
          empty="No correction notice queued."
          renderCell={renderCell}
        />
      ) : null}
    </>
  );
}
