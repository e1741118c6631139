import type { ScorecardView } from '@stormhour/shared';
import { scaleLinear } from 'd3-scale';
import { line } from 'd3-shape';
import { BottomTicks, PlotAxes, PlotFigure, ValueGrid } from '../../../components/plots/PlotFigure';
import { innerSize } from '../../../components/plots/plotFrame';
import { formatScore, percent, type RocCurvePoint, rocCurve } from '../scorecardFormat';

const TICKS = [0, 0.2, 0.4, 0.6, 0.8, 1];

/** Hit rate against false-alarm rate as the "yes" threshold falls from the highest chance issued to the lowest. */
export function RocPlot({ view }: { view: ScorecardView }) {
  const width = 420;
  const height = 380;
  const { w, h } = innerSize({ width, height });
  const x = scaleLinear().domain([0, 1]).range([0, w]);
  const y = scaleLinear().domain([0, 1]).range([h, 0]);
  const curve = rocCurve(view.roc.points);
  const path =
    line<RocCurvePoint>()
      .x((p) => x(p.falseAlarmRate))
      .y((p) => y(p.hitRate))(curve) ?? '';
  const area = formatScore(view.roc.area, view.rocAreaInterval);
  const summary =
    view.roc.points.length === 0
      ? 'No curve: the season needs both afternoons with and without a storm.'
      : `ROC curve, area ${area}. ${curve
          .filter((p) => p.threshold !== null)
          .map(
            (p) =>
              `At ${percent(p.threshold)} or more: hit rate ${percent(p.hitRate)}, false-alarm rate ${percent(p.falseAlarmRate)}`,
          )
          .join('; ')}. The diagonal is no skill.`;

  return (
    <PlotFigure
      label="ROC curve"
      summary={summary}
      xLabel="False-alarm rate (quiet afternoons given the chance)"
      yLabel="Hit rate"
      width={width}
      height={height}
    >
      <ValueGrid ticks={TICKS} y={y} width={w} format={(v) => percent(v)} />
      <BottomTicks ticks={TICKS} x={x} h={h} format={(v) => percent(v)} />
      <line className="scorecard-diagonal" x1={x(0)} y1={y(0)} x2={x(1)} y2={y(1)}>
        <title>No skill</title>
      </line>
      {view.roc.points.length > 0 ? <path className="plot__line" d={path} /> : null}
      {curve
        .filter((p) => p.threshold !== null)
        .map((p) => (
          <circle key={p.threshold} className="plot__dot" cx={x(p.falseAlarmRate)} cy={y(p.hitRate)} r={3.5}>
            <title>{`${percent(p.threshold)} or more: hit rate ${percent(p.hitRate)}, false-alarm rate ${percent(p.falseAlarmRate)}`}</title>
          </circle>
        ))}
      <text className="plot__title" x={w - 4} y={h - 8} textAnchor="end">
        {`Area ${area}`}
      </text>
      <PlotAxes w={w} h={h} />
    </PlotFigure>
  );
}
