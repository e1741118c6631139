import { Table, TableBody, TableCell, TableHead, TableHeader, TableRow, Tag } from '@carbon/react';
import type { ScorecardView } from '@stormhour/shared';
import type { ReactNode } from 'react';
import {
  agreementSummary,
  binLabel,
  formatNumber,
  formatScore,
  murphyTerms,
  percent,
  rocCurve,
  SCORE_EXPLANATIONS,
  skillVerdict,
} from '../scorecardFormat';

/** A small fixed table with a caption for screen readers and a header row. */
function PlainTable({
  label,
  headers,
  children,
}: {
  label: string;
  headers: ReactNode[];
  children: ReactNode;
}) {
  return (
    <Table size="sm" aria-label={label} useZebraStyles={false}>
      <TableHead>
        <TableRow>
          {headers.map((header, i) => (
            // biome-ignore lint/suspicious/noArrayIndexKey: the headers are fixed
            <TableHeader key={i}>{header}</TableHeader>
          ))}
        </TableRow>
      </TableHead>
      <TableBody>{children}</TableBody>
    </Table>
  );
}

/** The headline scores, each with its interval and a line saying what it means. */
export function ScoreSummary({ view }: { view: ScorecardView }) {
  const rows: { name: string; value: string; explanation: string }[] = [
    {
      name: 'Brier score',
      value: formatScore(view.brier, view.brierInterval),
      explanation: SCORE_EXPLANATIONS.brier,
    },
    {
      name: 'Brier score of the usual chances',
      value: formatScore(view.climatologyBrier, null),
      explanation: SCORE_EXPLANATIONS.climatologyBrier,
    },
    {
      name: 'Brier skill score',
      value: formatScore(view.skill, view.skillInterval),
      explanation: `${SCORE_EXPLANATIONS.skill} ${skillVerdict(
        view.skill,
        view.skillInterval,
        view.brier !== null && view.brier === view.climatologyBrier,
      )}`,
    },
    {
      name: 'ROC area',
      value: formatScore(view.roc.area, view.rocAreaInterval),
      explanation: SCORE_EXPLANATIONS.rocArea,
    },
  ];
  return (
    <dl className="scorecard-scores" aria-label="Scores">
      {rows.map((r) => (
        <div key={r.name} className="scorecard-score">
          <dt className="scorecard-score__name">{r.name}</dt>
          <dd className="scorecard-score__value numeric">{r.value}</dd>
          <dd className="scorecard-score__explanation">{r.explanation}</dd>
        </div>
      ))}
    </dl>
  );
}

/** The reliability diagram's numbers, bin by bin. */
export function ReliabilityTable({ view }: { view: ScorecardView }) {
  return (
    <PlainTable
      label="Reliability by chance issued"
      headers={[
        'Chance issued',
        'Cases',
        'Mean chance issued',
        'Storms',
        'How often a storm came (90 % interval)',
      ]}
    >
      {view.reliability.map((r) => (
        <TableRow key={r.lower}>
          <TableCell>
            {binLabel(r)}
            {r.few && r.count > 0 ? (
              <Tag
                size="sm"
                type="warm-gray"
                className="scorecard-few"
                title={`Fewer than ${view.fewCases} cases`}
              >
                few cases
              </Tag>
            ) : null}
          </TableCell>
          <TableCell className="numeric">{r.count}</TableCell>
          <TableCell className="numeric">{percent(r.meanChance, 1)}</TableCell>
          <TableCell className="numeric">{r.events}</TableCell>
          <TableCell className="numeric">
            {r.observedFrequency === null
              ? '–'
              : `${percent(r.observedFrequency, 1)}${r.interval ? ` (${percent(r.interval.lower, 1)}–${percent(r.interval.upper, 1)})` : ''}`}
          </TableCell>
        </TableRow>
      ))}
    </PlainTable>
  );
}

/** The ROC curve's points, from the highest chance issued down. */
export function RocTable({ view }: { view: ScorecardView }) {
  const points = rocCurve(view.roc.points).filter((p) => p.threshold !== null);
  return (
    <PlainTable label="ROC points" headers={['“Yes” at a chance of', 'Hit rate', 'False-alarm rate']}>
      {points.length === 0 ? (
        <TableRow>
          <TableCell colSpan={3}>
            No points: the season needs afternoons both with and without a storm.
          </TableCell>
        </TableRow>
      ) : null}
      {points.map((p) => (
        <TableRow key={p.threshold}>
          <TableCell>{percent(p.threshold)} or more</TableCell>
          <TableCell className="numeric">{percent(p.hitRate, 1)}</TableCell>
          <TableCell className="numeric">{percent(p.falseAlarmRate, 1)}</TableCell>
        </TableRow>
      ))}
    </PlainTable>
  );
}

