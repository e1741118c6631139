import { colors } from '@carbon/colors';
import { Checkbox, InlineLoading } from '@carbon/react';
import type { AtlasMapResponse } from '@stormhour/shared';
import type { GeoPermissibleObjects } from 'd3-geo';
import { type ReactNode, useMemo, useRef, useState } from 'react';
import { useBlocksGeojson } from '../../../api/blocks';
import { BlockMap, type MapProjector } from '../../../components/BlockMap';
import { LoadError } from '../../../components/LoadError';
import type { BlockFeatureCollection } from '../../../lib/geo/blockFeatures';
import { rewindForD3 } from '../../../lib/geo/rewind';
import { useCoverage } from '../../intake/sites/api';
import { type AxisParams, type MapParams, useAtlasMap } from '../api';
import { binLabel } from '../atlasParams';
import { ExportBar } from './ExportBar';
import { NumberField } from './NumberField';
import { ScopeLine } from './ScopeLine';

/** Carbon's purple ramp, light to dark, for density bands (sequential; no borrowed colour scheme). */
const BAND_COLOURS = [
  colors.purple[20],
  colors.purple[30],
  colors.purple[40],
  colors.purple[50],
  colors.purple[60],
  colors.purple[70],
  colors.purple[80],
  colors.purple[90],
];
const BLOCK_FILL = () => colors.gray[10];
const densityFormat = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: 3 });

export function bandColour(index: number, count: number): string {
  if (count <= 1) return BAND_COLOURS[3];
  return BAND_COLOURS[Math.round((index / (count - 1)) * (BAND_COLOURS.length - 1))];
}

/** Block outlines, radar coverage and whatever the view lays over them, in one projection. */
export function AtlasBaseMap({
  siteId,
  label,
  overlay,
  onPick,
}: {
  siteId: number;
  label: string;
  overlay: (map: MapProjector) => ReactNode;
  /** Called with the lon/lat of a click on the map, for drawing an axis. */
  onPick?: (lon: number, lat: number) => void;
}) {
  const blocks = useBlocksGeojson();
  const coverage = useCoverage(siteId);
  const wound = useMemo<GeoPermissibleObjects[]>(
    () => (coverage.data ? [{ ...coverage.data, geometry: rewindForD3(coverage.data.geometry) }] : []),
    [coverage.data],
  );
  if (blocks.isError)
    return <LoadError what="the block outlines" error={blocks.error} onRetry={blocks.refetch} />;
  if (blocks.isPending) return <InlineLoading description="Loading the block outlines" />;
  return (
    <BaseMapDrawing blocks={blocks.data} coverage={wound} label={label} overlay={overlay} onPick={onPick} />
  );
}

function BaseMapDrawing({
  blocks,
  coverage,
  label,
  overlay,
  onPick,
}: {
  blocks: BlockFeatureCollection;
  coverage: GeoPermissibleObjects[];
  label: string;
  overlay: (map: MapProjector) => ReactNode;
  onPick?: (lon: number, lat: number) => void;
}) {
  return (
    <BlockMap
      blocks={blocks}
      label={label}
      fillOf={BLOCK_FILL}
      fitAlso={coverage}
      overlay={(map) => (
        <>
          {coverage[0] ? <path className="map-overlay__coverage" d={map.path(coverage[0])} /> : null}
          {overlay(map)}
          {onPick ? (
            // A transparent layer catches clicks for the axis; the keyboard route is the form beside the map.
            // biome-ignore lint/a11y/noStaticElementInteractions: pointer shortcut; the same is possible with the keyboard in the axis form.
            <rect
              className="atlas-pick"
              width="100%"
              height="100%"
              fill="transparent"
              onClick={(e) => {
                const svg = e.currentTarget.ownerSVGElement;
                const ctm = svg?.getScreenCTM();
                if (!svg || !ctm) return;
                const p = new DOMPoint(e.clientX, e.clientY).matrixTransform(ctm.inverse());
                const at = map.invert(p.x, p.y);
                if (at) onPick(at[0], at[1]);
              }}
            />
          ) : null}
        </>
      )}
    />
  );
}

/** The axis of the time–distance view, drawn from its first point (A) to its second (B). */
export function AxisOverlay({ map, axis }: { map: MapProjector; axis: AxisParams }) {
  const a = map.point(axis.fromLon, axis.fromLat);
  const b = map.point(axis.toLon, axis.toLat);
  if (!a || !b) return null;
  return (
    <g className="atlas-axis">
      <line x1={a[0]} y1={a[1]} x2={b[0]} y2={b[1]} stroke={colors.red[60]} strokeWidth={2} />
      <circle cx={a[0]} cy={a[1]} r={4} fill={colors.red[60]} />
      <text x={a[0] + 6} y={a[1] + 4} fill={colors.red[70]} fontSize={12} fontWeight={600}>
        A
      </text>
      <text x={b[0] + 6} y={b[1] + 4} fill={colors.red[70]} fontSize={12} fontWeight={600}>
        B
      </text>
    </g>
  );
}

