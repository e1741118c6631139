import { Button, InlineLoading, InlineNotification } from '@carbon/react';
import { SCORECARD_SOURCE_LABELS, type ScorecardView } from '@stormhour/shared';
import { type ReactNode, useState } from 'react';
import { messageOf } from '../../../lib/apiError';
import { downloadScorecard, type ScorecardParams } from '../api';
import { scorecardFileName } from '../scorecardFormat';
import { ChanceHistogram, ReliabilityDiagram } from './ReliabilityDiagram';
import { RocPlot } from './RocPlot';
import { HowToGetScores } from './ScorecardEmpty';
import {
  AgreementTable,
  MurphyTable,
  ReliabilityTable,
  RocTable,
  ScoreSummary,
  ThresholdTable,
} from './ScoreTables';
import { WorstBlocksTable } from './WorstBlocksTable';

function Part({
  id,
  title,
  lead,
  children,
}: {
  id: string;
  title: string;
  lead?: ReactNode;
  children: ReactNode;
}) {
  return (
    <section aria-labelledby={id} className="scorecard-part">
      <h2 id={id} className="section-title">
        {title}
      </h2>
      {lead ? <p className="scorecard-explain">{lead}</p> : null}
      {children}
    </section>
  );
}

function Exports({ view, params }: { view: ScorecardView; params: ScorecardParams }) {
  const [state, setState] = useState<'idle' | 'csv' | 'pdf' | 'done'>('idle');
  const [error, setError] = useState<unknown>(null);
  async function save(format: 'csv' | 'pdf') {
    setState(format);
    setError(null);
    try {
      await downloadScorecard(params, format, scorecardFileName(view, format));
      setState('done');
    } catch (e) {
      setError(e);
      setState('idle');
    }
  }
  return (
    <div className="outlook-actions">
      <Button
        kind="secondary"
        size="md"
        onClick={() => save('pdf')}
        disabled={state === 'csv' || state === 'pdf'}
      >
        Download the season’s report (PDF)
      </Button>
      <Button
        kind="tertiary"
        size="md"
        onClick={() => save('csv')}
        disabled={state === 'csv' || state === 'pdf'}
      >
        Download the pairs (CSV)
      </Button>
      {state === 'csv' || state === 'pdf' ? (
        <InlineLoading description={state === 'pdf' ? 'Preparing the report' : 'Preparing the CSV'} />
      ) : null}
      {state === 'done' ? <span role="status">Downloaded.</span> : null}
      {error ? (
        <InlineNotification
          kind="error"
          lowContrast
          title="Could not fetch the download."
          subtitle={messageOf(error)}
          onCloseButtonClick={() => setError(null)}
        />
      ) : null}
    </div>
  );
}

/** Everything scored for one district and season. */
export function ScorecardBody({ view, params }: { view: ScorecardView; params: ScorecardParams }) {
  const period = `${view.districtName}, ${view.from} to ${view.to}`;
  if (view.bulletins === 0)
    return (
      <InlineNotification
        kind="info"
        lowContrast
        hideCloseButton
        title={`No bulletin sent for ${view.districtName} covers a day between ${view.from} and ${view.to} that has passed, so there is nothing to score.`}
      >
        <HowToGetScores />
      </InlineNotification>
    );
  if (view.pairs === 0)
    return (
      <InlineNotification
        kind="info"
        lowContrast
        hideCloseButton
        title={`${view.bulletins} bulletin${view.bulletins === 1 ? ' was' : 's were'} sent for ${period}, but none of their days can be scored yet with ${SCORECARD_SOURCE_LABELS[view.source].toLowerCase()}.`}
      >
        <HowToGetScores />
      </InlineNotification>
    );

  return (
    <>
      <p className="outlook-summary">
        {period}: {view.bulletins} bulletin{view.bulletins === 1 ? '' : 's'} sent; {view.pairs} block-days
        scored over {view.days} days, {view.events} with a storm; what happened from{' '}
        {SCORECARD_SOURCE_LABELS[view.source].toLowerCase()}.{' '}
        {view.resamples > 0
          ? `Intervals: 90 %, from ${view.resamples} seasons of days drawn again at random.`
          : 'No intervals (no resamples asked for).'}
      </p>
      <Exports view={view} params={params} />
      <Part id="scorecard-scores-title" title="Scores">
        <ScoreSummary view={view} />
      </Part>
      <Part
        id="scorecard-reliability-title"
        title="Reliability: did the chances mean what they said?"
        lead={`Each point is a bin of issued chances: how often a storm came against the chance given, with a 90 % interval. On the diagonal, “30 %” came true three afternoons in ten. Hollow points and “few cases” mark bins with fewer than ${view.fewCases} cases: read them with care.`}
      >
        <div className="plot-row">
          <div>
            <ReliabilityDiagram view={view} />
            <ChanceHistogram view={view} />
          </div>
          <ReliabilityTable view={view} />
        </div>
      </Part>
      <Part
        id="scorecard-roc-title"
        title="ROC: telling storm afternoons from quiet ones"
        lead="Each point says “yes, a storm” for every chance at or above it: the share of storm afternoons caught (hit rate) against the share of quiet afternoons that got the same warning (false-alarm rate). The farther above the diagonal, the better."
      >
        <div className="plot-row">
          <RocPlot view={view} />
          <RocTable view={view} />
        </div>
      </Part>
      <Part id="scorecard-thresholds-title" title="At each threshold">
        <ThresholdTable view={view} />
      </Part>
      <Part
        id="scorecard-murphy-title"
        title="What the Brier score is made of"
        lead="The Brier score splits into three parts (Murphy 1973): reliability, resolution and uncertainty."
      >
        <MurphyTable view={view} />
      </Part>
      <Part id="scorecard-agreement-title" title="Radar and field reports">
        <AgreementTable view={view} />
      </Part>
      <Part
        id="scorecard-blocks-title"
        title="Blocks, worst scored first"
        lead="The blocks whose chances matched least, by Brier score; open their bulletins to see what was said."
      >
        <WorstBlocksTable blocks={view.blocks} />
      </Part>
    </>
  );
}
