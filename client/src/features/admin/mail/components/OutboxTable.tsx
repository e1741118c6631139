import { Button, InlineNotification, Pagination, Select, SelectItem, Tag } from '@carbon/react';
import { OUTBOX_STATES, type OutboxEntry, type OutboxState } from '@stormhour/shared';
import { useMemo, useState } from 'react';
import { LoadError } from '../../../../components/LoadError';
import { SortableTable } from '../../../../components/SortableTable';
import { messageOf } from '../../../../lib/apiError';
import { formatDateTime } from '../../../../lib/format';
import { useOutbox, useRetryOutbox } from '../api';
import { OUTBOX_STATE_TAGS, outboxStateTagType, outboxStateText } from '../mailWords';

const PAGE_SIZES = [25, 50, 100];

const HEADERS = [
  // ISO timestamps sort in time order as plain text.
  { key: 'createdAt', header: 'Queued' },
  { key: 'key', header: 'Sending' },
  { key: 'recipient', header: 'To' },
  { key: 'subject', header: 'Subject' },
  { key: 'state', header: 'State' },
  { key: 'attempts', header: 'Tries' },
  { key: 'when', header: 'Sent / next try' },
  { key: 'lastError', header: 'Last error' },
];

function toRow(entry: OutboxEntry) {
  return {
    id: String(entry.id),
    createdAt: entry.createdAt,
    key: entry.key,
    recipient: entry.recipient,
    subject: entry.subject,
    state: outboxStateText(entry.state, entry.attempts),
    attempts: entry.attempts,
    when: entry.sentAt ?? entry.nextAttemptAt ?? '',
    lastError: entry.lastError ?? '',
  };
}

export function OutboxTable() {
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(PAGE_SIZES[0]);
  const [state, setState] = useState<OutboxState | ''>('');
  const outbox = useOutbox({ offset: (page - 1) * pageSize, limit: pageSize, state: state || undefined });
  const retry = useRetryOutbox();
  const entries = outbox.data?.items ?? [];
  const byId = useMemo(() => new Map(entries.map((e) => [String(e.id), e])), [entries]);

  if (outbox.isError) return <LoadError what="the outbox" error={outbox.error} onRetry={outbox.refetch} />;

  return (
    <>
      {retry.isError ? (
        <InlineNotification
          kind="error"
          lowContrast
          title="Could not retry the message."
          subtitle={messageOf(retry.error)}
          onCloseButtonClick={() => retry.reset()}
        />
      ) : null}
      <SortableTable
        rows={entries.map(toRow)}
        headers={HEADERS}
        label="Outbox"
        description="Every message Stormhour has queued, one row per recipient. Failed tries are retried on their own, waiting longer each time; a failed row waits for you."
        toolbar={{
          label: 'Outbox filters',
          content: (
            <Select
              id="outbox-state-filter"
              className="toolbar-filter"
              labelText="Filter by state"
              hideLabel
              inline
              value={state}
              onChange={(e) => {
                setState(e.target.value as OutboxState | '');
                setPage(1);
              }}
            >
              <SelectItem value="" text="All states" />
              {OUTBOX_STATES.map((s) => (
                <SelectItem key={s} value={s} text={OUTBOX_STATE_TAGS[s].text} />
              ))}
            </Select>
          ),
        }}
        empty={outbox.isPending ? 'Loading the outbox…' : 'No messages.'}
        renderCell={(header, value) => {
          if (header === 'state')
            return (
              <Tag type={outboxStateTagType(String(value))} size="sm">
                {String(value)}
              </Tag>
            );
          if (header === 'createdAt') return formatDateTime(String(value));
          if (header === 'when') return formatDateTime(String(value));
          if (header === 'lastError')
            return value ? <span className="mail-error">{String(value)}</span> : '—';
          return String(value);
        }}
        cellClassName={(header) => (header === 'key' ? 'mono' : undefined)}
        renderActions={(row) => {
          const entry = byId.get(row.id);
          if (!entry) return null;
          if (entry.state !== 'failed' && !(entry.state === 'queued' && entry.attempts > 0)) return null;
          return (
            <Button
              kind="ghost"
              size="sm"
              aria-label={`Retry the message to ${entry.recipient}`}
              disabled={retry.isPending}
              onClick={() => retry.mutate(entry.id)}
            >
              Retry now
            </Button>
          );
        }}
      />
      <Pagination
        page={page}
        pageSize={pageSize}
        pageSizes={PAGE_SIZES}
        totalItems={outbox.data?.total ?? 0}
        onChange={({ page: nextPage, pageSize: nextSize }) => {
          setPage(nextPage);
          setPageSize(nextSize);
        }}
      />
    </>
  );
}
