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
import { RenameDistrictModal } from './RenameDistrictModal';

function DistrictRows({
  districts,
  onRename,
}: {
  districts: DistrictView[];
  onRename: (district: DistrictView) => void;
}) {
  if (districts.length === 0) {
    return (
      <TableRow>
        <TableCell colSpan={5}>No districts yet. Add one, or import a blocks file that names them.</TableCell>
      </TableRow>
    );
  }
  return districts.map((d) => (
    <TableRow key={d.id}>
      <TableCell className="mono">{d.code}</TableCell>
      <TableCell>{d.name}</TableCell>
      <TableCell>{d.blockCount}</TableCell>
      <TableCell>{formatArea(d.areaKm2)}</TableCell>
      <TableCell className="row-actions">
        <Button kind="ghost" size="sm" aria-label={`Rename ${d.name}`} onClick={() => onRename(d)}>
          Rename
        </Button>
      </TableCell>
    </TableRow>
  ));
}

export function DistrictsTable() {
  const districts = useDistricts();
  const [adding, setAdding] = useState(false);
  const [renaming, setRenaming] = useState<DistrictView | null>(null);
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
            <TableHeader>
              <span className="cds--visually-hidden">Actions</span>
            </TableHeader>
          </TableRow>
        </TableHead>
        <TableBody>
          {districts.isPending ? (
            <TableRow>
              <TableCell colSpan={5}>Loading districts…</TableCell>
            </TableRow>
          ) : (
            <DistrictRows districts={districts.data} onRename={setRenaming} />
          )}
        </TableBody>
      </Table>
      {adding ? <AddDistrictModal onClose={() => setAdding(false)} /> : null}
      {renaming ? <RenameDistrictModal district={renaming} onClose={() => setRenaming(null)} /> : null}
    </TableContainer>
  );
}
