import { Link, Pagination, Tag } from '@carbon/react';
import type { MailMessageSummary } from '@stormhour/shared';
import { useState } from 'react';
import { Link as RouterLink } from 'react-router';
import { LoadError } from '../../../../components/LoadError';
import { SortableTable } from '../../../../components/SortableTable';
import { TableSearch } from '../../../../components/TableSearch';
import { paths } from '../../../../config/paths';
import { formatDateTime } from '../../../../lib/format';
import { useDebouncedValue } from '../../../../lib/useDebouncedValue';
import { useMailMessages } from '../api';
import { formatBytes, recipientsText } from '../mailWords';

const PAGE_SIZES = [25, 50, 100];

const HEADERS = [
  { key: 'receivedAt', header: 'Received' },
  { key: 'subject', header: 'Subject' },
  { key: 'to', header: 'To' },
  { key: 'from', header: 'From' },
  { key: 'sizeBytes', header: 'Size' },
  { key: 'copies', header: 'Copies' },
];

function toRow(m: MailMessageSummary) {
  return {
    id: String(m.id),
    receivedAt: m.receivedAt,
    // The link text is the subject, so the column still sorts by it.
    subject: m.subject ?? '(no subject)',
    to: recipientsText(m.envelopeTo),
    from: m.envelopeFrom,
    sizeBytes: m.sizeBytes,
    copies: m.sameMessageIdCount,
  };
}

export function MessagesTable() {
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(PAGE_SIZES[0]);
  const [search, setSearch] = useState('');
  const q = useDebouncedValue(search.trim());
  const messages = useMailMessages({ offset: (page - 1) * pageSize, limit: pageSize, q: q || undefined });

  if (messages.isError)
    return <LoadError what="the received messages" error={messages.error} onRetry={messages.refetch} />;
  const items = messages.data?.items ?? [];

  return (
    <>
      <SortableTable
        rows={items.map(toRow)}
        headers={HEADERS}
        label="Received messages"
        description="What the local mail server received, newest first, exactly as it arrived. Open one to see its headers, both bodies and its attachments."
        toolbar={{
          label: 'Received message filters',
          content: (
            <TableSearch
              labelText="Search received messages"
              placeholder="Search by subject, sender or recipient"
              value={search}
              onSearch={(text) => {
                setSearch(text);
                setPage(1);
              }}
            />
          ),
        }}
        empty={messages.isPending ? 'Loading messages…' : 'No messages received.'}
        renderCell={(header, value) => {
          if (header === 'receivedAt') return formatDateTime(String(value));
          if (header === 'sizeBytes') return formatBytes(Number(value));
          if (header === 'copies')
            return Number(value) > 1 ? (
              <Tag type="red" size="sm">
                {`${value} copies`}
              </Tag>
            ) : (
              '1'
            );
          return String(value);
        }}
        renderActions={(row) => (
          <Link as={RouterLink} to={paths.admin.mailMessage(row.id)}>
            Open
            <span className="cds--visually-hidden">{` message ${row.cells[1]?.value ?? ''}`}</span>
          </Link>
        )}
      />
      <Pagination
        page={page}
        pageSize={pageSize}
        pageSizes={PAGE_SIZES}
        totalItems={messages.data?.total ?? 0}
        onChange={({ page: nextPage, pageSize: nextSize }) => {
          setPage(nextPage);
          setPageSize(nextSize);
        }}
      />
    </>
  );
}
