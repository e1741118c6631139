import { Table, TableBody, TableCell, TableHead, TableHeader, TableRow } from '@carbon/react';
import type { JobProblemView } from '@stormhour/shared';

export function JobProblemsTable({ problems }: { problems: JobProblemView[] }) {
  return (
    <Table aria-label="Problems" size="sm">
      <TableHead>
        <TableRow>
          <TableHeader>File</TableHeader>
          <TableHeader>Where</TableHeader>
          <TableHeader>Problem</TableHeader>
        </TableRow>
      </TableHead>
      <TableBody>
        {problems.length === 0 ? (
          <TableRow>
            <TableCell colSpan={3}>No problems were found.</TableCell>
          </TableRow>
        ) : null}
        {problems.map((p, index) => (
          // A file can have the same problem in several places; rows never reorder.
          // biome-ignore lint/suspicious/noArrayIndexKey: see above.
          <TableRow key={index}>
            <TableCell className="mono">{p.file}</TableCell>
            <TableCell className="mono">{p.where ?? 'whole file'}</TableCell>
            <TableCell>{p.problem}</TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
