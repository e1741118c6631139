import type { CellView } from '@stormhour/shared';
import type { GeoPermissibleObjects } from 'd3-geo';
import { useMemo } from 'react';
import { useBlocksGeojson } from '../../../../api/blocks';
import { BlockMap } from '../../../../components/BlockMap';
import { LoadError } from '../../../../components/LoadError';
import { trackPath } from '../trackFormat';

/** The track's path over the blocks: centroids joined in time order, the start ringed. */
export function TrackPathMap({ trackId, cells }: { trackId: number; cells: CellView[] }) {
  const blocks = useBlocksGeojson();
  const line = useMemo(() => {
    const coordinates = trackPath(cells);
    return { type: 'LineString', coordinates } as const;
  }, [cells]);
  const fit = useMemo<GeoPermissibleObjects[]>(() => [line], [line]);
  if (blocks.isPending) return <p>Loading block outlines…</p>;
  if (blocks.isError)
    return <LoadError what="the block outlines" error={blocks.error} onRetry={blocks.refetch} />;
  const [start] = line.coordinates;
  const end = line.coordinates[line.coordinates.length - 1];
  return (
    <BlockMap
      blocks={blocks.data}
      label={`Path of track ${trackId} over the blocks`}
      fitAlso={fit}
      overlay={(map) => {
        const from = start ? map.point(start[0], start[1]) : null;
        const to = end ? map.point(end[0], end[1]) : null;
        return (
          <>
            <path className="map-overlay__track" d={map.path(line)} />
            {line.coordinates.map(([lon, lat]) => {
              const at = map.point(lon, lat);
              return at ? (
                <circle key={`${lon},${lat}`} className="map-overlay__step" cx={at[0]} cy={at[1]} r={2.5} />
              ) : null;
            })}
            {to && line.coordinates.length > 1 ? (
              <circle className="map-overlay__end" cx={to[0]} cy={to[1]} r={4}>
                <title>End of the track</title>
              </circle>
            ) : null}
            {from ? (
              <g className="map-overlay__marker" transform={`translate(${from[0]} ${from[1]})`}>
                <title>Start of the track</title>
                <circle r={7} className="map-overlay__start" />
                <text y={-12} textAnchor="middle">
                  Start
                </text>
              </g>
            ) : null}
          </>
        );
      }}
    />
  );
}