/** Hits, misses and false alarms when "yes" means a chance of at least each advice threshold. */
export function ThresholdTable({ view }: { view: ScorecardView }) {
  return (
    <>
      <p className="scorecard-explain">
        Hit rate: {SCORE_EXPLANATIONS.hitRate.toLowerCase()} False-alarm ratio:{' '}
        {SCORE_EXPLANATIONS.falseAlarmRatio.toLowerCase()}
      </p>
      <PlainTable
        label="Scores at each threshold"
        headers={[
          '“Yes” at a chance of',
          'Hits',
          'Misses',
          'False alarms',
          'Correct “no”',
          'Hit rate',
          'False-alarm ratio',
        ]}
      >
        {view.thresholds.map((t) => (
          <TableRow key={t.threshold}>
            <TableCell>{percent(t.threshold)} or more</TableCell>
            <TableCell className="numeric">{t.hits}</TableCell>
            <TableCell className="numeric">{t.misses}</TableCell>
            <TableCell className="numeric">{t.falseAlarms}</TableCell>
            <TableCell className="numeric">{t.correctNegatives}</TableCell>
            <TableCell className="numeric">{percent(t.hitRate, 1)}</TableCell>
            <TableCell className="numeric">{percent(t.falseAlarmRatio, 1)}</TableCell>
          </TableRow>
        ))}
      </PlainTable>
    </>
  );
}

/** Brier score = reliability − resolution + uncertainty (Murphy 1973), each term explained. */
export function MurphyTable({ view }: { view: ScorecardView }) {
  if (!view.murphy) return <p>No decomposition: no chances were scored.</p>;
  const { terms, sum } = murphyTerms(view.murphy);
  return (
    <PlainTable label="Murphy decomposition of the Brier score" headers={['Term', 'Value', 'What it says']}>
      {terms.map((t) => (
        <TableRow key={t.key}>
          <TableCell>
            {t.sign < 0 ? '− ' : '+ '}
            {t.name}
          </TableCell>
          <TableCell className="numeric">{formatNumber(t.value, 4)}</TableCell>
          <TableCell>{SCORE_EXPLANATIONS[t.key]}</TableCell>
        </TableRow>
      ))}
      <TableRow>
        <TableCell>= Brier score</TableCell>
        <TableCell className="numeric">{formatNumber(sum, 4)}</TableCell>
        <TableCell>Reliability − resolution + uncertainty.</TableCell>
      </TableRow>
    </PlainTable>
  );
}

/** Radar against field reports on the block-days both cover. */
export function AgreementTable({ view }: { view: ScorecardView }) {
  const a = view.agreement;
  const s = agreementSummary(a);
  if (s.total === 0)
    return (
      <p>
        No block-day has both radar data and a field report in this season, so the two sources cannot be
        compared yet.
      </p>
    );
  return (
    <>
      <PlainTable label="Radar against field reports" headers={['', 'Report: storm', 'Report: no storm']}>
        <TableRow>
          <TableHeader scope="row">Radar: storm</TableHeader>
          <TableCell className="numeric">{a.both}</TableCell>
          <TableCell className="numeric">{a.radarOnly}</TableCell>
        </TableRow>
        <TableRow>
          <TableHeader scope="row">Radar: no storm</TableHeader>
          <TableCell className="numeric">{a.reportOnly}</TableCell>
          <TableCell className="numeric">{a.neither}</TableCell>
        </TableRow>
      </PlainTable>
      <p className="scorecard-explain">
        Radar and reports agree on {s.agreeing} of {s.total} block-days ({percent(s.share)}); Cohen’s kappa{' '}
        {formatNumber(s.kappa, 2)} (agreement beyond what their own storm rates would give by chance: 0 none,
        1 complete). Disagreements are worth a look: a storm the radar missed, or a report of the wrong
        afternoon.
      </p>
    </>
  );
}
