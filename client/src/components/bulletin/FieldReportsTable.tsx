import type { FieldReportView } from '@stormhour/shared';
import { formatDateTime } from '../../lib/format';
import { SortableTable } from '../SortableTable';

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

/** Field reports on a bulletin, for the officer who filed them and for the unit's staff. */
export function FieldReportsTable({
  reports,
  loading,
  withOfficer = false,
}: {
  reports: FieldReportView[];
  loading: boolean;
  /** Staff see reports of every officer of the district, so name who filed each. */
  withOfficer?: boolean;
}) {
  const rows = reports.map((r) => ({
    id: String(r.id),
    officer: r.officerEmail,
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
      headers={withOfficer ? [{ key: 'officer', header: 'Officer' }, ...HEADERS] : HEADERS}
      rows={rows}
      empty={loading ? 'Loading…' : 'No report filed yet.'}
      renderCell={(header, value) => (header === 'at' ? formatDateTime(String(value)) : String(value))}
    />
  );
}
