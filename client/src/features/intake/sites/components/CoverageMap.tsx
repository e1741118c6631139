import { InlineLoading, Select, SelectItem } from '@carbon/react';
import type { SiteView } from '@stormhour/shared';
import type { GeoPermissibleObjects } from 'd3-geo';
import { useMemo, useState } from 'react';
import { useBlocksGeojson } from '../../../../api/blocks';
import { BlockMap } from '../../../../components/BlockMap';
import { LoadError } from '../../../../components/LoadError';
import { rewindForD3 } from '../../../../lib/geo/rewind';
import { type CoverageFeature, useCoverage } from '../api';
import { formatLocation } from '../siteList';

function CoverageDrawing({ site, coverage }: { site: SiteView; coverage: CoverageFeature }) {
  const blocks = useBlocksGeojson();
  const wound = useMemo<GeoPermissibleObjects[]>(
    () => [{ ...coverage, geometry: rewindForD3(coverage.geometry) }],
    [coverage],
  );
  if (blocks.isPending) return <InlineLoading description="Loading block outlines" />;
  if (blocks.isError)
    return <LoadError what="the block outlines" error={blocks.error} onRetry={blocks.refetch} />;
  return (
    <BlockMap
      blocks={blocks.data}
      label={`Coverage of ${site.code} over the blocks`}
      fitAlso={wound}
      overlay={(map) => {
        const radar = map.point(site.lon, site.lat);
        return (
          <>
            <path className="map-overlay__coverage" d={map.path(wound[0])} />
            {radar ? (
              <g className="map-overlay__marker" transform={`translate(${radar[0]} ${radar[1]})`}>
                <title>{`Radar ${site.code} at ${formatLocation(site.lat, site.lon)}`}</title>
                <path d="M0,-9 L7,6 L-7,6 Z" />
                <text y={20} textAnchor="middle">
                  {site.code}
                </text>
              </g>
            ) : null}
          </>
        );
      }}
    />
  );
}

/** A site's coverage (range ring less blocked sectors) drawn over the blocks, with the radar marked. */
export function CoverageMap({ sites }: { sites: SiteView[] }) {
  const [chosenId, setChosenId] = useState<number | null>(null);
  const site = sites.find((s) => s.id === chosenId) ?? sites[0] ?? null;
  const coverage = useCoverage(site?.id ?? null);
  if (!site) return <p>The map appears once a site has been added.</p>;
  return (
    <div className="form-stack">
      <Select
        id="coverage-site"
        className="narrow-field"
        labelText="Site on the map"
        value={String(site.id)}
        onChange={(e) => setChosenId(Number(e.target.value))}
      >
        {sites.map((s) => (
          <SelectItem key={s.id} value={String(s.id)} text={`${s.code} — ${s.name}`} />
        ))}
      </Select>
      <p className="cds--label-description">
        The dashed outline is where {site.code} sees: {site.rangeKm} km around the radar, less{' '}
        {site.blockedSectors.length === 0
          ? 'no blocked sectors'
          : `${site.blockedSectors.length} blocked ${site.blockedSectors.length === 1 ? 'sector' : 'sectors'}`}
        .
      </p>
      {coverage.isPending ? <InlineLoading description="Loading the coverage" /> : null}
      {coverage.isError ? (
        <LoadError what="the coverage" error={coverage.error} onRetry={coverage.refetch} />
      ) : null}
      {coverage.isSuccess ? <CoverageDrawing site={site} coverage={coverage.data} /> : null}
    </div>
  );
}
