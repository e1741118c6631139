import { Button } from '@carbon/react';
import type { SiteView } from '@stormhour/shared';
import { Link as RouterLink } from 'react-router';
import { SortableTable } from '../../../../components/SortableTable';
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
    <SortableTable
      rows={sites.map(toRow)}
      headers={HEADERS}
      label="Radar sites"
      description={`${sites.length} ${sites.length === 1 ? 'site' : 'sites'}`}
      empty="No radar sites yet. Add the first one to start uploading scans."
      cellClassName={(header) => (header === 'code' ? 'mono' : undefined)}
      renderCell={(header, value) => (header === 'settingsVersion' ? `v${value}` : String(value))}
      renderActions={(row) => (
        <Button
          kind="ghost"
          size="sm"
          as={RouterLink}
          to={paths.intake.site(row.id)}
          aria-label={`Edit ${String(row.cells[0]?.value ?? '')}`}
        >
          Edit
        </Button>
      )}
    />
  );
}
