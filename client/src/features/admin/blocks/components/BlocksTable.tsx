import { Button, Select, SelectItem } from '@carbon/react';
import type { BlockView, DistrictView } from '@stormhour/shared';
import { useMemo, useState } from 'react';
import { useDistricts } from '../../../../api/districts';
import { LoadError } from '../../../../components/LoadError';
import { SortableTable } from '../../../../components/SortableTable';
import { TableSearch } from '../../../../components/TableSearch';
import { useBlocks } from '../api';
import { filterBlocks, formatArea } from '../blockList';
import { EditBlockModal } from './EditBlockModal';

const HEADERS = [
  { key: 'code', header: 'Code' },
  { key: 'name', header: 'Name' },
  { key: 'districtName', header: 'District' },
  { key: 'areaKm2', header: 'Area (km²)' },
];

interface BlockRow {
  id: string;
  code: string;
  name: string;
  districtName: string;
  areaKm2: number;
}

function toRow(block: BlockView): BlockRow {
  return {
    id: String(block.id),
    code: block.code,
    name: block.name,
    districtName: block.districtName,
    areaKm2: block.areaKm2,
  };
}

function DistrictFilter(props: {
  districts: DistrictView[];
  value: number | null;
  onChange: (id: number | null) => void;
}) {
  return (
    <Select
      id="blocks-district-filter"
      className="toolbar-filter"
      labelText="Filter by district"
      hideLabel
      inline
      value={props.value === null ? '' : String(props.value)}
      onChange={(e) => props.onChange(e.target.value === '' ? null : Number(e.target.value))}
    >
      <SelectItem value="" text="All districts" />
      {props.districts.map((d) => (
        <SelectItem key={d.id} value={String(d.id)} text={d.name} />
      ))}
    </Select>
  );
}

export function BlocksTable() {
  const blocks = useBlocks();
  const districts = useDistricts();
  const [query, setQuery] = useState('');
  const [districtId, setDistrictId] = useState<number | null>(null);
  const [editing, setEditing] = useState<BlockView | null>(null);

  const shown = useMemo(
    () => filterBlocks(blocks.data ?? [], { query, districtId }),
    [blocks.data, query, districtId],
  );
  const byId = useMemo(() => new Map(shown.map((b) => [String(b.id), b])), [shown]);

  if (blocks.isError) return <LoadError what="the blocks" error={blocks.error} onRetry={blocks.refetch} />;

  return (
    <>
      <SortableTable
        rows={shown.map(toRow)}
        headers={HEADERS}
        label="Blocks"
        description={blocks.isPending ? 'Loading…' : `${shown.length} of ${blocks.data.length} blocks`}
        toolbar={{
          label: 'Block filters',
          content: (
            <>
              <TableSearch
                labelText="Search blocks"
                placeholder="Search by code or name"
                value={query}
                onSearch={setQuery}
              />
              <DistrictFilter districts={districts.data ?? []} value={districtId} onChange={setDistrictId} />
            </>
          ),
        }}
        empty={
          blocks.isPending
            ? 'Loading blocks…'
            : blocks.data.length === 0
              ? 'No blocks yet. Import a GeoJSON file of block boundaries.'
              : 'No block matches the search.'
        }
        cellClassName={(header) => (header === 'code' ? 'mono' : undefined)}
        renderCell={(header, value) => (header === 'areaKm2' ? formatArea(Number(value)) : String(value))}
        renderActions={(row) => {
          const block = byId.get(row.id);
          return (
            <Button
              kind="ghost"
              size="sm"
              aria-label={`Edit ${row.cells[1]?.value ?? 'block'}`}
              onClick={() => block && setEditing(block)}
            >
              Edit
            </Button>
          );
        }}
      />
      {editing ? (
        <EditBlockModal block={editing} districts={districts.data ?? []} onClose={() => setEditing(null)} />
      ) : null}
    </>
  );
}
