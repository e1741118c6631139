import { InlineLoading, Select, SelectItem } from '@carbon/react';
import type { RegimeComposite } from '@stormhour/shared';
import type { GeoPermissibleObjects } from 'd3-geo';
import { useMemo } from 'react';
import { useBlocksGeojson } from '../../../api/blocks';
import { BlockMap, type MapProjector } from '../../../components/BlockMap';
import { LoadError } from '../../../components/LoadError';
import type { BlockFeatureCollection } from '../../../lib/geo/blockFeatures';
import { rewindForD3 } from '../../../lib/geo/rewind';
import { type CoverageFeature, useCoverage } from '../../intake/sites/api';
import { type RegimesParams, useComposite } from '../api';
import { compositeScale, formatSigned, NO_DATA_COLOUR, type RegimeStyle } from '../regimeFormat';

const BLOCK_FILL = () => NO_DATA_COLOUR;
const speedFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1, minimumFractionDigits: 1 });

/** Half the spacing of a grid's centres, for drawing each cell around its centre. */
function halfStep(values: readonly number[]): number {
  return values.length > 1 ? Math.abs(values[1] - values[0]) / 2 : 0.125;
}

interface Drawing {
  cells: { key: string; points: string; fill: string }[];
  arrows: { key: string; d: string }[];
}

/** The strongest mean anomaly wind of the grid, m/s; arrows are drawn in proportion to it. */
function largestSpeedOf(composite: RegimeComposite): number {
  let largest = 0;
  composite.u.forEach((row, r) => {
    row.forEach((u, c) => {
      const v = composite.v[r]?.[c] ?? null;
      if (u !== null && v !== null) largest = Math.max(largest, Math.hypot(u, v));
    });
  });
  return largest;
}

/** Grid cells coloured by q′ and an arrow per cell along the anomaly wind (u east, v north). */
function drawComposite(
  composite: RegimeComposite,
  map: MapProjector,
  colour: (value: number) => string,
  largestSpeed: number,
): Drawing {
  const dLon = halfStep(composite.lons);
  const dLat = halfStep(composite.lats);
  const cells: Drawing['cells'] = [];
  const arrows: Drawing['arrows'] = [];
  composite.lats.forEach((lat, r) => {
    composite.lons.forEach((lon, c) => {
      const key = `${r}-${c}`;
      const corners = [
        map.point(lon - dLon, lat + dLat),
        map.point(lon + dLon, lat + dLat),
        map.point(lon + dLon, lat - dLat),
        map.point(lon - dLon, lat - dLat),
      ];
      if (corners.some((p) => p === null)) return;
      const pts = corners as [number, number][];
      const q = composite.q[r]?.[c] ?? null;
      if (q !== null) cells.push({ key, points: pts.map((p) => p.join(',')).join(' '), fill: colour(q) });
      const u = composite.u[r]?.[c] ?? null;
      const v = composite.v[r]?.[c] ?? null;
      const centre = map.point(lon, lat);
      if (u === null || v === null || centre === null || largestSpeed === 0) return;
      const speed = Math.hypot(u, v);
      if (speed === 0) return;
      const size = Math.min(Math.abs(pts[1][0] - pts[0][0]), Math.abs(pts[3][1] - pts[0][1]));
      const length = size * 0.85 * (speed / largestSpeed);
      // Screen y grows southward, so a northward wind points up.
      const ux = u / speed;
      const uy = -v / speed;
      const [cx, cy] = centre;
      const x0 = cx - (ux * length) / 2;
      const y0 = cy - (uy * length) / 2;
      const x1 = cx + (ux * length) / 2;
      const y1 = cy + (uy * length) / 2;
      const head = Math.max(1.5, length * 0.35);
      const back = (angle: number) => {
        const cos = Math.cos(angle);
        const sin = Math.sin(angle);
        return [x1 - head * (ux * cos - uy * sin), y1 - head * (ux * sin + uy * cos)];
      };
      const [lx, ly] = back(0.45);
      const [rx, ry] = back(-0.45);
      arrows.push({
        key,
        d: `M${x0.toFixed(1)},${y0.toFixed(1)}L${x1.toFixed(1)},${y1.toFixed(1)}M${lx.toFixed(1)},${ly.toFixed(1)}L${x1.toFixed(1)},${y1.toFixed(1)}L${rx.toFixed(1)},${ry.toFixed(1)}`,
      });
    });
  });
  return { cells, arrows };
}

