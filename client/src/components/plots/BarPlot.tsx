import { scaleBand, scaleLinear } from 'd3-scale';
import { useMemo } from 'react';
import { PlotAxes, PlotFigure, ValueGrid } from './PlotFigure';
import { innerSize, labelledIndexes } from './plotFrame';

export interface Bar {
  key: string;
  /** Printed under the bar when there is room. */
  label: string;
  value: number;
}

interface BarPlotProps {
  bars: Bar[];
  label: string;
  xLabel: string;
  yLabel: string;
  /** Top of the value axis (100 for percentages). */
  max: number;
  /** A rule across the plot, e.g. the share a day needs to count; bars below it are set apart. */
  threshold?: { value: number; label: string };
  /** What the plot shows, in a sentence, for those who cannot see it. */
  summary: string;
  formatValue: (value: number) => string;
  width?: number;
  height?: number;
}

export function BarPlot({
  bars,
  label,
  xLabel,
  yLabel,
  max,
  threshold,
  summary,
  formatValue,
  width = 480,
  height = 220,
}: BarPlotProps) {
  const { w, h } = innerSize({ width, height });
  const { x, y } = useMemo(
    () => ({
      x: scaleBand<string>()
        .domain(bars.map((b) => b.key))
        .range([0, w])
        .paddingInner(0.15),
      y: scaleLinear().domain([0, max]).range([h, 0]),
    }),
    [bars, w, h, max],
  );
  const labelled = new Set(labelledIndexes(bars.length, 6));

  return (
    <PlotFigure label={label} summary={summary} xLabel={xLabel} yLabel={yLabel} width={width} height={height}>
      <ValueGrid ticks={y.ticks(5)} y={y} width={w} format={formatValue} />
      {bars.map((bar, i) => {
        const below = threshold !== undefined && bar.value < threshold.value;
        return (
          <g key={bar.key}>
            <rect
              className={below ? 'plot__bar plot__bar--below' : 'plot__bar'}
              x={x(bar.key)}
              y={y(bar.value)}
              width={x.bandwidth()}
              height={Math.max(0, h - y(bar.value))}
            >
              <title>{`${bar.label}: ${formatValue(bar.value)}`}</title>
            </rect>
            {labelled.has(i) ? (
              <text
                className="plot__tick"
                x={(x(bar.key) ?? 0) + x.bandwidth() / 2}
                y={h + 17}
                textAnchor="middle"
              >
                {bar.label}
              </text>
            ) : null}
          </g>
        );
      })}
      {threshold ? (
        <g className="plot__rule">
          <line x2={w} y1={y(threshold.value)} y2={y(threshold.value)} />
          {/* The rule's name sits above the plot area, where no bar can cover it. */}
          <line x1={w - 168} x2={w - 146} y1={-8} y2={-8} />
          <text x={w} y={-4} textAnchor="end">
            {threshold.label}
          </text>
        </g>
      ) : null}
      <PlotAxes w={w} h={h} />
    </PlotFigure>
  );
}
