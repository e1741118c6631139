import type { ScorecardView } from '@stormhour/shared';
import { scaleLinear } from 'd3-scale';
import { line } from 'd3-shape';
import { BarPlot } from '../../../components/plots/BarPlot';
import { BottomTicks, PlotAxes, PlotFigure, ValueGrid } from '../../../components/plots/PlotFigure';
import { innerSize } from '../../../components/plots/plotFrame';
import { binLabel, percent } from '../scorecardFormat';

const TICKS = [0, 0.2, 0.4, 0.6, 0.8, 1];

/**
 * Issued chance against how often storms then came, per bin, with the 90 % interval of each frequency;
 * bins with few cases drawn hollow. On the diagonal the chances meant what they said.
 */
export function ReliabilityDiagram({ view }: { view: ScorecardView }) {
  const width = 420;
  const height = 380;
  const { w, h } = innerSize({ width, height });
  const x = scaleLinear().domain([0, 1]).range([0, w]);
  const y = scaleLinear().domain([0, 1]).range([h, 0]);
  const shown = view.reliability.filter(
    (r) => r.count > 0 && r.meanChance !== null && r.observedFrequency !== null,
  );
  const path =
    line<(typeof shown)[number]>()
      .x((r) => x(r.meanChance ?? 0))
      .y((r) => y(r.observedFrequency ?? 0))(shown) ?? '';
  const summary =
    shown.length === 0
      ? 'No chances were scored.'
      : `Observed frequency against the chance issued, by bin: ${shown
          .map(
            (r) =>
              `${binLabel(r)}: issued ${percent(r.meanChance)} on average, storms on ${percent(r.observedFrequency)} of ${r.count}${r.few ? ' (few cases)' : ''}`,
          )
          .join('; ')}. Points on the diagonal mean the chances were reliable.`;

  return (
    <PlotFigure
      label="Reliability diagram"
      summary={summary}
      xLabel="Chance issued"
      yLabel="How often a storm came"
      width={width}
      height={height}
    >
      <ValueGrid ticks={TICKS} y={y} width={w} format={(v) => percent(v)} />
      <BottomTicks ticks={TICKS} x={x} h={h} format={(v) => percent(v)} />
      <line className="scorecard-diagonal" x1={x(0)} y1={y(0)} x2={x(1)} y2={y(1)}>
        <title>Perfect reliability</title>
      </line>
      <path className="plot__line" d={path} />
      {shown.map((r) => {
        const cx = x(r.meanChance ?? 0);
        return (
          <g key={r.lower}>
            {r.interval ? (
              <line
                className="plot__whisker"
                x1={cx}
                x2={cx}
                y1={y(r.interval.lower)}
                y2={y(r.interval.upper)}
              />
            ) : null}
            <circle
              className={r.few ? 'scorecard-point scorecard-point--few' : 'scorecard-point'}
              cx={cx}
              cy={y(r.observedFrequency ?? 0)}
              r={4.5}
            >
              <title>
                {`${binLabel(r)}: ${r.events} storms in ${r.count} cases (${percent(r.observedFrequency)})${r.few ? ', few cases' : ''}`}
              </title>
            </circle>
          </g>
        );
      })}
      <PlotAxes w={w} h={h} />
    </PlotFigure>
  );
}

/** How often each chance was issued: the customary histogram beneath the reliability diagram. */
export function ChanceHistogram({ view }: { view: ScorecardView }) {
  const top = Math.max(view.fewCases, ...view.reliability.map((r) => r.count));
  return (
    <BarPlot
      label="How often each chance was issued"
      summary={`Cases per bin of the chance issued: ${view.reliability
        .map((r) => `${binLabel(r)}: ${r.count}`)
        .join('; ')}. Bins under the line have fewer than ${view.fewCases} cases.`}
      bars={view.reliability.map((r) => ({ key: String(r.lower), label: binLabel(r), value: r.count }))}
      xLabel="Chance issued"
      yLabel="Cases"
      max={top}
      threshold={{ value: view.fewCases, label: `${view.fewCases} cases` }}
      formatValue={(v) => String(Math.round(v))}
      width={420}
      height={200}
    />
  );
}
