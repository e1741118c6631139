import {
  DataTable,
  type DataTableHeader,
  type DataTableRow,
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
import type { ReactNode } from 'react';

// Carbon types cell values by column; these tables mix strings and numbers, so the row is loosely typed.
// biome-ignore lint/suspicious/noExplicitAny: matches Carbon's own default for untyped columns
export type SortableRow = DataTableRow<any[]>;

interface SortableTableProps {
  /** One object per row: an `id` and a value for each header key. */
  rows: { id: string }[];
  headers: DataTableHeader[];
  /** Accessible name of the table. */
  label: string;
  title?: ReactNode;
  description?: ReactNode;
  /** Controls above the table, with the toolbar's accessible name. */
  toolbar?: { label: string; content: ReactNode };
  /** Shown in a full-width row when there are no rows. */
  empty: ReactNode;
  renderCell?: (header: string, value: unknown) => ReactNode;
  cellClassName?: (header: string) => string | undefined;
  /** Buttons for a row; when given, the table gets a last column named "Actions" for screen readers. */
  renderActions?: (row: SortableRow) => ReactNode;
}

/** A Carbon DataTable sorted on the client by any column, with the markup our list pages share. */
export function SortableTable({
  rows,
  headers,
  label,
  title,
  description,
  toolbar,
  empty,
  renderCell = (_header, value) => value as ReactNode,
  cellClassName,
  renderActions,
}: SortableTableProps) {
  const columnCount = headers.length + (renderActions ? 1 : 0);
  return (
    <DataTable rows={rows} headers={headers} isSortable>
      {({
        rows: sorted,
        headers: shown,
        getTableProps,
        getHeaderProps,
        getRowProps,
        getTableContainerProps,
      }) => (
        <TableContainer title={title} description={description} {...getTableContainerProps()}>
          {toolbar ? (
            <TableToolbar aria-label={toolbar.label}>
              <TableToolbarContent>{toolbar.content}</TableToolbarContent>
            </TableToolbar>
          ) : null}
          <Table {...getTableProps()} aria-label={label}>
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
                {renderActions ? (
                  <TableHeader>
                    <span className="cds--visually-hidden">Actions</span>
                  </TableHeader>
                ) : null}
              </TableRow>
            </TableHead>
            <TableBody>
              {sorted.length === 0 ? (
                <TableRow>
                  <TableCell colSpan={columnCount}>{empty}</TableCell>
                </TableRow>
              ) : null}
              {sorted.map((row) => {
                const { key, ...rowProps } = getRowProps({ row });
                return (
                  <TableRow key={key} {...rowProps}>
                    {row.cells.map((cell) => (
                      <TableCell key={cell.id} className={cellClassName?.(cell.info.header)}>
                        {renderCell(cell.info.header, cell.value)}
                      </TableCell>
                    ))}
                    {renderActions ? (
                      <TableCell className="row-actions">{renderActions(row)}</TableCell>
                    ) : null}
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
