import type { FieldReportView } from '@stormhour/shared';
import { LoadError } from '../../../components/LoadError';
import { SortableTable } from '../../../components/SortableTable';
import { formatDateTime } from '../../../lib/format';
import { useFieldReports } from '../api';

const HEADERS = [
  { key: 'block', header: 'Block' },
  { key: 'storm', header: 'Storm' },
  { key: 'startTime', header: 'Start (local)' },
  { key: 'damage', header: 'Damage' },
  { key: 'usefulness', header: 'Usefulness' },
  { key: 'actionTaken', header: 'Action taken' },
  { key: 'notes', header: 'Notes' },
  { key: 'at', header: 'Filed' },
];

function damageText(r: FieldReportView): string {
  const parts = [r.hail && 'hail', r.windDamage && 'wind', r.cropDamage && 'crops'].filter(Boolean);
  return parts.length ? parts.join(', ') : 'none';
}

/** The reports already filed on a bulletin. */
export function FieldReportsTable({ bulletinId }: { bulletinId: number }) {
  const reports = useFieldReports(bulletinId);
  if (reports.isError)
    return <LoadError what="the field reports" error={reports.error} onRetry={() => reports.refetch()} />;
  const rows = (reports.data ?? []).map((r) => ({
    id: String(r.id),
    block: r.blockName,
    storm: r.stormSeen ? 'seen' : 'none',
    startTime: r.startTime?.replace('T', ' ') ?? '–',
    damage: damageText(r),
    usefulness: `${r.usefulness} of 5`,
    actionTaken: r.actionTaken,
    notes: r.notes,
    at: r.at,
  }));
  return (
    <SortableTable
      label="Field reports filed"
      headers={HEADERS}
      rows={rows}
      empty={reports.isLoading ? 'Loading…' : 'No report filed yet.'}
      renderCell={(header, value) => (header === 'at' ? formatDateTime(String(value)) : String(value))}
    />
  );
}
