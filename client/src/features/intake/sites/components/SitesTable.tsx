import {
  Button,
  DataTable,
  Table,
  TableBody,
  TableCell,
  TableContainer,
  TableHead,
  TableHeader,
  TableRow,
} from '@carbon/react';
import type { SiteView } from '@stormhour/shared';
import { Link as RouterLink } from 'react-router';
import { paths } from '../../../../config/paths';
import { formatLocation } from '../siteList';

const HEADERS = [
  { key: 'code', header: 'Code' },
  { key: 'name', header: 'Name' },
  { key: 'location', header: 'Location' },
  { key: 'rangeKm', header: 'Range (km)' },
  { key: 'intervalMin', header: 'Scan interval (min)' },
  { key: 'settingsVersion', header: 'Settings version' },
];

function toRow(site: SiteView) {
  return {
    id: String(site.id),
    code: site.code,
    name: site.name,
    location: formatLocation(site.lat, site.lon),
    rangeKm: site.rangeKm,
    intervalMin: site.intervalMin,
    settingsVersion: site.settingsVersion,
  };
}

export function SitesTable({ sites }: { sites: SiteView[] }) {
  return (
    <DataTable rows={sites.map(toRow)} headers={HEADERS} isSortable>
      {({ rows, headers, getTableProps, getHeaderProps, getRowProps, getTableContainerProps }) => (
        <TableContainer
          description={`${sites.length} ${sites.length === 1 ? 'site' : 'sites'}`}
          {...getTableContainerProps()}
        >
          <Table {...getTableProps()} aria-label="Radar sites">
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
                    No radar sites yet. Add the first one to start uploading scans.
                  </TableCell>
                </TableRow>
              ) : null}
              {rows.map((row) => {
                const { key, ...rowProps } = getRowProps({ row });
                const code = String(row.cells[0]?.value ?? '');
                return (
                  <TableRow key={key} {...rowProps}>
                    {row.cells.map((cell) => (
                      <TableCell key={cell.id} className={cell.info.header === 'code' ? 'mono' : undefined}>
                        {cell.info.header === 'settingsVersion' ? `v${cell.value}` : cell.value}
                      </TableCell>
                    ))}
                    <TableCell className="row-actions">
                      <Button
                        kind="ghost"
                        size="sm"
                        as={RouterLink}
                        to={paths.intake.site(row.id)}
                        aria-label={`Edit ${code}`}
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
  );
}
