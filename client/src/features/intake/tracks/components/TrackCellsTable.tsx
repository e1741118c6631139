import { Table, TableBody, TableCell, TableHead, TableHeader, TableRow } from '@carbon/react';
import type { CellView } from '@stormhour/shared';
import { CELL_TYPE_TEXT } from '../../intakeWords';
import { formatSiteTime, formatUtcOffset } from '../../siteTime';
import { formatOneDecimal } from '../trackFormat';

export function TrackCellsTable({ cells, offsetMinutes }: { cells: CellView[]; offsetMinutes: number }) {
  const ordered = [...cells].sort((a, b) => Date.parse(a.scanTime) - Date.parse(b.scanTime));
  return (
    <Table aria-label="Cells of the track" size="sm">
      <TableHead>
        <TableRow>
          <TableHeader>Scan ({formatUtcOffset(offsetMinutes)})</TableHeader>
          <TableHeader>Centroid (° N, ° E)</TableHeader>
          <TableHeader>Area (km²)</TableHeader>
          <TableHeader>Volume (km³)</TableHeader>
          <TableHeader>Max (dBZ)</TableHeader>
          <TableHeader>Echo top (km)</TableHeader>
          <TableHeader>35 dBZ top (km)</TableHeader>
          <TableHeader>Max VIL (kg m⁻²)</TableHeader>
          <TableHeader>Type</TableHeader>
        </TableRow>
      </TableHead>
      <TableBody>
        {ordered.map((c) => (
          <TableRow key={c.id}>
            <TableCell>{formatSiteTime(c.scanTime, offsetMinutes)}</TableCell>
            <TableCell className="mono">
              {c.lat.toFixed(3)}, {c.lon.toFixed(3)}
            </TableCell>
            <TableCell className="numeric">{formatOneDecimal(c.areaKm2)}</TableCell>
            <TableCell className="numeric">{formatOneDecimal(c.volumeKm3)}</TableCell>
            <TableCell className="numeric">{formatOneDecimal(c.maxDbz)}</TableCell>
            <TableCell className="numeric">{formatOneDecimal(c.echoTopKm)}</TableCell>
            <TableCell className="numeric">{formatOneDecimal(c.top35Km)}</TableCell>
            <TableCell className="numeric">{formatOneDecimal(c.vilMaxKgM2)}</TableCell>
            <TableCell>{c.cellType ? CELL_TYPE_TEXT[c.cellType] : '—'}</TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
