import { colors } from '@carbon/colors';
import { Button, InlineLoading } from '@carbon/react';
import { DEFAULT_AXIS } from '@stormhour/shared';
import { scaleLinear, scaleQuantize } from 'd3-scale';
import { useRef, useState } from 'react';
import { LoadError } from '../../../components/LoadError';
import { PlotAxes, PlotFigure } from '../../../components/plots/PlotFigure';
import { innerSize } from '../../../components/plots/plotFrame';
import { type AxisParams, type TimeDistanceParams, useAtlasTimeDistance } from '../api';
import { ExportBar } from './ExportBar';
import { NumberField } from './NumberField';
import { AtlasBaseMap, AxisOverlay } from './OnsetMapView';
import { ScopeLine } from './ScopeLine';

const RAMP = [
  colors.teal[10],
  colors.teal[20],
  colors.teal[30],
  colors.teal[40],
  colors.teal[50],
  colors.teal[60],
  colors.teal[70],
  colors.teal[80],
];
const WIDTH = 760;
const HEIGHT = 340;
const rate = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: 2 });

function HeatGrid({
  perDay,
  distancesKm,
  stepKm,
}: {
  perDay: number[][];
  distancesKm: number[];
  stepKm: number;
}) {
  const { w, h } = innerSize({ width: WIDTH, height: HEIGHT });
  const top = Math.max(0, ...perDay.flat());
  const x = scaleLinear().domain([0, 48]).range([0, w]);
  const far = distancesKm.length * stepKm;
  const y = scaleLinear().domain([0, far]).range([h, 0]);
  const colour = scaleQuantize<string>()
    .domain([0, top || 1])
    .range(RAMP);
  return (
    <PlotFigure
      label="Onsets by local time and distance along the axis"
      summary="Onsets per day in each hour of the local day (drawn twice, 0–48 h) and each distance along the axis from A."
      xLabel="Local time (h), the day drawn twice"
      yLabel="Distance from A (km)"
      width={WIDTH}
      height={HEIGHT}
    >
      {perDay.map((row, r) =>
        [0, 24].flatMap((shift) =>
          row.map((v, hr) => (
            <rect
              // biome-ignore lint/suspicious/noArrayIndexKey: hours of the day are fixed positions, never reordered.
              key={`${distancesKm[r]}km-${shift + hr}h`}
              x={x(shift + hr)}
              y={y(distancesKm[r] + stepKm)}
              width={x(1) - x(0) + 0.2}
              height={y(0) - y(stepKm) + 0.2}
              fill={v > 0 ? colour(v) : colors.gray[10]}
            >
              <title>{`${distancesKm[r]}–${distancesKm[r] + stepKm} km, ${hr}–${hr + 1} h: ${rate.format(v)} per day`}</title>
            </rect>
          )),
        ),
      )}
      {[0, 6, 12, 18, 24, 30, 36, 42, 48].map((hr) => (
        <text key={hr} className="plot__tick" x={x(hr)} y={h + 16} textAnchor="middle">
          {hr % 24 === 0 && hr > 0 ? `${hr} (0)` : hr}
        </text>
      ))}
      {y.ticks(6).map((km) => (
        <text key={km} className="plot__tick" x={-6} y={y(km)} dy="0.32em" textAnchor="end">
          {km}
        </text>
      ))}
      <line x1={x(24)} x2={x(24)} y2={h} stroke={colors.gray[70]} strokeDasharray="4 3" />
      <PlotAxes w={w} h={h} />
    </PlotFigure>
  );
}

function AxisForm({ axis, onAxis }: { axis: AxisParams; onAxis: (a: Partial<AxisParams>) => void }) {
  const field = (id: keyof AxisParams, label: string, min: number, max: number, step: number) => (
    <NumberField
      id={`atlas-axis-${id}`}
      label={label}
      min={min}
      max={max}
      step={step}
      value={axis[id]}
      onCommit={(v) => onAxis({ [id]: v })}
    />
  );
  return (
    <fieldset className="atlas-axis-form">
      <legend className="cds--label">Axis (A → B) and corridor</legend>
      {field('fromLat', 'A latitude (°N)', -90, 90, 0.05)}
      {field('fromLon', 'A longitude (°E)', -180, 180, 0.05)}
      {field('toLat', 'B latitude (°N)', -90, 90, 0.05)}
      {field('toLon', 'B longitude (°E)', -180, 180, 0.05)}
      {field('halfWidthKm', 'Corridor half-width (km)', 1, 200, 5)}
      <Button kind="tertiary" size="sm" onClick={() => onAxis({ ...DEFAULT_AXIS })}>
        Default axis (south to north across the hills)
      </Button>
    </fieldset>
  );
}

export function TimeDistanceView({
  params,
  onAxis,
}: {
  params: TimeDistanceParams;
  onAxis: (a: Partial<AxisParams>) => void;
}) {
  const result = useAtlasTimeDistance(params);
  const figure = useRef<HTMLDivElement>(null);
  // The first click sets A, the second B.
  const [pending, setPending] = useState<[number, number] | null>(null);
  return (
    <div className="form-stack">
      <div className="atlas-columns">
        <div>
          <p className="atlas-note">
            {pending
              ? 'Click the map again to place B, the axis’s end.'
              : 'Click the map twice to draw an axis (A, then B), or type its ends.'}
          </p>
          <AtlasBaseMap
            siteId={params.siteId}
            label="Map for drawing the time–distance axis"
            overlay={(map) => <AxisOverlay map={map} axis={params} />}
            onPick={(lon, lat) => {
              const round = (v: number) => Math.round(v * 1000) / 1000;
              if (!pending) setPending([round(lon), round(lat)]);
              else {
                onAxis({ fromLon: pending[0], fromLat: pending[1], toLon: round(lon), toLat: round(lat) });
                setPending(null);
              }
            }}
          />
        </div>
        <AxisForm axis={params} onAxis={onAxis} />
      </div>
      {result.isError ? (
        <LoadError what="the time–distance diagram" error={result.error} onRetry={result.refetch} />
      ) : null}
      {result.isPending ? <InlineLoading description="Placing onsets along the axis" /> : null}
      {result.data ? (
        <>
          <ScopeLine scope={result.data.scope} />
          {result.data.inCorridor === 0 ? <p className="atlas-empty">No onsets in the corridor.</p> : null}
          <div ref={figure}>
            <HeatGrid
              perDay={result.data.perDay}
              distancesKm={result.data.distancesKm}
              stepKm={result.data.stepKm}
            />
          </div>
          <p className="atlas-note">
            {result.data.inCorridor} onsets within {result.data.halfWidthKm} km of the{' '}
            {Math.round(result.data.axis.lengthKm)} km axis, in {result.data.stepKm} km steps from A; colour:
            onsets per day ({result.data.scope.days} days), darker is more, up to{' '}
            {rate.format(Math.max(0, ...result.data.perDay.flat()))}. The local day is drawn twice so that a
            cycle crossing midnight reads as one.
          </p>
          <ExportBar
            what="time–distance diagram"
            fileName="atlas-time-distance"
            figure={figure}
            rows={() =>
              result.data.counts.flatMap((row, r) =>
                row.map((n, hr) => ({
                  distance_from_km: result.data.distancesKm[r],
                  distance_to_km: result.data.distancesKm[r] + result.data.stepKm,
                  local_hour: hr,
                  onsets: n,
                  per_day: result.data.perDay[r][hr],
                })),
              )
            }
          />
        </>
      ) : null}
    </div>
  );
}
