import { colors } from '@carbon/colors';
import { InlineLoading, Select, SelectItem } from '@carbon/react';
import type { AtlasDiurnalResponse, DiurnalCurve } from '@stormhour/shared';
import { scaleLinear } from 'd3-scale';
import { line } from 'd3-shape';
import { useRef, useState } from 'react';
import { LoadError } from '../../../components/LoadError';
import { PlotAxes, PlotFigure, ValueGrid } from '../../../components/plots/PlotFigure';
import { innerSize } from '../../../components/plots/plotFrame';
import { type AtlasParams, useAtlasDiurnal } from '../api';
import { ExportBar } from './ExportBar';
import { ScopeLine } from './ScopeLine';

export const GROUP_COLOURS: Record<DiurnalCurve['group'], string> = {
  all: colors.gray[100],
  shallow: colors.cyan[50],
  congestus: colors.purple[60],
  deep: colors.magenta[60],
};

const MEASURES: { key: string; label: string; unit: string }[] = [
  { key: 'onsets', label: 'Onsets', unit: 'onsets per hour of the day' },
  { key: 'areaKm2', label: 'Mean cell area', unit: 'km²' },
  { key: 'volumeKm3', label: 'Mean cell volume', unit: 'km³' },
  { key: 'top35Km', label: 'Mean 35 dBZ top', unit: 'km' },
  { key: 'echoTopKm', label: 'Mean echo top', unit: 'km' },
  { key: 'vilMaxKgM2', label: 'Mean largest VIL', unit: 'kg m⁻²' },
  { key: 'precipFluxM3s', label: 'Mean precipitation flux', unit: 'm³ s⁻¹' },
];

const number = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: 3 });
const WIDTH = 760;
const HEIGHT = 320;

function curvesOf(data: AtlasDiurnalResponse, measure: string): DiurnalCurve[] {
  if (measure === 'onsets') return data.onsets;
  return data.properties.find((p) => p.property === measure)?.curves ?? [];
}

function CyclePlot({ curves, label, unit }: { curves: DiurnalCurve[]; label: string; unit: string }) {
  const { w, h } = innerSize({ width: WIDTH, height: HEIGHT });
  const top = Math.max(1e-9, ...curves.flatMap((c) => c.values.filter((v): v is number => v !== null)));
  const x = scaleLinear().domain([0, 24]).range([0, w]);
  const y = scaleLinear().domain([0, top]).nice().range([h, 0]);
  const path = line<number | null>()
    .defined((v) => v !== null)
    .x((_v, i) => x(i + 0.5))
    .y((v) => y(v ?? 0));
  const drawn = curves.filter((c) => c.n > 0);
  const peaks = drawn
    .filter((c) => c.peakHour !== null)
    .map((c) => `${c.group} ${String(c.peakHour).padStart(2, '0')} h`)
    .join(', ');
  return (
    <PlotFigure
      label={`${label} by local hour`}
      summary={`${label} by hour of the site's local day; peaks: ${peaks || 'none'}.`}
      xLabel="Local time (h)"
      yLabel={`${label} (${unit})`}
      width={WIDTH}
      height={HEIGHT}
    >
      <ValueGrid ticks={y.ticks(5)} y={y} width={w} format={(v) => number.format(v)} />
      {[0, 3, 6, 9, 12, 15, 18, 21, 24].map((hr) => (
        <text key={hr} className="plot__tick" x={x(hr)} y={h + 16} textAnchor="middle">
          {hr}
        </text>
      ))}
      <PlotAxes w={w} h={h} />
      {drawn.map((c) => (
        <g key={c.group}>
          <path
            d={path(c.values) ?? ''}
            fill="none"
            stroke={GROUP_COLOURS[c.group]}
            strokeWidth={c.group === 'all' ? 2.5 : 1.5}
          />
          {c.peakHour !== null ? (
            <g transform={`translate(${x(c.peakHour + 0.5)} ${y(c.values[c.peakHour] ?? 0)})`}>
              <circle r={4.5} fill="white" stroke={GROUP_COLOURS[c.group]} strokeWidth={2} />
              <title>{`${c.group}: peak at ${c.peakHour}–${c.peakHour + 1} h`}</title>
            </g>
          ) : null}
        </g>
      ))}
    </PlotFigure>
  );
}

export function DiurnalView({ params }: { params: AtlasParams }) {
  const diurnal = useAtlasDiurnal(params);
  const [measure, setMeasure] = useState('onsets');
  const figure = useRef<HTMLDivElement>(null);
  const chosen = MEASURES.find((m) => m.key === measure) ?? MEASURES[0];
  return (
    <div className="form-stack">
      <Select
        id="atlas-diurnal-measure"
        className="narrow-field"
        labelText="Show"
        value={measure}
        onChange={(e) => setMeasure(e.target.value)}
      >
        {MEASURES.map((m) => (
          <SelectItem key={m.key} value={m.key} text={m.label} />
        ))}
      </Select>
      {diurnal.isError ? (
        <LoadError what="the daily cycle" error={diurnal.error} onRetry={diurnal.refetch} />
      ) : null}
      {diurnal.isPending ? <InlineLoading description="Counting by local hour" /> : null}
      {diurnal.data ? (
        <>
          <ScopeLine scope={diurnal.data.scope} />
          {curvesOf(diurnal.data, measure).every((c) => c.n === 0) ? (
            <p className="atlas-empty">Nothing to show for this filter.</p>
          ) : (
            <div ref={figure}>
              <CyclePlot curves={curvesOf(diurnal.data, measure)} label={chosen.label} unit={chosen.unit} />
            </div>
          )}
          <ul className="map-legend" aria-label="Curves">
            {curvesOf(diurnal.data, measure).map((c) => (
              <li key={c.group}>
                <span
                  className="map-legend__swatch"
                  style={{ background: GROUP_COLOURS[c.group] }}
                  aria-hidden="true"
                />
                {c.group === 'all' ? 'all cells' : c.group} (n = {c.n}
                {c.peakHour !== null
                  ? `, peak ${String(c.peakHour).padStart(2, '0')}–${String(c.peakHour + 1).padStart(2, '0')} h`
                  : ''}
                )
              </li>
            ))}
          </ul>
          <p className="atlas-note">
            Hours are the site's local time (UTC{diurnal.data.scope.utcOffsetMinutes >= 0 ? '+' : '−'}
            {Math.floor(Math.abs(diurnal.data.scope.utcOffsetMinutes) / 60)}:
            {String(Math.abs(diurnal.data.scope.utcOffsetMinutes) % 60).padStart(2, '0')}). Onsets are counted
            at their first scan; cell properties are means over every cell of the source in the hour (
            {diurnal.data.cells} cells). Types by height class: shallow, congestus, deep. Open circles mark
            each curve's peak hour.
          </p>
          <ExportBar
            what="daily cycle"
            fileName={`atlas-daily-cycle-${measure}`}
            figure={figure}
            rows={() =>
              Array.from({ length: 24 }, (_, hr) => {
                const row: Record<string, string | number | null> = { local_hour: hr };
                for (const c of curvesOf(diurnal.data, measure)) row[c.group] = c.values[hr];
                return row;
              })
            }
          />
        </>
      ) : null}
    </div>
  );
}
