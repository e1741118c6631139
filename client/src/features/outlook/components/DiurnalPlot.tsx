import type { OutlookBlock, OutlookResponse } from '@stormhour/shared';
import { scaleBand, scaleLinear } from 'd3-scale';
import { PlotAxes, PlotFigure, ValueGrid } from '../../../components/plots/PlotFigure';
import { innerSize } from '../../../components/plots/plotFrame';
import { percent } from '../outlookFormat';

/** The chosen block's chance per bin: bars for the raw rate, whiskers for its interval, dots for the shrunk estimate. */
export function DiurnalPlot({ outlook, block }: { outlook: OutlookResponse; block: OutlookBlock }) {
  const width = 520;
  const height = 240;
  const { w, h } = innerSize({ width, height });
  const top = Math.max(0.05, ...block.bins.map((f) => f.upper ?? 0));
  const x = scaleBand<number>()
    .domain(outlook.bins.map((b) => b.index))
    .range([0, w])
    .paddingInner(0.2);
  const y = scaleLinear().domain([0, top]).range([h, 0]).nice();
  const peak = block.peakBin === null ? null : outlook.bins[block.peakBin];
  const summary = block.hasData
    ? `Chance of a storm starting in ${block.name} per ${outlook.binHours}-hour bin, local time. ` +
      outlook.bins
        .map((b) => `${b.label}: ${percent(block.bins[b.index].rate)} (n ${block.bins[b.index].n})`)
        .join('; ') +
      (peak ? `. Peak ${peak.label}.` : '.')
    : `${block.name} has no data: too little of it lies inside the radar coverage.`;
  return (
    <PlotFigure
      label={`Diurnal cycle of ${block.name}`}
      summary={summary}
      xLabel="Local time"
      yLabel="Chance of a storm starting"
      width={width}
      height={height}
    >
      <ValueGrid ticks={y.ticks(5)} y={y} width={w} format={(v) => percent(v)} />
      {outlook.bins.map((bin) => {
        const f = block.bins[bin.index];
        const left = x(bin.index) ?? 0;
        const mid = left + x.bandwidth() / 2;
        return (
          <g key={bin.index}>
            {f.rate !== null ? (
              <rect
                className="plot__bar outlook-bar"
                x={left}
                y={y(f.rate)}
                width={x.bandwidth()}
                height={Math.max(0, h - y(f.rate))}
              >
                <title>{`${bin.label}: ${percent(f.rate)}, ${f.x} of ${f.n} days`}</title>
              </rect>
            ) : null}
            {f.lower !== null && f.upper !== null ? (
              <line className="plot__whisker" x1={mid} x2={mid} y1={y(f.lower)} y2={y(f.upper)} />
            ) : null}
            {f.shrunk !== null ? (
              <circle className="outlook-shrunk-dot" cx={mid} cy={y(f.shrunk)} r={3.5} />
            ) : null}
            <text className="plot__tick" x={mid} y={h + 17} textAnchor="middle">
              {outlook.bins.length > 12 ? (bin.index % 3 === 0 ? bin.fromHour : '') : bin.label}
            </text>
          </g>
        );
      })}
      <PlotAxes w={w} h={h} />
    </PlotFigure>
  );
}
