import { geoMercator, geoPath } from 'd3-geo';
import type { Feature, MultiPolygon, Polygon } from 'geojson';
import { useMemo, useState } from 'react';
import type { BlockFeatureCollection, BlockFeatureProperties } from '../lib/geo/blockFeatures';
import { coloursForGroups } from '../lib/geo/groupColours';
import { groupLabelPositions } from '../lib/geo/labelPositions';
import { rewindForD3 } from '../lib/geo/rewind';

type BlockFeature = Feature<Polygon | MultiPolygon, BlockFeatureProperties>;

export interface BlockMapProps {
  blocks: BlockFeatureCollection;
  /** Accessible name of the whole map. */
  label?: string;
  /** Fill of one block; by default each district gets its own palette colour. */
  fillOf?: (block: BlockFeatureProperties) => string;
  /** Extra line under the block's name in its tooltip and readout (e.g. a probability). */
  describe?: (block: BlockFeatureProperties) => string | null;
  width?: number;
  height?: number;
}

interface DrawnBlock {
  key: number;
  d: string;
  fill: string;
  props: BlockFeatureProperties;
}

function useDrawing(
  blocks: BlockFeatureCollection,
  width: number,
  height: number,
  fillOf?: BlockMapProps['fillOf'],
) {
  return useMemo(() => {
    const features = blocks.features
      .filter((f): f is BlockFeature => f.geometry !== null)
      .map((f) => ({ ...f, geometry: rewindForD3(f.geometry) }));
    const collection = { type: 'FeatureCollection' as const, features };
    const projection = geoMercator().fitExtent(
      [
        [8, 8],
        [width - 8, height - 8],
      ],
      collection,
    );
    const path = geoPath(projection);
    const colours = coloursForGroups(features.map((f) => f.properties.districtCode));
    const drawn: DrawnBlock[] = features.map((f) => ({
      key: f.properties.id,
      d: path(f) ?? '',
      fill: fillOf ? fillOf(f.properties) : (colours.get(f.properties.districtCode) ?? 'gray'),
      props: f.properties,
    }));
    const labels = groupLabelPositions(
      features.map((f) => {
        const [x, y] = path.centroid(f);
        return { group: f.properties.districtName, x, y, weight: path.area(f) };
      }),
    );
    const legend = [...colours].map(([code, colour]) => ({
      code,
      colour,
      name: features.find((f) => f.properties.districtCode === code)?.properties.districtName ?? code,
    }));
    return { drawn, labels, legend };
  }, [blocks, width, height, fillOf]);
}

function tooltipOf(block: BlockFeatureProperties, extra: string | null): string {
  const lines = [`${block.name} (${block.code})`, `District: ${block.districtName}`];
  if (extra) lines.push(extra);
  return lines.join('\n');
}

/**
 * Block outlines drawn from GeoJSON with no background tiles, so it works offline. Each block can be
 * focused by keyboard; the one under the pointer or focus is described beside the map.
 */
export function BlockMap({
  blocks,
  label = 'Map of blocks',
  fillOf,
  describe,
  width = 720,
  height = 480,
}: BlockMapProps) {
  const { drawn, labels, legend } = useDrawing(blocks, width, height, fillOf);
  const [activeId, setActiveId] = useState<number | null>(null);
  const active = drawn.find((b) => b.key === activeId)?.props ?? null;

  return (
    <div className="map-panel">
      <div>
        <svg
          className="block-map"
          role="img"
          aria-label={label}
          viewBox={`0 0 ${width} ${height}`}
          onMouseLeave={() => setActiveId(null)}
        >
          {drawn.map((block) => (
            // biome-ignore lint/a11y/noStaticElementInteractions: each block takes focus so keyboard users can read it as pointer users do.
            <path
              key={block.key}
              aria-label={`${block.props.name} (${block.props.code}), ${block.props.districtName}`}
              d={block.d}
              fill={block.fill}
              tabIndex={0}
              className={block.key === activeId ? 'is-active' : undefined}
              onMouseEnter={() => setActiveId(block.key)}
              onFocus={() => setActiveId(block.key)}
              onBlur={() => setActiveId((id) => (id === block.key ? null : id))}
            >
              <title>{tooltipOf(block.props, describe?.(block.props) ?? null)}</title>
            </path>
          ))}
          {labels.map((l) => (
            <text key={l.group} className="block-map__label" x={l.x} y={l.y} textAnchor="middle">
              {l.group}
            </text>
          ))}
        </svg>
        {fillOf ? null : (
          <ul className="map-legend" aria-label="Districts on the map">
            {legend.map((item) => (
              <li key={item.code}>
                <span className="map-legend__swatch" style={{ background: item.colour }} aria-hidden="true" />
                {item.name}
              </li>
            ))}
          </ul>
        )}
      </div>
      <aside className="map-readout" aria-live="polite" aria-label="Selected block">
        {active ? (
          <dl>
            <dt>Block</dt>
            <dd>{active.name}</dd>
            <dt>Code</dt>
            <dd className="mono">{active.code}</dd>
            <dt>District</dt>
            <dd>{active.districtName}</dd>
            {describe?.(active) ? (
              <>
                <dt>Value</dt>
                <dd>{describe(active)}</dd>
              </>
            ) : null}
          </dl>
        ) : (
          <p>Point at a block, or move to it with the Tab key, to see its name, code and district.</p>
        )}
      </aside>
    </div>
  );
}
