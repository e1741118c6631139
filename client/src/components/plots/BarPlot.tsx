import { scaleBand, scaleLinear } from 'd3-scale';
import { useId, useMemo } from 'react';
import { innerSize, labelledIndexes, MARGIN } from './plotFrame';

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
  const summaryId = useId();
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
    <figure className="plot">
      <svg role="img" aria-label={label} aria-describedby={summaryId} viewBox={`0 0 ${width} ${height}`}>
        <g transform={`translate(${MARGIN.left} ${MARGIN.top})`}>
          {y.ticks(5).map((t) => (
            <g key={t} className="plot__tick" transform={`translate(0 ${y(t)})`}>
              <line x2={w} className="plot__grid" />
              <text x={-6} dy="0.32em" textAnchor="end">
                {formatValue(t)}
              </text>
            </g>
          ))}
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
          <line className="plot__axis" x2={w} y1={h} y2={h} />
          <line className="plot__axis" y2={h} />
          <text className="plot__title" x={w / 2} y={h + 36} textAnchor="middle">
            {xLabel}
          </text>
          <text className="plot__title" transform={`translate(-44 ${h / 2}) rotate(-90)`} textAnchor="middle">
            {yLabel}
          </text>
        </g>
      </svg>
      <figcaption id={summaryId} className="plot__summary">
        {summary}
      </figcaption>
    </figure>
  );
}
