import { type GeoPermissibleObjects, geoMercator, geoPath } from 'd3-geo';
import type { Feature, MultiPolygon, Polygon } from 'geojson';
import { type ReactNode, useMemo, useState } from 'react';
import type { BlockFeatureCollection, BlockFeatureProperties } from '../lib/geo/blockFeatures';
import { coloursForGroups } from '../lib/geo/groupColours';
import { groupLabelPositions } from '../lib/geo/labelPositions';
import { rewindForD3 } from '../lib/geo/rewind';

type BlockFeature = Feature<Polygon | MultiPolygon, BlockFeatureProperties>;

/** The map's own projection, handed to overlays so they line up with the blocks. */
export interface MapProjector {
  /** Screen position of a longitude/latitude, or null when it cannot be projected. */
  point: (lon: number, lat: number) => [x: number, y: number] | null;
  /** SVG path data of any GeoJSON object (rings wound as d3-geo expects). */
  path: (object: GeoPermissibleObjects) => string;
  /** Longitude/latitude of a point of the drawing (SVG units), e.g. where the user clicked. */
  invert: (x: number, y: number) => [lon: number, lat: number] | null;
}

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
  /**
   * GeoJSON the view must also fit besides the blocks, e.g. a radar coverage wider than the province.
   * Rings wound as d3-geo expects (see rewindForD3); keep the array stable between renders.
   */
  fitAlso?: GeoPermissibleObjects[];
  /** Drawn above the blocks in the same projection (coverage, a track's path, markers). */
  overlay?: (projector: MapProjector) => ReactNode;
  /** Called with the block's id when it is clicked, or chosen with Enter or Space while focused. */
  onPick?: (blockId: number) => void;
}

const NOTHING_MORE: GeoPermissibleObjects[] = [];

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
  fitAlso: GeoPermissibleObjects[] = NOTHING_MORE,
) {
  return useMemo(() => {
    const features = blocks.features
      .filter((f): f is BlockFeature => f.geometry !== null)
      .map((f) => ({ ...f, geometry: rewindForD3(f.geometry) }));
    // Overlays that reach beyond the blocks (a coverage wider than the province) must stay in view.
    const fitted = { type: 'FeatureCollection' as const, features: [...features, ...fitAlso.map(asFeature)] };
    const projection = geoMercator().fitExtent(
      [
        [8, 8],
        [width - 8, height - 8],
      ],
      fitted,
    );
    const path = geoPath(projection);
    const projector: MapProjector = {
      point: (lon, lat) => projection([lon, lat]),
      path: (object) => path(object) ?? '',
      invert: (x, y) => projection.invert?.([x, y]) ?? null,
    };
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
    return { drawn, labels, legend, projector };
  }, [blocks, width, height, fillOf, fitAlso]);
}

/** Wraps a bare geometry so it can sit in a FeatureCollection beside the blocks. */
function asFeature(object: GeoPermissibleObjects): Feature {
  const candidate = object as { type: string };
  if (candidate.type === 'Feature') return object as Feature;
  return { type: 'Feature', properties: {}, geometry: object as Feature['geometry'] };
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
  fitAlso,
  overlay,
  onPick,
}: BlockMapProps) {
  const { drawn, labels, legend, projector } = useDrawing(blocks, width, height, fillOf, fitAlso);
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
              onClick={onPick ? () => onPick(block.key) : undefined}
              onKeyDown={
                onPick
                  ? (e) => {
                      if (e.key === 'Enter' || e.key === ' ') {
                        e.preventDefault();
                        onPick(block.key);
                      }
                    }
                  : undefined
              }
            >
              <title>{tooltipOf(block.props, describe?.(block.props) ?? null)}</title>
            </path>
          ))}
          {labels.map((l) => (
            <text key={l.group} className="block-map__label" x={l.x} y={l.y} textAnchor="middle">
              {l.group}
            </text>
          ))}
          {overlay ? <g className="block-map__overlay">{overlay(projector)}</g> : null}
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
