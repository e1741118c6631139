import {
  Link,
  Pagination,
  Table,
  TableBody,
  TableCell,
  TableContainer,
  TableHead,
  TableHeader,
  TableRow,
} from '@carbon/react';
import type { Page, TrackView } from '@stormhour/shared';
import { Link as RouterLink } from 'react-router';
import { paths } from '../../../../config/paths';
import { CELL_TYPE_TEXT } from '../../intakeWords';
import { formatSiteTime, formatUtcOffset } from '../../siteTime';
import { formatHeading, formatOneDecimal, onsetText } from '../trackFormat';
import { PAGE_SIZES, type TrackSort, type TracksView } from '../tracksSearch';

interface Column {
  header: string;
  /** The server-side sort this column offers, if any. */
  sort?: TrackSort;
  cell: (track: TrackView, offset: number) => React.ReactNode;
  numeric?: boolean;
}

function columns(offset: number): Column[] {
  return [
    {
      header: `Start (${formatUtcOffset(offset)})`,
      sort: 'firstTime',
      cell: (t) => (
        <Link as={RouterLink} to={paths.intake.track(t.id)}>
          {formatSiteTime(t.firstTime, offset)}
        </Link>
      ),
    },
    {
      header: 'Start block',
      cell: (t) => <span className="mono">{t.startBlockCode ?? 'outside blocks'}</span>,
    },
    { header: 'Duration (min)', sort: 'durationMin', numeric: true, cell: (t) => Math.round(t.durationMin) },
    { header: 'Scans', numeric: true, cell: (t) => t.scanCount },
    { header: 'Speed (m/s)', sort: 'speedMs', numeric: true, cell: (t) => formatOneDecimal(t.speedMs) },
    { header: 'Heading', cell: (t) => formatHeading(t.directionToDeg) },
    {
      header: 'Max volume (km³)',
      sort: 'maxVolumeKm3',
      numeric: true,
      cell: (t) => formatOneDecimal(t.maxVolumeKm3),
    },
    {
      header: 'Max echo top (km)',
      sort: 'maxEchoTopKm',
      numeric: true,
      cell: (t) => formatOneDecimal(t.maxEchoTopKm),
    },
    { header: 'Type', cell: (t) => (t.cellType ? CELL_TYPE_TEXT[t.cellType] : '—') },
    { header: 'Onset', cell: (t) => onsetText(t) },
  ];
}

interface TracksTableProps {
  page: Page<TrackView> | undefined;
  loading: boolean;
  view: TracksView;
  offsetMinutes: number;
  onSort: (column: TrackSort) => void;
  onPage: (page: number, pageSize: number) => void;
}

/** One page of tracks; sorting and paging are done by the server over all matching tracks. */
export function TracksTable({ page, loading, view, offsetMinutes, onSort, onPage }: TracksTableProps) {
  const cols = columns(offsetMinutes);
  const total = page?.total ?? 0;
  return (
    <TableContainer
      description={loading && !page ? 'Loading…' : `${total} ${total === 1 ? 'track' : 'tracks'} match`}
      aria-busy={loading}
    >
      <Table aria-label="Tracks" size="md">
        <TableHead>
          <TableRow>
            {cols.map((col) =>
              col.sort ? (
                <TableHeader
                  key={col.header}
                  isSortable
                  isSortHeader={view.sort === col.sort}
                  sortDirection={view.sort === col.sort ? (view.order === 'asc' ? 'ASC' : 'DESC') : 'NONE'}
                  onClick={() => col.sort && onSort(col.sort)}
                >
                  {col.header}
                </TableHeader>
              ) : (
                <TableHeader key={col.header}>{col.header}</TableHeader>
              ),
            )}
          </TableRow>
        </TableHead>
        <TableBody>
          {page && page.items.length === 0 ? (
            <TableRow>
              <TableCell colSpan={cols.length}>No track matches these filters.</TableCell>
            </TableRow>
          ) : null}
          {page?.items.map((track) => (
            <TableRow key={track.id}>
              {cols.map((col) => (
                <TableCell key={col.header} className={col.numeric ? 'numeric' : undefined}>
                  {col.cell(track, offsetMinutes)}
                </TableCell>
              ))}
            </TableRow>
          ))}
        </TableBody>
      </Table>
      <Pagination
        page={view.page}
        pageSize={view.pageSize}
        pageSizes={[...PAGE_SIZES]}
        totalItems={total}
        onChange={({ page: next, pageSize }) => onPage(next, pageSize)}
      />
    </TableContainer>
  );
}
