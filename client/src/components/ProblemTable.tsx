import { Table, TableBody, TableCell, TableHead, TableHeader, TableRow } from '@carbon/react';
import type { ErrorDetail } from '@stormhour/shared';

/** Every problem of a refused file, by row and column. */
export function ProblemTable({ problems }: { problems: ErrorDetail[] }) {
  return (
    <Table aria-label="Problems in the file" size="sm">
      <TableHead>
        <TableRow>
          <TableHeader>Where</TableHeader>
          <TableHeader>Problem</TableHeader>
        </TableRow>
      </TableHead>
      <TableBody>
        {problems.map((p, index) => (
          // biome-ignore lint/suspicious/noArrayIndexKey: one row can have several problems; rows never reorder.
          <TableRow key={index}>
            <TableCell className="mono">{p.where}</TableCell>
            <TableCell>{p.problem}</TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
