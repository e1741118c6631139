import type { CellView } from '@stormhour/shared';
import { TimeSeriesPlot } from '../../../../components/plots/TimeSeriesPlot';
import { formatSiteClock, formatUtcOffset } from '../../siteTime';

interface Quantity {
  label: string;
  unit: string;
  value: (cell: CellView) => number | null;
}

const QUANTITIES: Quantity[] = [
  { label: 'Area', unit: 'km²', value: (c) => c.areaKm2 },
  { label: 'Volume', unit: 'km³', value: (c) => c.volumeKm3 },
  { label: 'Echo top', unit: 'km', value: (c) => c.echoTopKm },
  { label: 'Maximum VIL', unit: 'kg m⁻²', value: (c) => c.vilMaxKgM2 },
];

const number = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1 });

/** "Area rose from 12 to a peak of 85 km² at 15:54 and ended at 40 km²." */
function summarise(q: Quantity, cells: CellView[], offset: number): string {
  const known = cells.filter((c) => q.value(c) !== null);
  if (known.length === 0) return `${q.label} is not known for this track's cells.`;
  const peak = known.reduce((best, c) => ((q.value(c) ?? 0) > (q.value(best) ?? 0) ? c : best));
  const first = q.value(known[0]) ?? 0;
  const last = q.value(known[known.length - 1]) ?? 0;
  return (
    `${q.label} started at ${number.format(first)} ${q.unit}, peaked at ${number.format(q.value(peak) ?? 0)} ${q.unit} ` +
    `at ${formatSiteClock(peak.scanTime, offset)} and ended at ${number.format(last)} ${q.unit}.`
  );
}

/** Four small plots of how the storm grew and decayed, in the site's local time. */
export function TrackPlots({ cells, offsetMinutes }: { cells: CellView[]; offsetMinutes: number }) {
  const ordered = [...cells].sort((a, b) => Date.parse(a.scanTime) - Date.parse(b.scanTime));
  const zone = formatUtcOffset(offsetMinutes);
  return (
    <div className="plot-grid">
      {QUANTITIES.map((q) => (
        <TimeSeriesPlot
          key={q.label}
          label={`${q.label} over time`}
          xLabel={`Time (${zone})`}
          yLabel={`${q.label} (${q.unit})`}
          points={ordered.map((c) => ({ time: c.scanTime, value: q.value(c) }))}
          formatTime={(d) => formatSiteClock(d, offsetMinutes)}
          summary={summarise(q, ordered, offsetMinutes)}
          width={400}
          height={200}
        />
      ))}
    </div>
  );
}
