import { extent, max, min } from 'd3-array';
import { scaleLinear, scaleUtc } from 'd3-scale';
import { line } from 'd3-shape';
import { useMemo } from 'react';
import { BottomTicks, PlotAxes, PlotFigure, ValueGrid } from './PlotFigure';
import { innerSize } from './plotFrame';

export interface TimePoint {
  time: string;
  value: number | null;
}

interface TimeSeriesPlotProps {
  points: TimePoint[];
  /** Accessible name of the plot. */
  label: string;
  /** Axis titles with their units. */
  xLabel: string;
  yLabel: string;
  formatTime: (time: Date) => string;
  /** What the plot shows, in a sentence, for those who cannot see it. */
  summary: string;
  width?: number;
  height?: number;
}

/** A line over time with dots at each value; gaps (null) break the line. */
export function TimeSeriesPlot({
  points,
  label,
  xLabel,
  yLabel,
  formatTime,
  summary,
  width = 480,
  height = 220,
}: TimeSeriesPlotProps) {
  const { w, h } = innerSize({ width, height });
  const drawing = useMemo(() => {
    const dated = points.map((p) => ({ at: new Date(p.time), value: p.value }));
    const [first, last] = extent(dated, (p) => p.at);
    const x = scaleUtc()
      .domain(first && last ? [first, last] : [new Date(0), new Date(1)])
      .range([0, w]);
    const low = Math.min(0, min(dated, (p) => p.value) ?? 0);
    const y = scaleLinear()
      .domain([low, max(dated, (p) => p.value) ?? 1])
      .nice()
      .range([h, 0]);
    const path = line<(typeof dated)[number]>()
      .defined((p) => p.value !== null)
      .x((p) => x(p.at))
      .y((p) => y(p.value ?? 0));
    return { dated, x, y, d: path(dated) ?? '' };
  }, [points, w, h]);
  const { dated, x, y, d } = drawing;

  return (
    <PlotFigure label={label} summary={summary} xLabel={xLabel} yLabel={yLabel} width={width} height={height}>
      <ValueGrid ticks={y.ticks(4)} y={y} width={w} />
      <BottomTicks ticks={x.ticks(5)} x={x} h={h} format={formatTime} />
      <PlotAxes w={w} h={h} />
      <path className="plot__line" d={d} />
      {dated.map((p) =>
        p.value === null ? null : (
          <circle key={p.at.getTime()} className="plot__dot" cx={x(p.at)} cy={y(p.value)} r={2.5} />
        ),
      )}
    </PlotFigure>
  );
}
