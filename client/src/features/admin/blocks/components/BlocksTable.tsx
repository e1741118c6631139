import {
  Button,
  DataTable,
  Select,
  SelectItem,
  Table,
  TableBody,
  TableCell,
  TableContainer,
  TableHead,
  TableHeader,
  TableRow,
  TableToolbar,
  TableToolbarContent,
  TableToolbarSearch,
} from '@carbon/react';
import type { BlockView, DistrictView } from '@stormhour/shared';
import { useMemo, useState } from 'react';
import { useDistricts } from '../../../../api/districts';
import { LoadError } from '../../../../components/LoadError';
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
      <DataTable rows={shown.map(toRow)} headers={HEADERS} isSortable>
        {({ rows, headers, getTableProps, getHeaderProps, getRowProps, getTableContainerProps }) => (
          <TableContainer
            description={blocks.isPending ? 'Loading…' : `${shown.length} of ${blocks.data.length} blocks`}
            {...getTableContainerProps()}
          >
            <TableToolbar aria-label="Block filters">
              <TableToolbarContent>
                <TableToolbarSearch
                  persistent
                  labelText="Search blocks"
                  placeholder="Search by code or name"
                  value={query}
                  onChange={(event) => {
                    if (event && typeof event !== 'string') setQuery(event.target.value);
                  }}
                />
                <DistrictFilter
                  districts={districts.data ?? []}
                  value={districtId}
                  onChange={setDistrictId}
                />
              </TableToolbarContent>
            </TableToolbar>
            <Table {...getTableProps()} aria-label="Blocks">
              <TableHead>
                <TableRow>
                  {headers.map((header) => {
                    const { key, ...headerProps } = getHeaderProps({ header });
                    return (
                      <TableHeader key={key} {...headerProps}>
                        {header.header}
                      </TableHeader>
                    );
                  })}
                  <TableHeader>
                    <span className="cds--visually-hidden">Actions</span>
                  </TableHeader>
                </TableRow>
              </TableHead>
              <TableBody>
                {rows.length === 0 ? (
                  <TableRow>
                    <TableCell colSpan={HEADERS.length + 1}>
                      {blocks.isPending
                        ? 'Loading blocks…'
                        : blocks.data.length === 0
                          ? 'No blocks yet. Import a GeoJSON file of block boundaries.'
                          : 'No block matches the search.'}
                    </TableCell>
                  </TableRow>
                ) : null}
                {rows.map((row) => {
                  const { key, ...rowProps } = getRowProps({ row });
                  const block = byId.get(row.id);
                  return (
                    <TableRow key={key} {...rowProps}>
                      {row.cells.map((cell) => (
                        <TableCell key={cell.id} className={cell.info.header === 'code' ? 'mono' : undefined}>
                          {cell.info.header === 'areaKm2' ? formatArea(Number(cell.value)) : cell.value}
                        </TableCell>
                      ))}
                      <TableCell className="row-actions">
                        <Button
                          kind="ghost"
                          size="sm"
                          aria-label={`Edit ${row.cells[1]?.value ?? 'block'}`}
                          onClick={() => block && setEditing(block)}
                        >
                          Edit
                        </Button>
                      </TableCell>
                    </TableRow>
                  );
                })}
              </TableBody>
            </Table>
          </TableContainer>
        )}
      </DataTable>
      {editing ? (
        <EditBlockModal block={editing} districts={districts.data ?? []} onClose={() => setEditing(null)} />
      ) : null}
    </>
  );
}
