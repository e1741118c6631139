import { colors } from '@carbon/colors';
import { InlineLoading } from '@carbon/react';
import type { DistributionSummary } from '@stormhour/shared';
import { scaleLinear, scaleLog } from 'd3-scale';
import { line } from 'd3-shape';
import { useRef } from 'react';
import { LoadError } from '../../../components/LoadError';
import { PlotAxes, PlotFigure, ValueGrid } from '../../../components/plots/PlotFigure';
import { innerSize } from '../../../components/plots/plotFrame';
import { type AtlasParams, useAtlasDistributions } from '../api';
import { ExportBar } from './ExportBar';
import { ScopeLine } from './ScopeLine';

const WIDTH = 420;
const HEIGHT = 260;
const f3 = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 3, minimumFractionDigits: 3 });
const sig = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: 3 });

/** On a log axis d3 offers every integer multiple; past eight labels keep only 1, 2 and 5 × 10ᵏ. */
export function logTicks(ticks: number[]): number[] {
  if (ticks.length <= 8) return ticks;
  return ticks.filter((t) => [1, 2, 5].includes(Number(t.toExponential(0)[0])));
}

function Histogram({ d }: { d: DistributionSummary }) {
  const { w, h } = innerSize({ width: WIDTH, height: HEIGHT });
  const { edges, counts, expected } = d.histogram;
  const x = scaleLog()
    .domain([edges[0], edges[edges.length - 1]])
    .range([0, w]);
  const y = scaleLinear()
    .domain([0, Math.max(1, ...counts, ...expected)])
    .nice()
    .range([h, 0]);
  const fitted = line<number>()
    .x((_v, i) => (x(edges[i]) + x(edges[i + 1])) / 2)
    .y((v) => y(v));
  return (
    <PlotFigure
      label={`Histogram of ${d.label.toLowerCase()}`}
      summary={`${d.n} values on a log axis, bars counted, line the log-normal fit's expected counts.`}
      xLabel={`${d.label} (${d.unit}, log scale)`}
      yLabel="Onsets"
      width={WIDTH}
      height={HEIGHT}
    >
      <ValueGrid ticks={y.ticks(4)} y={y} width={w} />
      {logTicks(x.ticks(6)).map((t) => (
        <text key={t} className="plot__tick" x={x(t)} y={h + 16} textAnchor="middle">
          {sig.format(t)}
        </text>
      ))}
      {counts.map((c, i) => (
        <rect
          key={edges[i]}
          x={x(edges[i]) + 0.5}
          width={Math.max(0, x(edges[i + 1]) - x(edges[i]) - 1)}
          y={y(c)}
          height={h - y(c)}
          fill={colors.blue[40]}
        />
      ))}
      {d.fit ? <path d={fitted(expected) ?? ''} fill="none" stroke={colors.red[60]} strokeWidth={2} /> : null}
      <PlotAxes w={w} h={h} />
    </PlotFigure>
  );
}

function FitTable({ d }: { d: DistributionSummary }) {
  if (!d.fit) return <p>Too few values for a fit (n = {d.n}).</p>;
  const f = d.fit;
  return (
    <dl className="atlas-fit">
      <dt>n</dt>
      <dd>{d.n}</dd>
      <dt>μ̂ (mean ln x)</dt>
      <dd>{f3.format(f.mu)}</dd>
      <dt>σ̂ (SD of ln x)</dt>
      <dd>{f3.format(f.sigma)}</dd>
      <dt>Median e^μ̂</dt>
      <dd>
        {sig.format(f.median)} {d.unit}
      </dd>
      <dt>KS D</dt>
      <dd>{f3.format(f.ksD)}</dd>
      <dt>5 % critical D ({f.criticalMethod === 'exact' ? 'exact' : 'asymptotic 1.358/√n'})</dt>
      <dd>
        {f3.format(f.critical05)} — {f.consistent ? 'not rejected' : 'rejected'}
      </dd>
    </dl>
  );
}

export function DistributionsView({ params }: { params: AtlasParams }) {
  const result = useAtlasDistributions(params);
  const figure = useRef<HTMLDivElement>(null);
  return (
    <div className="form-stack">
      {result.isError ? (
        <LoadError what="the distributions" error={result.error} onRetry={result.refetch} />
      ) : null}
      {result.isPending ? <InlineLoading description="Fitting the distributions" /> : null}
      {result.data ? (
        <>
          <ScopeLine scope={result.data.scope} />
          {result.data.scope.onsets === 0 ? (
            <p className="atlas-empty">No onsets match this filter.</p>
          ) : null}
          <div ref={figure} className="plot-grid atlas-distributions">
            {result.data.distributions.map((d) =>
              d.n > 0 ? (
                <section key={d.variable} aria-label={d.label}>
                  <h3 className="subsection-title">{d.label}</h3>
                  <Histogram d={d} />
                  <FitTable d={d} />
                </section>
              ) : null,
            )}
          </div>
          <p className="atlas-note">
            Log-normal fitted by maximum likelihood (μ̂ = mean of ln x, σ̂ = population standard deviation of ln
            x); red line: the counts the fit expects per bin. The Kolmogorov–Smirnov critical value assumes
            the distribution was known in advance; with μ̂ and σ̂ fitted from the same data it is too lenient
            (Lilliefors 1967), so "not rejected" overstates the fit. Exact critical values up to n = 100
            (Marsaglia, Tsang &amp; Wang 2003), the asymptotic 1.358/√n above (Massey 1951). Durations are
            whole scan intervals and tops are level heights, so their data come in steps.
          </p>
          <ExportBar
            what="distributions"
            fileName="atlas-distributions"
            figure={figure}
            rows={() =>
              result.data.distributions.flatMap((d) =>
                d.histogram.counts.map((c, i) => ({
                  variable: d.variable,
                  unit: d.unit,
                  bin_from: d.histogram.edges[i],
                  bin_to: d.histogram.edges[i + 1],
                  count: c,
                  expected_lognormal: d.histogram.expected[i],
                  mu: d.fit?.mu ?? null,
                  sigma: d.fit?.sigma ?? null,
                  ks_d: d.fit?.ksD ?? null,
                  critical_05: d.fit?.critical05 ?? null,
                })),
              )
            }
          />
        </>
      ) : null}
    </div>
  );
}
