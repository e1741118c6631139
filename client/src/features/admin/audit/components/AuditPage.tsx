import {
  Pagination,
  Table,
  TableBody,
  TableCell,
  TableContainer,
  TableHead,
  TableHeader,
  TableRow,
  TableToolbar,
  TableToolbarContent,
} from '@carbon/react';
import { useState } from 'react';
import { LoadError } from '../../../../components/LoadError';
import { RegionBoundary } from '../../../../components/RegionBoundary';
import { TableSearch } from '../../../../components/TableSearch';
import { formatDateTime } from '../../../../lib/format';
import { useDebouncedValue } from '../../../../lib/useDebouncedValue';
import { useAudit } from '../api';
import { summariseDetail } from '../auditDetail';

const PAGE_SIZES = [25, 50, 100];

function AuditTable() {
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(PAGE_SIZES[0]);
  const [action, setAction] = useState('');
  const settledAction = useDebouncedValue(action.trim());
  const audit = useAudit({
    offset: (page - 1) * pageSize,
    limit: pageSize,
    action: settledAction || undefined,
  });

  if (audit.isError) return <LoadError what="the audit trail" error={audit.error} onRetry={audit.refetch} />;
  const entries = audit.data?.items ?? [];

  return (
    <TableContainer title="Audit trail" description="Who changed what, newest first.">
      <TableToolbar aria-label="Audit filters">
        <TableToolbarContent>
          <TableSearch
            labelText="Filter by action"
            placeholder="Filter by action, e.g. user.create"
            value={action}
            onSearch={(text) => {
              setAction(text);
              setPage(1);
            }}
          />
        </TableToolbarContent>
      </TableToolbar>
      <Table aria-label="Audit trail" size="md">
        <TableHead>
          <TableRow>
            <TableHeader>Time</TableHeader>
            <TableHeader>Who</TableHeader>
            <TableHeader>Action</TableHeader>
            <TableHeader>Target</TableHeader>
            <TableHeader>Detail</TableHeader>
          </TableRow>
        </TableHead>
        <TableBody>
          {entries.length === 0 ? (
            <TableRow>
              <TableCell colSpan={5}>
                {audit.isPending ? 'Loading the audit trail…' : 'No entries.'}
              </TableCell>
            </TableRow>
          ) : null}
          {entries.map((entry) => (
            <TableRow key={entry.id}>
              <TableCell>{formatDateTime(entry.at)}</TableCell>
              <TableCell>{entry.actorEmail ?? 'System'}</TableCell>
              <TableCell className="mono">{entry.action}</TableCell>
              <TableCell>{entry.target ?? '—'}</TableCell>
              <TableCell>{summariseDetail(entry.detail)}</TableCell>
            </TableRow>
          ))}
        </TableBody>
      </Table>
      <Pagination
        page={page}
        pageSize={pageSize}
        pageSizes={PAGE_SIZES}
        totalItems={audit.data?.total ?? 0}
        onChange={({ page: nextPage, pageSize: nextSize }) => {
          setPage(nextPage);
          setPageSize(nextSize);
        }}
      />
    </TableContainer>
  );
}

export default function AuditPage() {
  return (
    <RegionBoundary region="the audit trail">
      <AuditTable />
    </RegionBoundary>
  );
}
