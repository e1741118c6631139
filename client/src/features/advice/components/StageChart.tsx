import { isoWeek } from '@stormhour/shared';
import { coloursForGroups } from '../../../lib/geo/groupColours';
import { weekSpans } from '../calendarRows';

const WEEKS = 53;
const ROW = 18;
const LABEL = 170;
const WIDTH = 760;
const TICKS = [1, 10, 20, 30, 40, 53];

/** Stages as bars over the ISO weeks of the year, one row per stage, coloured by crop; a line marks a week. */
export function StageChart({
  entries,
  markDay,
}: {
  entries: readonly { crop: string; stage: string; fromWeek: number; toWeek: number }[];
  /** A date whose ISO week is marked, e.g. today. */
  markDay: string;
}) {
  if (entries.length === 0) return <p className="cds--label-description">No stages to draw yet.</p>;
  const colours = coloursForGroups(entries.map((e) => e.crop));
  const weekWidth = (WIDTH - LABEL) / WEEKS;
  const x = (week: number) => LABEL + (week - 1) * weekWidth;
  const height = entries.length * ROW + 24;
  const marked = isoWeek(markDay).week;
  return (
    <svg
      className="stage-chart"
      role="img"
      aria-label="Stages by ISO week"
      viewBox={`0 0 ${WIDTH} ${height}`}
      width="100%"
    >
      {entries.map((e, i) => (
        // biome-ignore lint/suspicious/noArrayIndexKey: rows follow the table's order
        <g key={i} transform={`translate(0, ${i * ROW})`}>
          <text x={LABEL - 6} y={ROW - 5} textAnchor="end" className="stage-chart__label">
            {e.crop} · {e.stage}
          </text>
          {weekSpans(e.fromWeek, e.toWeek, WEEKS).map(([from, to]) => (
            <rect
              key={from}
              x={x(from)}
              y={3}
              width={(to - from + 1) * weekWidth}
              height={ROW - 6}
              fill={colours.get(e.crop)}
            >
              <title>{`${e.crop}, ${e.stage}: weeks ${e.fromWeek}–${e.toWeek}`}</title>
            </rect>
          ))}
        </g>
      ))}
      <line
        className="stage-chart__mark"
        x1={x(marked) + weekWidth / 2}
        x2={x(marked) + weekWidth / 2}
        y1={0}
        y2={entries.length * ROW}
      />
      {TICKS.map((week) => (
        <text
          key={week}
          x={x(week) + weekWidth / 2}
          y={height - 6}
          textAnchor="middle"
          className="stage-chart__tick"
        >
          {week === marked ? '' : week}
        </text>
      ))}
      <text
        x={x(marked) + weekWidth / 2}
        y={height - 6}
        textAnchor="middle"
        className="stage-chart__tick is-marked"
      >
        week {marked}
      </text>
    </svg>
  );
}
