import {
  Button,
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
import type { DistrictView } from '@stormhour/shared';
import { useState } from 'react';
import { useDistricts } from '../../../../api/districts';
import { LoadError } from '../../../../components/LoadError';
import { formatArea } from '../blockList';
import { AddDistrictModal } from './AddDistrictModal';

function DistrictRows({ districts }: { districts: DistrictView[] }) {
  if (districts.length === 0) {
    return (
      <TableRow>
        <TableCell colSpan={4}>No districts yet. Add one, or import a blocks file that names them.</TableCell>
      </TableRow>
    );
  }
  return districts.map((d) => (
    <TableRow key={d.id}>
      <TableCell className="mono">{d.code}</TableCell>
      <TableCell>{d.name}</TableCell>
      <TableCell>{d.blockCount}</TableCell>
      <TableCell>{formatArea(d.areaKm2)}</TableCell>
    </TableRow>
  ));
}

export function DistrictsTable() {
  const districts = useDistricts();
  const [adding, setAdding] = useState(false);
  if (districts.isError)
    return <LoadError what="the districts" error={districts.error} onRetry={districts.refetch} />;
  return (
    <TableContainer>
      <TableToolbar aria-label="District actions">
        <TableToolbarContent>
          <Button size="sm" onClick={() => setAdding(true)}>
            Add district
          </Button>
        </TableToolbarContent>
      </TableToolbar>
      <Table aria-label="Districts" size="md">
        <TableHead>
          <TableRow>
            <TableHeader>Code</TableHeader>
            <TableHeader>Name</TableHeader>
            <TableHeader>Blocks</TableHeader>
            <TableHeader>Area (km²)</TableHeader>
          </TableRow>
        </TableHead>
        <TableBody>
          {districts.isPending ? (
            <TableRow>
              <TableCell colSpan={4}>Loading districts…</TableCell>
            </TableRow>
          ) : (
            <DistrictRows districts={districts.data} />
          )}
        </TableBody>
      </Table>
      {adding ? <AddDistrictModal onClose={() => setAdding(false)} /> : null}
    </TableContainer>
  );
}
