import { Button, Select, SelectItem, Tag } from '@carbon/react';
import { type DistrictView, ROLE_LABELS, ROLES, type Role, type UserView } from '@stormhour/shared';
import { useMemo, useState } from 'react';
import { useDistricts } from '../../../../api/districts';
import { LoadError } from '../../../../components/LoadError';
import { SortableTable } from '../../../../components/SortableTable';
import { TableSearch } from '../../../../components/TableSearch';
import { useSessionUser } from '../../../../lib/auth';
import { formatDateTime } from '../../../../lib/format';
import { useUsers } from '../api';
import { filterPeople } from '../peopleList';
import { AddPersonModal } from './AddPersonModal';
import { ConfirmActiveModal } from './ConfirmActiveModal';
import { EditPersonModal } from './EditPersonModal';

const HEADERS = [
  { key: 'email', header: 'Email' },
  { key: 'name', header: 'Name' },
  { key: 'role', header: 'Role' },
  { key: 'district', header: 'District' },
  { key: 'active', header: 'Active' },
  // ISO timestamps sort in time order as plain text; empty (never) sorts first.
  { key: 'lastSignInAt', header: 'Last sign-in' },
];

function toRow(user: UserView, districtNames: Map<number, string>) {
  return {
    id: String(user.id),
    email: user.email,
    name: user.name,
    role: ROLE_LABELS[user.role],
    district: user.districtId === null ? '' : (districtNames.get(user.districtId) ?? `#${user.districtId}`),
    active: user.active ? 'Active' : 'Inactive',
    lastSignInAt: user.lastSignInAt ?? '',
  };
}

function CellContent({ header, value }: { header: string; value: unknown }) {
  if (header === 'active') return <Tag type={value === 'Active' ? 'green' : 'gray'}>{String(value)}</Tag>;
  if (header === 'lastSignInAt') return formatDateTime(String(value), 'Never');
  if (header === 'district') return value ? String(value) : '—';
  return String(value);
}

type Dialog = { kind: 'add' } | { kind: 'edit'; user: UserView } | { kind: 'active'; user: UserView } | null;

function Dialogs({
  dialog,
  districts,
  close,
}: {
  dialog: Dialog;
  districts: DistrictView[];
  close: () => void;
}) {
  if (dialog?.kind === 'add') return <AddPersonModal districts={districts} onClose={close} />;
  if (dialog?.kind === 'edit')
    return <EditPersonModal user={dialog.user} districts={districts} onClose={close} />;
  if (dialog?.kind === 'active') return <ConfirmActiveModal user={dialog.user} onClose={close} />;
  return null;
}

export function PeopleTable() {
  const me = useSessionUser();
  const users = useUsers();
  const districts = useDistricts();
  const [query, setQuery] = useState('');
  const [role, setRole] = useState<Role | null>(null);
  const [dialog, setDialog] = useState<Dialog>(null);

  const districtNames = useMemo(
    () => new Map((districts.data ?? []).map((d) => [d.id, d.name])),
    [districts.data],
  );
  const shown = useMemo(() => filterPeople(users.data ?? [], { query, role }), [users.data, query, role]);
  const byId = useMemo(() => new Map(shown.map((u) => [String(u.id), u])), [shown]);

  if (users.isError) return <LoadError what="the people" error={users.error} onRetry={users.refetch} />;

  return (
    <>
      <SortableTable
        rows={shown.map((u) => toRow(u, districtNames))}
        headers={HEADERS}
        label="People"
        title="People"
        description="Everyone who can sign in to Stormhour, and what their role lets them do."
        toolbar={{
          label: 'People filters',
          content: (
            <>
              <TableSearch
                labelText="Search people"
                placeholder="Search by e-mail or name"
                value={query}
                onSearch={setQuery}
              />
              <Select
                id="people-role-filter"
                className="toolbar-filter"
                labelText="Filter by role"
                hideLabel
                inline
                value={role ?? ''}
                onChange={(e) => setRole(e.target.value === '' ? null : (e.target.value as Role))}
              >
                <SelectItem value="" text="All roles" />
                {ROLES.map((r) => (
                  <SelectItem key={r} value={r} text={ROLE_LABELS[r]} />
                ))}
              </Select>
              <Button size="sm" onClick={() => setDialog({ kind: 'add' })}>
                Add person
              </Button>
            </>
          ),
        }}
        empty={users.isPending ? 'Loading people…' : 'No one matches the search.'}
        renderCell={(header, value) => <CellContent header={header} value={value} />}
        renderActions={(row) => {
          const user = byId.get(row.id);
          if (!user) return null;
          return (
            <>
              <Button
                kind="ghost"
                size="sm"
                aria-label={`Edit ${user.name}`}
                onClick={() => setDialog({ kind: 'edit', user })}
              >
                Edit
              </Button>
              <Button
                kind="ghost"
                size="sm"
                disabled={user.id === me.id}
                aria-label={`${user.active ? 'Deactivate' : 'Reactivate'} ${user.name}`}
                onClick={() => setDialog({ kind: 'active', user })}
              >
                {user.active ? 'Deactivate' : 'Reactivate'}
              </Button>
            </>
          );
        }}
      />
      <Dialogs dialog={dialog} districts={districts.data ?? []} close={() => setDialog(null)} />
    </>
  );
}
