import { Table, TableBody, TableCell, TableHead, TableHeader, TableRow } from '@carbon/react';
import type { NotOnsetReason, QualityReport } from '@stormhour/shared';
import { BarPlot } from '../../../../components/plots/BarPlot';
import { TimeSeriesPlot } from '../../../../components/plots/TimeSeriesPlot';
import { NOT_ONSET_TEXT } from '../../intakeWords';
import { formatSiteClock, formatSiteTime, formatUtcOffset } from '../../siteTime';
import { formatShare, summariseAvailability, summariseCellsPerScan } from '../jobSummary';

const count = new Intl.NumberFormat('en-GB');

interface QualityReportViewProps {
  report: QualityReport;
  /** Local time of the site, to show times as its staff read them. */
  utcOffsetMinutes: number;
  /** The share of expected scans a day needs to count (the site's setting). */
  minAvailability: number;
}

function Figures({ report }: { report: QualityReport }) {
  const figures: [string, number][] = [
    ['Files read', report.filesRead],
    ['Files skipped', report.filesSkipped],
    ['Already imported', report.duplicates],
    ['Scans', report.scans],
    ['Cells found', report.cellsFound],
    ['Rejected as too small', report.cellsRejectedTooSmall],
    ['Outside coverage', report.cellsOutsideCoverage],
    ['Tracks', report.tracks],
    ['Storms', report.storms],
    ['Onsets', report.onsets],
  ];
  return (
    <dl className="report-figures" aria-label="Figures of the report">
      {figures.map(([label, value]) => (
        <div key={label}>
          <dt>{label}</dt>
          <dd>{count.format(value)}</dd>
        </div>
      ))}
    </dl>
  );
}

function FlaggedStarts({ flagged }: { flagged: QualityReport['flaggedStarts'] }) {
  const reasons = Object.keys(NOT_ONSET_TEXT) as NotOnsetReason[];
  return (
    <dl className="report-figures" aria-label="Track starts not counted as onsets">
      {reasons.map((reason) => (
        <div key={reason}>
          <dt>{NOT_ONSET_TEXT[reason]}</dt>
          <dd>{count.format(flagged[reason])}</dd>
        </div>
      ))}
    </dl>
  );
}

function GapsTable({ gaps, offset }: { gaps: QualityReport['gaps']; offset: number }) {
  if (gaps.length === 0) return <p>No gaps: every expected scan is there.</p>;
  return (
    <Table aria-label="Gaps in the data" size="sm">
      <TableHead>
        <TableRow>
          <TableHeader>From ({formatUtcOffset(offset)})</TableHeader>
          <TableHeader>To ({formatUtcOffset(offset)})</TableHeader>
          <TableHeader>Length (min)</TableHeader>
        </TableRow>
      </TableHead>
      <TableBody>
        {gaps.map((g) => (
          <TableRow key={g.from}>
            <TableCell>{formatSiteTime(g.from, offset)}</TableCell>
            <TableCell>{formatSiteTime(g.to, offset)}</TableCell>
            <TableCell>{count.format(g.minutes)}</TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}

/** What an intake job found, in figures and two plots: cells per scan, and availability by day. */
export function QualityReportView({
  report,
  utcOffsetMinutes: offset,
  minAvailability,
}: QualityReportViewProps) {
  const zone = formatUtcOffset(offset);
  const spansDays =
    report.cellsPerScan.length > 1 &&
    report.cellsPerScan[0].time.slice(0, 10) !==
      report.cellsPerScan[report.cellsPerScan.length - 1].time.slice(0, 10);
  const formatTick = (d: Date) =>
    spansDays ? formatSiteTime(d, offset).slice(0, 6) : formatSiteClock(d, offset);
  return (
    <div className="form-stack">
      <Figures report={report} />
      <h4 className="subsection-title">Track starts not counted as onsets</h4>
      <FlaggedStarts flagged={report.flaggedStarts} />
      <div className="plot-row">
        <TimeSeriesPlot
          label="Cells per scan over time"
          xLabel={`Scan time (${zone})`}
          yLabel="Cells per scan"
          points={report.cellsPerScan.map((p) => ({ time: p.time, value: p.cells }))}
          formatTime={formatTick}
          summary={summariseCellsPerScan(
            report.cellsPerScan,
            (iso) => `${formatSiteTime(iso, offset)} ${zone}`,
          )}
        />
        <BarPlot
          label="Availability by day"
          xLabel="Local day"
          yLabel="Expected scans present (%)"
          bars={report.availabilityByDay.map((d) => ({
            key: d.date,
            label: d.date.slice(5),
            value: d.share * 100,
          }))}
          max={100}
          threshold={{
            value: minAvailability * 100,
            label: `${formatShare(minAvailability)} needed to count`,
          }}
          formatValue={(v) => `${Math.round(v)} %`}
          summary={summariseAvailability(report.availabilityByDay, minAvailability)}
        />
      </div>
      <h4 className="subsection-title">Gaps in the data</h4>
      <GapsTable gaps={report.gaps} offset={offset} />
    </div>
  );
}
