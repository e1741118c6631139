import {
  DataTable,
  type DataTableHeader,
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
import { type OutlookFigure, type OutlookResponse, SMALL_N } from '@stormhour/shared';
import { useMemo, useState } from 'react';
import { isSmallN, percent } from '../outlookFormat';

type CellValue = string | number | OutlookFigure | null;

/** Sorts figures by their rate (no data last), text as text. */
function sortCells(a: CellValue, b: CellValue, { sortDirection }: { sortDirection: string }) {
  const key = (v: CellValue): number | string => {
    if (v !== null && typeof v === 'object') return v.rate ?? -1;
    return v ?? '';
  };
  const ka = key(a);
  const kb = key(b);
  const order =
    typeof ka === 'number' && typeof kb === 'number' ? ka - kb : String(ka).localeCompare(String(kb));
  return sortDirection === 'DESC' ? -order : order;
}

function Figure({ f }: { f: OutlookFigure }) {
  if (f.n === null) return <span className="outlook-nodata">no data</span>;
  const small = isSmallN(f);
  return (
    <span className={small ? 'outlook-figure outlook-figure--small' : 'outlook-figure'}>
      {percent(f.rate)} <span className="outlook-n">n {f.n}</span>
      {small ? (
        <span className="outlook-small-mark" title={`Fewer than ${SMALL_N} days`}>
          {' '}
          *
        </span>
      ) : null}
    </span>
  );
}

/** Block × bin table: the chance per bin and the afternoon figure, each with its n; sortable, filterable. */
export function OutlookTable({
  outlook,
  selectedBlock,
  onSelectBlock,
}: {
  outlook: OutlookResponse;
  selectedBlock: number | null;
  onSelectBlock: (id: number) => void;
}) {
  const [district, setDistrict] = useState('');
  const [search, setSearch] = useState('');
  const districts = useMemo(
    () => [...new Map(outlook.blocks.map((b) => [b.districtCode, b.districtName]))],
    [outlook.blocks],
  );
  const headers: DataTableHeader[] = [
    { key: 'block', header: 'Block' },
    { key: 'district', header: 'District' },
    ...outlook.bins.map((bin) => ({ key: `bin${bin.index}`, header: bin.label })),
    { key: 'afternoon', header: `Afternoon ${outlook.afternoon.fromHour}–${outlook.afternoon.toHour}` },
  ];
  const rows = outlook.blocks
    .filter((b) => !district || b.districtCode === district)
    .filter((b) => !search || `${b.name} ${b.code}`.toLowerCase().includes(search.toLowerCase()))
    .map((b) => ({
      id: String(b.blockId),
      block: `${b.name} (${b.code})`,
      district: b.districtName,
      ...Object.fromEntries(b.bins.map((f, k) => [`bin${k}`, f])),
      afternoon: b.afternoon,
    }));

  return (
    <DataTable rows={rows} headers={headers} isSortable sortRow={sortCells as never}>
      {({
        rows: sorted,
        headers: shown,
        getTableProps,
        getHeaderProps,
        getRowProps,
        getTableContainerProps,
      }) => (
        <TableContainer
          title="Chance of a storm starting, by block and local time"
          description={`Raw rate x/n with n, the days counted. * marks fewer than ${SMALL_N} days. Sort by any column.`}
          {...getTableContainerProps()}
        >
          <TableToolbar aria-label="Outlook table filters">
            <TableToolbarContent>
              <TableToolbarSearch
                persistent
                labelText="Find a block"
                placeholder="Find a block by name or code"
                onChange={(e) => setSearch(typeof e === 'string' ? e : (e?.target.value ?? ''))}
              />
              <Select
                id="outlook-district"
                labelText="District"
                hideLabel
                size="lg"
                value={district}
                onChange={(e) => setDistrict(e.target.value)}
              >
                <SelectItem value="" text="All districts" />
                {districts.map(([code, name]) => (
                  <SelectItem key={code} value={code} text={name} />
                ))}
              </Select>
            </TableToolbarContent>
          </TableToolbar>
          <Table {...getTableProps()} aria-label="Outlook by block and bin" size="sm">
            <TableHead>
              <TableRow>
                {shown.map((header) => {
                  const { key, ...headerProps } = getHeaderProps({ header });
                  return (
                    <TableHeader key={key} {...headerProps}>
                      {header.header}
                    </TableHeader>
                  );
                })}
              </TableRow>
            </TableHead>
            <TableBody>
              {sorted.length === 0 ? (
                <TableRow>
                  <TableCell colSpan={headers.length}>No block matches the filter.</TableCell>
                </TableRow>
              ) : null}
              {sorted.map((row) => {
                const { key, ...rowProps } = getRowProps({ row });
                const id = Number(row.id);
                return (
                  <TableRow
                    key={key}
                    {...rowProps}
                    className={id === selectedBlock ? 'outlook-row--selected' : undefined}
                  >
                    {row.cells.map((cell) => (
                      <TableCell key={cell.id}>
                        {cell.info.header === 'block' ? (
                          <button
                            type="button"
                            className="outlook-block-link"
                            onClick={() => onSelectBlock(id)}
                          >
                            {cell.value as string}
                          </button>
                        ) : typeof cell.value === 'object' && cell.value !== null ? (
                          <Figure f={cell.value as OutlookFigure} />
                        ) : (
                          (cell.value as string)
                        )}
                      </TableCell>
                    ))}
                  </TableRow>
                );
              })}
            </TableBody>
          </Table>
        </TableContainer>
      )}
    </DataTable>
  );
}
