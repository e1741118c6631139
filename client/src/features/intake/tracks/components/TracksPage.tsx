import { InlineLoading } from '@carbon/react';
import { useSearchParams } from 'react-router';
import { useBlocks } from '../../../../api/blocks';
import { LoadError } from '../../../../components/LoadError';
import { useSites } from '../../sites/api';
import { useTracks } from '../api';
import { nextSort, searchFromView, type TracksView, tracksQuery, viewFromSearch } from '../tracksSearch';
import { TrackFilters } from './TrackFilters';
import { TracksTable } from './TracksTable';

export default function TracksPage() {
  const sites = useSites();
  const blocks = useBlocks();
  const [search, setSearch] = useSearchParams();
  const asked = viewFromSearch(search);
  // Without a chosen site, the first one; tracks are always read per site.
  const site = sites.data?.find((s) => s.id === asked.siteId) ?? sites.data?.[0] ?? null;
  const view = site ? { ...asked, siteId: site.id } : null;
  const offset = site?.utcOffsetMinutes ?? 0;
  const tracks = useTracks(view ? tracksQuery(view, offset) : null);

  if (sites.isPending) return <InlineLoading description="Loading the radar sites" />;
  if (sites.isError) return <LoadError what="the radar sites" error={sites.error} onRetry={sites.refetch} />;
  if (!view) return <p>No radar sites yet. Add one under Radar sites, then upload its scans.</p>;

  const update = (patch: Partial<TracksView>) => setSearch(searchFromView({ ...view, ...patch }));

  return (
    <section aria-labelledby="tracks-title">
      <h2 id="tracks-title" className="section-title">
        Tracks
      </h2>
      <p className="page-lead">
        Every tracked cell of the site. Times are the site’s local time. A track’s first scan counts as an
        onset unless it split from another track, starts at the start of the data or after a gap, or at the
        edge of coverage.
      </p>
      <TrackFilters
        view={view}
        sites={sites.data}
        blocks={blocks.data ?? []}
        offsetMinutes={offset}
        onChange={update}
      />
      {tracks.isError ? (
        <LoadError what="the tracks" error={tracks.error} onRetry={tracks.refetch} />
      ) : (
        <TracksTable
          page={tracks.data}
          loading={tracks.isFetching}
          view={view}
          offsetMinutes={offset}
          onSort={(column) => update(nextSort(view, column))}
          onPage={(page, pageSize) => update({ page: pageSize === view.pageSize ? page : 1, pageSize })}
        />
      )}
    </section>
  );
}
