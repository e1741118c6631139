import { Link, Tag } from '@carbon/react';
import { formatPercent, type InboxItem } from '@stormhour/shared';
import { useState } from 'react';
import { Link as RouterLink } from 'react-router';
import { LoadError } from '../../../components/LoadError';
import { SortableTable } from '../../../components/SortableTable';
import { TableSearch } from '../../../components/TableSearch';
import { paths } from '../../../config/paths';
import { formatDateTime } from '../../../lib/format';
import { useInbox } from '../api';

const HEADERS = [
  { key: 'status', header: 'Status' },
  { key: 'number', header: 'Bulletin' },
  { key: 'weekStart', header: 'Week' },
  { key: 'sentAt', header: 'Received' },
  { key: 'highestChance', header: 'Highest afternoon chance' },
  { key: 'reportCount', header: 'Your reports' },
];

function statusOf(item: InboxItem): string {
  if (item.state === 'withdrawn') return 'Withdrawn';
  if (item.unread) return 'Unread';
  if (item.acknowledgedAt) return 'Acknowledged';
  return 'Read';
}

const STATUS_TAG = { Unread: 'blue', Read: 'gray', Acknowledged: 'green', Withdrawn: 'red' } as const;

/** The district's bulletins, newest first, unread ones marked. */
export default function InboxListPage() {
  const inbox = useInbox();
  const [query, setQuery] = useState('');
  const items = inbox.data ?? [];
  const unread = items.filter((i) => i.unread).length;
  const needle = query.trim().toLowerCase();
  const rows = [...items]
    .sort((a, b) => b.sentAt.localeCompare(a.sentAt))
    .filter((i) => !needle || `${i.number} ${i.weekStart} ${statusOf(i)}`.toLowerCase().includes(needle))
    .map((i) => ({
      id: String(i.id),
      status: statusOf(i),
      number: i.number,
      weekStart: `${i.weekStart} to ${i.weekEnd}`,
      sentAt: i.sentAt,
      highestChance: i.highestChance,
      reportCount: i.reportCount,
    }));

  return (
    <section aria-labelledby="inbox-title">
      <h2 id="inbox-title" className="section-title">
        Bulletins for your district
      </h2>
      <p className="page-lead">
        {inbox.data
          ? unread > 0
            ? `${unread} unread ${unread === 1 ? 'bulletin' : 'bulletins'}.`
            : 'Everything has been read.'
          : null}{' '}
        Open a bulletin to read it, acknowledge it and report what you saw in the field.
      </p>
      {inbox.isError ? (
        <LoadError what="your inbox" error={inbox.error} onRetry={() => inbox.refetch()} />
      ) : null}
      <SortableTable
        label="Inbox"
        headers={HEADERS}
        rows={rows}
        empty={inbox.isLoading ? 'Loading…' : 'No bulletin has been sent to your district yet.'}
        toolbar={{
          label: 'Inbox tools',
          content: (
            <TableSearch
              labelText="Search the inbox"
              placeholder="Number, week or status"
              value={query}
              onSearch={setQuery}
            />
          ),
        }}
        cellClassName={(header) => (header === 'number' ? 'inbox-number' : undefined)}
        renderCell={(header, value) => {
          if (header === 'status') {
            const status = value as keyof typeof STATUS_TAG;
            return <Tag type={STATUS_TAG[status]}>{status}</Tag>;
          }
          if (header === 'sentAt') return formatDateTime(String(value));
          if (header === 'highestChance') return value === null ? 'no data' : formatPercent(Number(value));
          return String(value);
        }}
        renderActions={(row) => (
          <Link as={RouterLink} to={paths.inbox.bulletin(row.id)}>
            Open<span className="cds--visually-hidden"> bulletin {String(row.cells[1].value)}</span>
          </Link>
        )}
      />
    </section>
  );
}
