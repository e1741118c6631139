import type { RegimeDay, RegimeSettings } from '@stormhour/shared';
import { extent } from 'd3-array';
import { scaleLinear } from 'd3-scale';
import { useMemo } from 'react';
import { BottomTicks, PlotAxes, PlotFigure } from '../../../components/plots/PlotFigure';
import { innerSize } from '../../../components/plots/plotFrame';
import {
  colourOf,
  compassWord,
  formatDay,
  formatQ,
  formatSigned,
  formatWind,
  isWeak,
  type RegimeStyle,
} from '../regimeFormat';

interface FlowScatterProps {
  days: RegimeDay[];
  settings: RegimeSettings;
  bounds: [number, number] | null;
  styles: RegimeStyle[];
  width?: number;
  height?: number;
}

const DIRECTION_TICKS = [0, 90, 180, 270, 360];

/** The parts of the 0–360° axis a sector covers; a sector across north is split in two. */
function sectorSpans(fromDeg: number, toDeg: number): [number, number][] {
  if (fromDeg < toDeg) return [[fromDeg, toDeg]];
  return [
    [fromDeg, 360],
    [0, toDeg],
  ];
}

/** Each day's q′ against the direction its anomaly wind blew from, over the classes' boundaries. */
export function FlowScatter({ days, settings, bounds, styles, width = 720, height = 340 }: FlowScatterProps) {
  const { w, h } = innerSize({ width, height });
  const drawing = useMemo(() => {
    const placed = days.filter(
      (d): d is RegimeDay & { q: number; directionFromDeg: number } =>
        d.q !== null && d.directionFromDeg !== null,
    );
    const [low = -1, high = 1] = extent([...placed.map((d) => d.q), ...(bounds ?? [])]);
    const pad = Math.max(0.1, (high - low) * 0.05);
    const x = scaleLinear()
      .domain([low - pad, high + pad])
      .nice()
      .range([0, w]);
    const y = scaleLinear().domain([0, 360]).range([h, 0]);
    return { placed, x, y };
  }, [days, bounds, w, h]);
  const { placed, x, y } = drawing;
  const weakCount = placed.filter((d) => isWeak(d, settings)).length;
  const [left, right] = x.range();
  const regions = bounds
    ? [
        { name: 'dry', from: left, to: x(bounds[0]) },
        { name: 'near normal', from: x(bounds[0]), to: x(bounds[1]) },
        { name: 'moist', from: x(bounds[1]), to: right },
      ]
    : [];

  return (
    <PlotFigure
      label="Days by moisture and flow"
      summary={`${placed.length} days with both anomalies. Bands mark the flow sectors by the direction the anomaly wind blows from; dashed lines are the moisture bounds. ${weakCount} days with the wind anomaly below ${settings.weakBelowMs} m/s are drawn hollow (flow class weak).`}
      xLabel="q′, specific humidity anomaly (g/kg)"
      yLabel="Wind anomaly from (°, clockwise from north)"
      width={width}
      height={height}
    >
      {settings.sectors.map((sector, i) => {
        const spans = sectorSpans(sector.fromDeg, sector.toDeg);
        const widest = spans.reduce((a, b) => (b[1] - b[0] > a[1] - a[0] ? b : a));
        return (
          <g key={sector.name} className={i % 2 === 0 ? 'scatter__band' : 'scatter__band scatter__band--alt'}>
            <title>{`${sector.name}: from ${sector.fromDeg}° to ${sector.toDeg}°`}</title>
            {spans.map(([from, to]) => (
              <rect key={from} x={0} width={w} y={y(to)} height={y(from) - y(to)} />
            ))}
            <text
              className="scatter__label"
              x={w - 6}
              y={y((widest[0] + widest[1]) / 2)}
              dy="0.32em"
              textAnchor="end"
            >
              {sector.name}
            </text>
          </g>
        );
      })}
      {DIRECTION_TICKS.map((t) => (
        <g key={t} className="plot__tick" transform={`translate(0 ${y(t)})`}>
          <line x1={-5} />
          <text x={-8} dy="0.32em" textAnchor="end">
            {`${t}°`}
            <title>{`${t}°, from the ${compassWord(t)}`}</title>
          </text>
        </g>
      ))}
      <BottomTicks ticks={x.ticks(6)} x={x} h={h} format={(t) => (t === 0 ? '0' : formatSigned(t))} />
      {bounds ? (
        <g className="scatter__bounds">
          {bounds.map((b) => (
            <line key={b} x1={x(b)} x2={x(b)} y1={-14} y2={h}>
              <title>{`Moisture bound at ${formatQ(b)}`}</title>
            </line>
          ))}
          {regions.map((r) => (
            <text key={r.name} className="scatter__region" x={(r.from + r.to) / 2} y={-4} textAnchor="middle">
              {r.name}
            </text>
          ))}
        </g>
      ) : null}
      <PlotAxes w={w} h={h} />
      {placed.map((d) => {
        const colour = colourOf(styles, d.regime);
        const weak = isWeak(d, settings);
        return (
          <circle
            key={d.date}
            className="scatter__day"
            cx={x(d.q)}
            cy={y(d.directionFromDeg)}
            r={weak ? 3.5 : 4}
            fill={weak ? 'none' : colour}
            stroke={colour}
            strokeWidth={weak ? 1.75 : 1}
          >
            <title>{`${formatDay(d.date)}: ${d.regime ?? 'no regime'}\nq′ ${formatQ(d.q)}\nWind anomaly ${formatWind(d.speedMs, d.directionFromDeg)}`}</title>
          </circle>
        );
      })}
    </PlotFigure>
  );
}
