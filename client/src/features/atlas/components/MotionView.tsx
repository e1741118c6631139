import { colors } from '@carbon/colors';
import { InlineLoading, RadioButton, RadioButtonGroup } from '@carbon/react';
import type { AtlasMotionResponse } from '@stormhour/shared';
import { scaleSqrt } from 'd3-scale';
import { arc } from 'd3-shape';
import { useRef, useState } from 'react';
import { LoadError } from '../../../components/LoadError';
import { type AtlasParams, useAtlasMotion } from '../api';
import { ExportBar } from './ExportBar';
import { ScopeLine } from './ScopeLine';

const SPEED_COLOURS = [colors.blue[20], colors.blue[40], colors.blue[60], colors.blue[80], colors.blue[100]];
const SIZE = 420;
const R = 160;
const pct = new Intl.NumberFormat('en-GB', { style: 'percent', maximumFractionDigits: 1 });
const one = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1, minimumFractionDigits: 1 });

function speedLabel(edges: number[], k: number) {
  return k === edges.length - 1 ? `≥ ${edges[k]} m/s` : `${edges[k]}–${edges[k + 1]} m/s`;
}

function Rose({ data, share }: { data: AtlasMotionResponse; share: boolean }) {
  const total = Math.max(1, data.withMotion);
  const value = (n: number) => (share ? n / total : n);
  const top = Math.max(1e-9, ...data.sectors.map((s) => value(s.total)));
  const r = scaleSqrt().domain([0, top]).range([0, R]);
  const half = Math.PI / 16;
  const wedge = arc<{ inner: number; outer: number; centre: number }>()
    .innerRadius((d) => d.inner)
    .outerRadius((d) => d.outer)
    .startAngle((d) => d.centre - half)
    .endAngle((d) => d.centre + half)
    .padAngle(0.01);
  const wind = data.anomalyWind;
  const toward = wind ? (wind.towardDeg * Math.PI) / 180 : 0;
  const tip = [Math.sin(toward) * R * 0.95, -Math.cos(toward) * R * 0.95];
  const rings = [0.25, 0.5, 0.75, 1].map((f) => top * f);
  return (
    <figure className="plot">
      <svg role="img" aria-label="Rose of storm motion" viewBox={`${-SIZE / 2} ${-SIZE / 2} ${SIZE} ${SIZE}`}>
        <defs>
          <marker
            id="atlas-arrowhead"
            viewBox="0 0 10 10"
            refX="8"
            refY="5"
            markerWidth="7"
            markerHeight="7"
            orient="auto-start-reverse"
          >
            <path d="M0,0L10,5L0,10z" fill={colors.red[60]} />
          </marker>
        </defs>
        {rings.map((v) => (
          <g key={v}>
            <circle r={r(v)} fill="none" stroke={colors.gray[30]} />
            <text x={3} y={-r(v) - 2} fontSize={10} fill={colors.gray[70]}>
              {share ? pct.format(v) : Math.round(v)}
            </text>
          </g>
        ))}
        {['N', 'E', 'S', 'W'].map((name, k) => (
          <text
            key={name}
            x={Math.sin((k * Math.PI) / 2) * (R + 18)}
            y={-Math.cos((k * Math.PI) / 2) * (R + 18)}
            textAnchor="middle"
            dominantBaseline="middle"
            fontSize={12}
            fontWeight={600}
            fill={colors.gray[100]}
          >
            {name}
          </text>
        ))}
        {data.sectors.map((s) => {
          let cumulative = 0;
          const centre = (s.centreDeg * Math.PI) / 180;
          return (
            <g key={s.name}>
              <title>{`Toward ${s.name}: ${s.total} onsets (${pct.format(s.total / total)})`}</title>
              {s.counts.map((n, k) => {
                const inner = r(value(cumulative));
                cumulative += n;
                const outer = r(value(cumulative));
                return n > 0 ? (
                  <path
                    key={data.speedClassesMs[k]}
                    d={wedge({ inner, outer, centre }) ?? ''}
                    fill={SPEED_COLOURS[k]}
                    stroke="white"
                    strokeWidth={0.5}
                  />
                ) : null;
              })}
            </g>
          );
        })}
        {wind && wind.speedMs > 0 ? (
          <line
            x1={0}
            y1={0}
            x2={tip[0]}
            y2={tip[1]}
            stroke={colors.red[60]}
            strokeWidth={3}
            markerEnd="url(#atlas-arrowhead)"
          />
        ) : null}
      </svg>
      <figcaption className="plot__summary">
        Wedges point where storms moved toward (16 sectors of 22.5°), their length growing with the square
        root of the
        {share ? ' share' : ' count'} so that area reads true; colours are speed classes.
      </figcaption>
    </figure>
  );
}

export function MotionView({ params }: { params: AtlasParams }) {
  const motion = useAtlasMotion(params);
  const [share, setShare] = useState(false);
  const figure = useRef<HTMLDivElement>(null);
  const wind = motion.data?.anomalyWind ?? null;
  return (
    <div className="form-stack">
      <RadioButtonGroup
        legendText="Wedge size"
        name="atlas-rose-scale"
        valueSelected={share ? 'share' : 'count'}
        onChange={(v) => setShare(v === 'share')}
      >
        <RadioButton id="atlas-rose-count" labelText="Counts" value="count" />
        <RadioButton id="atlas-rose-share" labelText="Share of onsets" value="share" />
      </RadioButtonGroup>
      {motion.isError ? (
        <LoadError what="the motion rose" error={motion.error} onRetry={motion.refetch} />
      ) : null}
      {motion.isPending ? <InlineLoading description="Counting storm motions" /> : null}
      {motion.data ? (
        <>
          <ScopeLine scope={motion.data.scope} />
          {motion.data.withMotion === 0 ? (
            <p className="atlas-empty">No onsets with a motion match this filter.</p>
          ) : (
            <div ref={figure} className="atlas-rose">
              <Rose data={motion.data} share={share} />
            </div>
          )}
          <ul className="map-legend" aria-label="Speed classes">
            {motion.data.speedClassesMs.map((edge, k) => (
              <li key={edge}>
                <span
                  className="map-legend__swatch"
                  style={{ background: SPEED_COLOURS[k] }}
                  aria-hidden="true"
                />
                {speedLabel(motion.data.speedClassesMs, k)}
              </li>
            ))}
            <li>
              <span
                className="map-legend__swatch"
                style={{ background: colors.red[60] }}
                aria-hidden="true"
              />
              mean anomaly wind, drawn toward where it blows
            </li>
          </ul>
          <p className="atlas-note">
            {motion.data.withMotion} onsets with a motion; most moved toward {motion.data.modeSector ?? '—'}.{' '}
            {wind
              ? `The ${motion.data.scope.regime ? `regime's` : 'period’s'} mean 850 hPa anomaly wind over ${wind.days} days is ${one.format(wind.speedMs)} m/s from ${Math.round(wind.fromDeg)}° (meteorological convention), so the arrow points toward ${Math.round(wind.towardDeg)}°, the same sense as the storm directions.`
              : 'No anomaly wind for these days: upload anomaly grids under Intake.'}
          </p>
          <ExportBar
            what="motion rose"
            fileName="atlas-motion-rose"
            figure={figure}
            rows={() =>
              motion.data.sectors.map((s) => {
                const row: Record<string, string | number | null> = {
                  toward: s.name,
                  centre_deg: s.centreDeg,
                  total: s.total,
                };
                s.counts.forEach((n, k) => {
                  row[speedLabel(motion.data.speedClassesMs, k)] = n;
                });
                return row;
              })
            }
          />
        </>
      ) : null}
    </div>
  );
}
