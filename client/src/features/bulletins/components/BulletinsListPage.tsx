import { Button, Link, Select, SelectItem, Tag } from '@carbon/react';
import { BULLETIN_STATE_LABELS, BULLETIN_STATES, type BulletinState } from '@stormhour/shared';
import { useState } from 'react';
import { Link as RouterLink } from 'react-router';
import { useDistricts } from '../../../api/districts';
import { LoadError } from '../../../components/LoadError';
import { PageSection } from '../../../components/PageSection';
import { SortableTable } from '../../../components/SortableTable';
import { TableSearch } from '../../../components/TableSearch';
import { paths } from '../../../config/paths';
import { formatDateTime } from '../../../lib/format';
import { useBulletins } from '../api';
import { STATE_TAG } from '../bulletinWords';
import { NewBulletinModal } from './NewBulletinModal';

const HEADERS = [
  { key: 'number', header: 'Number' },
  { key: 'district', header: 'District' },
  { key: 'weekStart', header: 'Week' },
  { key: 'state', header: 'State' },
  { key: 'author', header: 'Author' },
  // ISO timestamps sort in time order as plain text; the cell shows them formatted.
  { key: 'updatedAt', header: 'Updated' },
];

/** Every bulletin, newest week first: sortable, filtered by district, state and text. */
export default function BulletinsListPage() {
  const districts = useDistricts();
  const [districtId, setDistrictId] = useState('');
  const [state, setState] = useState<BulletinState | ''>('');
  const [query, setQuery] = useState('');
  const [creating, setCreating] = useState(false);
  const bulletins = useBulletins({
    districtId: districtId ? Number(districtId) : undefined,
    state: state || undefined,
  });

  const needle = query.trim().toLowerCase();
  const rows = (bulletins.data ?? [])
    .map((b) => ({
      id: String(b.id),
      number: b.number,
      district: b.districtName,
      weekStart: b.weekStart,
      state: b.state,
      author: b.authorEmail,
      updatedAt: b.updatedAt,
      all: `${b.number} ${b.districtName} ${b.authorEmail} ${b.weekStart}`.toLowerCase(),
    }))
    .filter((r) => !needle || r.all.includes(needle))
    .sort((a, b) => b.weekStart.localeCompare(a.weekStart) || b.updatedAt.localeCompare(a.updatedAt));

  return (
    <PageSection title="District bulletins" region="the bulletins">
      <p className="cds--label-description section-intro">
        A draft is made for a district and a week from the block outlook and the advice rules. The writer
        edits it and sends it for review; a scientist other than the author approves it; then it is sent to
        the district’s extension officers.
      </p>
      {bulletins.isError ? (
        <LoadError what="the bulletins" error={bulletins.error} onRetry={() => bulletins.refetch()} />
      ) : null}
      <SortableTable
        label="Bulletins"
        headers={HEADERS}
        rows={rows}
        empty={bulletins.isLoading ? 'Loading…' : 'No bulletin matches.'}
        toolbar={{
          label: 'Bulletin filters',
          content: (
            <>
              <TableSearch
                labelText="Search bulletins"
                placeholder="Number, district or author"
                value={query}
                onSearch={setQuery}
              />
              <Select
                id="bulletins-district-filter"
                className="toolbar-filter"
                labelText="District"
                hideLabel
                inline
                value={districtId}
                onChange={(e) => setDistrictId(e.target.value)}
              >
                <SelectItem value="" text="All districts" />
                {(districts.data ?? []).map((d) => (
                  <SelectItem key={d.id} value={String(d.id)} text={d.name} />
                ))}
              </Select>
              <Select
                id="bulletins-state-filter"
                className="toolbar-filter"
                labelText="State"
                hideLabel
                inline
                value={state}
                onChange={(e) => setState(e.target.value as BulletinState | '')}
              >
                <SelectItem value="" text="All states" />
                {BULLETIN_STATES.map((s) => (
                  <SelectItem key={s} value={s} text={BULLETIN_STATE_LABELS[s]} />
                ))}
              </Select>
              <Button size="sm" onClick={() => setCreating(true)}>
                New bulletin
              </Button>
            </>
          ),
        }}
        renderCell={(header, value) => {
          if (header === 'state') {
            const s = value as BulletinState;
            return <Tag type={STATE_TAG[s]}>{BULLETIN_STATE_LABELS[s]}</Tag>;
          }
          if (header === 'updatedAt') return formatDateTime(String(value));
          return String(value);
        }}
        renderActions={(row) => (
          <Link as={RouterLink} to={paths.bulletins.bulletin(row.id)}>
            Open<span className="cds--visually-hidden"> bulletin {String(row.cells[0].value)}</span>
          </Link>
        )}
      />
      {creating ? <NewBulletinModal onClose={() => setCreating(false)} /> : null}
    </PageSection>
  );
}