function DensityOverlay({
  map,
  data,
  showBands,
  showPoints,
}: {
  map: MapProjector;
  data: AtlasMapResponse;
  showBands: boolean;
  showPoints: boolean;
}) {
  const bands = useMemo(
    () => data.density.bands.map((b) => ({ ...b, geometry: rewindForD3(b.geometry as never) })),
    [data],
  );
  return (
    <>
      {showBands
        ? bands.map((b, k) => (
            <path
              key={b.threshold}
              className="atlas-band"
              d={map.path(b.geometry as GeoPermissibleObjects)}
              // Inline style: the map's stylesheet empties the fill of every overlay path.
              style={{
                fill: bandColour(k, bands.length),
                fillOpacity: 0.55,
                stroke: bandColour(k, bands.length),
                strokeWidth: 0.5,
              }}
            />
          ))
        : null}
      {showPoints
        ? data.points.map((p) => {
            const xy = map.point(p.lon, p.lat);
            return xy ? (
              <circle
                key={p.trackId}
                cx={xy[0]}
                cy={xy[1]}
                r={1.4}
                fill={colors.gray[100]}
                fillOpacity={0.55}
              />
            ) : null;
          })
        : null}
    </>
  );
}

export function OnsetMapView({
  params,
  onBandwidth,
}: {
  params: MapParams;
  onBandwidth: (km: number) => void;
}) {
  const map = useAtlasMap(params);
  const figure = useRef<HTMLDivElement>(null);
  const [showBands, setShowBands] = useState(true);
  const [showPoints, setShowPoints] = useState(true);
  const when = params.bin === null ? 'the whole day' : binLabel(params.binHours, params.bin);
  return (
    <div className="form-stack">
      <div className="atlas-view-controls">
        <NumberField
          id="atlas-bandwidth"
          label="Kernel bandwidth (km)"
          min={2}
          max={100}
          step={1}
          value={params.bandwidthKm}
          onCommit={onBandwidth}
        />
        <Checkbox
          id="atlas-show-bands"
          labelText="Density bands"
          checked={showBands}
          onChange={(_e, { checked }) => setShowBands(checked)}
        />
        <Checkbox
          id="atlas-show-points"
          labelText="Onset points"
          checked={showPoints}
          onChange={(_e, { checked }) => setShowPoints(checked)}
        />
      </div>
      {map.isError ? <LoadError what="the onset map" error={map.error} onRetry={map.refetch} /> : null}
      {map.isPending ? <InlineLoading description="Computing the onset density" /> : null}
      {map.isFetching && !map.isPending ? <InlineLoading description="Updating" /> : null}
      {map.data ? (
        <>
          <ScopeLine scope={map.data.scope} />
          {map.data.points.length === 0 ? (
            <p className="atlas-empty">No onsets match this filter in {when}.</p>
          ) : null}
          <div ref={figure}>
            <AtlasBaseMap
              siteId={params.siteId}
              label={`Onsets and their density, ${when}`}
              overlay={(m) => (
                <DensityOverlay map={m} data={map.data} showBands={showBands} showPoints={showPoints} />
              )}
            />
          </div>
          <ul className="map-legend" aria-label="Onset density (onsets per 1000 km² per day)">
            {map.data.density.bands.map((b, k) => (
              <li key={b.threshold}>
                <span
                  className="map-legend__swatch"
                  style={{ background: bandColour(k, map.data.density.bands.length) }}
                  aria-hidden="true"
                />
                ≥ {densityFormat.format(b.threshold)}
              </li>
            ))}
          </ul>
          <p className="atlas-note">
            Density in onsets per 1000 km² per day ({map.data.scope.days} days), Gaussian kernel of bandwidth{' '}
            {map.data.bandwidthKm} km on a {map.data.density.gridKm} km grid; it integrates to{' '}
            {Math.round(map.data.density.integral)} of {map.data.points.length} onsets (the rest lies beyond
            the grid). Dots: onsets, {when} local time. Dashed line: radar coverage.
          </p>
          <ExportBar
            what="onset map"
            fileName="atlas-onset-map"
            figure={figure}
            rows={() =>
              map.data.points.map((p) => ({
                track_id: p.trackId,
                time_utc: p.time,
                local_hour: p.localHour,
                lat: p.lat,
                lon: p.lon,
                block_id: p.blockId,
                cell_type: p.cellType,
              }))
            }
          />
        </>
      ) : null}
    </div>
  );
}
