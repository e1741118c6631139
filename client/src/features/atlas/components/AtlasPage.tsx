import { InlineLoading, Tab, TabList, Tabs } from '@carbon/react';
import { useSearchParams } from 'react-router';
import { LoadError } from '../../../components/LoadError';
import { RegionBoundary } from '../../../components/RegionBoundary';
import { useSites } from '../../intake/sites/api';
import type { AxisParams } from '../api';
import { type AtlasView, axisOf, binOf, filterOf, VIEW_NAMES, VIEWS, viewOf } from '../atlasParams';
import { AtlasFilters, type FilterPatch } from './AtlasFilters';
import { DistributionsView } from './DistributionsView';
import { DiurnalView } from './DiurnalView';
import { MotionView } from './MotionView';
import { OnsetMapView } from './OnsetMapView';
import { TimeDistanceView } from './TimeDistanceView';

const AXIS_KEYS: Record<keyof AxisParams, string> = {
  fromLat: 'fromLat',
  fromLon: 'fromLon',
  toLat: 'toLat',
  toLon: 'toLon',
  halfWidthKm: 'halfWidth',
};

export default function AtlasPage() {
  const sites = useSites();
  const [search, setSearch] = useSearchParams();
  const asked = Number(search.get('site'));
  const site = sites.data?.find((s) => s.id === asked) ?? sites.data?.[0] ?? null;
  const view = viewOf(search);

  function update(patch: Record<string, string>) {
    const next = new URLSearchParams(search);
    for (const [key, value] of Object.entries(patch)) {
      if (value) next.set(key, value);
      else next.delete(key);
    }
    setSearch(next, { replace: true });
  }
  const onFilter = (patch: FilterPatch) => update(patch as Record<string, string>);
  const onAxis = (axis: Partial<AxisParams>) =>
    update(
      Object.fromEntries(Object.entries(axis).map(([k, v]) => [AXIS_KEYS[k as keyof AxisParams], String(v)])),
    );

  return (
    <section aria-labelledby="atlas-title" className="atlas">
      <h1 id="atlas-title" className="page-title">
        Atlas
      </h1>
      <p className="page-lead">
        Where and when storms start, how big they grow and where they go. Every view exports its figure (SVG,
        PNG) and its numbers (CSV).
      </p>
      {sites.isPending ? <InlineLoading description="Loading the radar sites" /> : null}
      {sites.isError ? (
        <LoadError what="the radar sites" error={sites.error} onRetry={sites.refetch} />
      ) : null}
      {sites.isSuccess && !site ? <p>No radar sites yet. Add one under Intake, Radar sites.</p> : null}
      {site ? (
        <AtlasBody
          siteId={site.id}
          search={search}
          view={view}
          sites={sites.data ?? []}
          onFilter={onFilter}
          onAxis={onAxis}
          onView={(v) => update({ view: v })}
          onBandwidth={(km) => update({ bw: String(km) })}
        />
      ) : null}
    </section>
  );
}

function AtlasBody({
  siteId,
  search,
  view,
  sites,
  onFilter,
  onAxis,
  onView,
  onBandwidth,
}: {
  siteId: number;
  search: URLSearchParams;
  view: AtlasView;
  sites: NonNullable<ReturnType<typeof useSites>['data']>;
  onFilter: (patch: FilterPatch) => void;
  onAxis: (axis: Partial<AxisParams>) => void;
  onView: (view: AtlasView) => void;
  onBandwidth: (km: number) => void;
}) {
  const params = filterOf(search, siteId);
  const { binHours, bin } = binOf(search);
  const bandwidth = Number(search.get('bw'));
  const bandwidthKm = Number.isFinite(bandwidth) && bandwidth >= 2 && bandwidth <= 100 ? bandwidth : 15;
  return (
    <>
      <AtlasFilters sites={sites} params={params} binHours={binHours} bin={bin} onChange={onFilter} />
      <Tabs
        selectedIndex={VIEWS.indexOf(view)}
        onChange={({ selectedIndex }) => onView(VIEWS[selectedIndex])}
      >
        <TabList aria-label="Atlas views">
          {VIEWS.map((v) => (
            <Tab key={v}>{VIEW_NAMES[v]}</Tab>
          ))}
        </TabList>
      </Tabs>
      <section className="atlas-view" aria-label={VIEW_NAMES[view]}>
        <RegionBoundary region={VIEW_NAMES[view]}>
          {view === 'map' ? (
            <OnsetMapView params={{ ...params, binHours, bin, bandwidthKm }} onBandwidth={onBandwidth} />
          ) : null}
          {view === 'diurnal' ? <DiurnalView params={params} /> : null}
          {view === 'distributions' ? <DistributionsView params={params} /> : null}
          {view === 'time-distance' ? (
            <TimeDistanceView params={{ ...params, ...axisOf(search) }} onAxis={onAxis} />
          ) : null}
          {view === 'motion' ? <MotionView params={params} /> : null}
        </RegionBoundary>
      </section>
    </>
  );
}
