import { type ReactNode, useId } from 'react';
import { innerSize, MARGIN, type PlotSize } from './plotFrame';

interface PlotFigureProps extends PlotSize {
  /** Accessible name of the plot. */
  label: string;
  /** What the plot shows, in a sentence, for those who cannot see it. */
  summary: string;
  /** Axis titles with their units. */
  xLabel: string;
  yLabel: string;
  /** The drawing, in the plot area's coordinates (origin at its top left). */
  children: ReactNode;
}

/** The frame every plot shares: an SVG image named for screen readers, its summary and the axis titles. */
export function PlotFigure({ label, summary, xLabel, yLabel, width, height, children }: PlotFigureProps) {
  const summaryId = useId();
  const { w, h } = innerSize({ width, height });
  return (
    <figure className="plot">
      <svg role="img" aria-label={label} aria-describedby={summaryId} viewBox={`0 0 ${width} ${height}`}>
        <g transform={`translate(${MARGIN.left} ${MARGIN.top})`}>
          {children}
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

/** Horizontal grid lines with their values at the left, one per tick of the value scale. */
export function ValueGrid({
  ticks,
  y,
  width,
  format = String,
}: {
  ticks: number[];
  y: (value: number) => number;
  width: number;
  format?: (value: number) => string;
}) {
  return ticks.map((t) => (
    <g key={t} className="plot__tick" transform={`translate(0 ${y(t)})`}>
      <line x2={width} className="plot__grid" />
      <text x={-6} dy="0.32em" textAnchor="end">
        {format(t)}
      </text>
    </g>
  ));
}

/** Tick marks and their labels under the plot area, one per value of the horizontal scale. */
export function BottomTicks<T extends number | Date>({
  ticks,
  x,
  h,
  format,
}: {
  ticks: T[];
  x: (value: T) => number;
  /** The plot area's height: the ticks hang below it. */
  h: number;
  format: (value: T) => string;
}) {
  return ticks.map((t) => (
    <g key={Number(t)} className="plot__tick" transform={`translate(${x(t)} ${h})`}>
      <line y2={5} />
      <text y={17} textAnchor="middle">
        {format(t)}
      </text>
    </g>
  ));
}

/** The two axis lines along the bottom and left of the plot area. */
export function PlotAxes({ w, h }: { w: number; h: number }) {
  return (
    <>
      <line className="plot__axis" x2={w} y1={h} y2={h} />
      <line className="plot__axis" y2={h} />
    </>
  );
}
