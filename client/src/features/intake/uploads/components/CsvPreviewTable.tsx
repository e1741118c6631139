import { Table, TableBody, TableCell, TableContainer, TableHead, TableHeader, TableRow } from '@carbon/react';
import type { CsvPreview } from '../csvPreview';

/** The header and first rows of a CSV file, with any problems reading them. */
export function CsvPreviewTable({
  title,
  fileName,
  preview,
}: {
  title: string;
  fileName: string;
  preview: CsvPreview;
}) {
  return (
    <>
      <TableContainer
        title={title}
        description={`The first ${preview.rows.length} rows of ${fileName}`}
        className="mapping-preview"
      >
        <Table size="xs">
          <TableHead>
            <TableRow>
              {preview.headers.map((h) => (
                <TableHeader key={h}>{h}</TableHeader>
              ))}
            </TableRow>
          </TableHead>
          <TableBody>
            {preview.rows.map((row, index) => (
              // Preview rows have no key of their own and never reorder.
              // biome-ignore lint/suspicious/noArrayIndexKey: see above.
              <TableRow key={index}>
                {preview.headers.map((h) => (
                  <TableCell key={h} className="mono">
                    {row[h]}
                  </TableCell>
                ))}
              </TableRow>
            ))}
          </TableBody>
        </Table>
      </TableContainer>
      {preview.problems.length > 0 ? (
        <ul className="field-problems" aria-label="Problems in the preview">
          {preview.problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      ) : null}
    </>
  );
}