function CompositeDrawing({
  regime,
  composite,
  blocks,
  coverage,
}: {
  regime: string;
  composite: RegimeComposite;
  blocks: BlockFeatureCollection;
  coverage: CoverageFeature | null;
}) {
  const scale = useMemo(() => compositeScale(composite.q), [composite]);
  const wound = useMemo<GeoPermissibleObjects[]>(
    () => (coverage ? [{ ...coverage, geometry: rewindForD3(coverage.geometry) }] : []),
    [coverage],
  );
  const outlines = useMemo(
    () =>
      blocks.features
        .filter((f) => f.geometry !== null)
        .map((f) => ({ id: f.properties.id, feature: { ...f, geometry: rewindForD3(f.geometry) } })),
    [blocks],
  );
  const largestSpeed = useMemo(() => largestSpeedOf(composite), [composite]);

  return (
    <figure className="composite">
      <BlockMap
        blocks={blocks}
        label={`Composite of ${regime}`}
        fillOf={BLOCK_FILL}
        fitAlso={wound}
        overlay={(map) => {
          const drawing = drawComposite(composite, map, scale.colour, largestSpeed);
          return (
            <>
              {drawing.cells.map((c) => (
                <polygon key={c.key} className="composite__cell" points={c.points} fill={c.fill} />
              ))}
              {outlines.map((o) => (
                <path key={o.id} className="composite__block" d={map.path(o.feature)} />
              ))}
              {wound[0] ? <path className="map-overlay__coverage" d={map.path(wound[0])} /> : null}
              {drawing.arrows.map((a) => (
                <path key={a.key} className="composite__arrow" d={a.d} />
              ))}
            </>
          );
        }}
      />
      <figcaption className="composite__legend">
        <p>
          Mean of {composite.days} {composite.days === 1 ? 'day' : 'days'} classed {regime}. Colour: q′, the
          specific humidity anomaly; arrows: the anomaly wind, pointing where it blows to, the longest{' '}
          {speedFormat.format(largestSpeed)} m/s. The dashed line is the radar coverage.
        </p>
        <ul className="map-legend" aria-label="q′ colours (g/kg)">
          {scale.classes.map((c) => (
            <li key={c.colour}>
              <span className="map-legend__swatch" style={{ background: c.colour }} aria-hidden="true" />
              {`${formatSigned(c.from)} to ${formatSigned(c.to)} g/kg`}
            </li>
          ))}
        </ul>
      </figcaption>
    </figure>
  );
}

interface CompositeMapProps {
  params: RegimesParams;
  styles: RegimeStyle[];
  regime: string | null;
  onRegime: (regime: string) => void;
}

/** The mean q′ and anomaly wind over the days of one regime, drawn over the blocks. */
export function CompositeMap({ params, styles, regime, onRegime }: CompositeMapProps) {
  const blocks = useBlocksGeojson();
  const coverage = useCoverage(params.siteId);
  const chosen = regime && styles.some((s) => s.regime === regime) ? regime : (styles[0]?.regime ?? null);
  const composite = useComposite(chosen ? { ...params, regime: chosen } : null);

  if (!chosen) return <p>The composite appears once days have been classified.</p>;
  return (
    <div className="form-stack">
      <Select
        id="composite-regime"
        className="narrow-field"
        labelText="Regime for the composite"
        value={chosen}
        onChange={(e) => onRegime(e.target.value)}
      >
        {styles.map((s) => (
          <SelectItem key={s.regime} value={s.regime} text={s.regime} />
        ))}
      </Select>
      {blocks.isError ? (
        <LoadError what="the block outlines" error={blocks.error} onRetry={blocks.refetch} />
      ) : null}
      {composite.isError ? (
        <LoadError what="the composite" error={composite.error} onRetry={composite.refetch} />
      ) : null}
      {blocks.isPending || composite.isPending ? <InlineLoading description="Loading the composite" /> : null}
      {blocks.isSuccess && composite.isSuccess ? (
        <CompositeDrawing
          regime={composite.data.regime}
          composite={composite.data}
          blocks={blocks.data}
          coverage={coverage.data ?? null}
        />
      ) : null}
    </div>
  );
}
