import { InlineLoading, InlineNotification } from '@carbon/react';
import { SCORECARD_SOURCE_LABELS, ScorecardQuery, type ScorecardSource } from '@stormhour/shared';
import { useSearchParams } from 'react-router';
import { useDistricts } from '../../../api/districts';
import { LoadError } from '../../../components/LoadError';
import { ApiError } from '../../../lib/apiError';
import { type ScorecardParams, useScorecard, useSentBulletins } from '../api';
import { proposedSeason } from '../scorecardFormat';
import { ScorecardBody } from './ScorecardBody';
import { type ScorecardChoice, ScorecardControls } from './ScorecardControls';
import { HowToGetScores } from './ScorecardEmpty';

/** The browser's local date, YYYY-MM-DD. */
const localToday = () => new Date().toLocaleDateString('en-CA');

/** The zod problems of the choice, keyed by field, as the server would name them. */
function problemsOf(result: ReturnType<typeof ScorecardQuery.safeParse>): Record<string, string> {
  const problems: Record<string, string> = {};
  if (result.success) return problems;
  for (const issue of result.error.issues) problems[String(issue.path[0] ?? 'query')] ??= issue.message;
  return problems;
}

export default function ScorecardPage() {
  const districts = useDistricts();
  const [search, setSearch] = useSearchParams();
  const list = [...(districts.data ?? [])].sort((a, b) => a.name.localeCompare(b.name));
  const district = list.find((d) => String(d.id) === search.get('district')) ?? list[0] ?? null;
  const sent = useSentBulletins(district?.id ?? null);
  // Without days in the address, propose the span of the district's sent bulletins.
  const proposal = sent.data ? proposedSeason(sent.data, localToday()) : null;
  const choice: ScorecardChoice = {
    districtId: district ? String(district.id) : '',
    from: search.get('from') ?? proposal?.from ?? '',
    to: search.get('to') ?? proposal?.to ?? '',
    source: search.get('source') ?? 'combined',
    resamples: search.get('resamples') ?? '1000',
  };
  const datesProposed = !search.get('from') && !search.get('to') && proposal !== null;
  const parsed = ScorecardQuery.safeParse(choice);
  const ready = parsed.success && (search.has('from') || search.has('to') || sent.isSuccess);
  const params: ScorecardParams | null =
    parsed.success && ready
      ? {
          districtId: parsed.data.districtId,
          from: parsed.data.from,
          to: parsed.data.to,
          source: parsed.data.source as ScorecardSource,
          resamples: parsed.data.resamples,
        }
      : null;
  const scorecard = useScorecard(params);
  const serverProblems = scorecard.error instanceof ApiError ? scorecard.error.fieldErrors : {};
  // Empty dates before any are proposed or typed are not mistakes yet: the notice below says why.
  const nothingChosen = !choice.from && !choice.to;
  const problems = nothingChosen ? {} : { ...serverProblems, ...problemsOf(parsed) };

  function update(patch: Partial<ScorecardChoice>) {
    const next = new URLSearchParams(search);
    const keys: Record<keyof ScorecardChoice, string> = {
      districtId: 'district',
      from: 'from',
      to: 'to',
      source: 'source',
      resamples: 'resamples',
    };
    for (const [field, value] of Object.entries(patch) as [keyof ScorecardChoice, string][]) {
      if (value) next.set(keys[field], value);
      else next.delete(keys[field]);
    }
    // Changing one end of a proposed season keeps the other end shown.
    if (datesProposed && proposal && !('districtId' in patch)) {
      if (!next.has('from') && !('from' in patch)) next.set('from', proposal.from);
      if (!next.has('to') && !('to' in patch)) next.set('to', proposal.to);
    }
    setSearch(next, { replace: true });
  }

  return (
    <section aria-labelledby="scorecard-title">
      <h1 id="scorecard-title" className="page-title">
        Scorecard
      </h1>
      <p className="page-lead">
        How well the afternoon chances in sent bulletins matched what happened: each block-day a bulletin gave
        a chance for is paired with whether a storm started there that afternoon, seen by radar or reported by
        the district’s extension officers. The intervals come from scoring many seasons made by drawing whole
        days again at random, so they show how much the scores could move by luck alone. Past scores guide the
        unit’s own work; they are not a warning: follow the national weather service.
      </p>
      {districts.isPending ? <InlineLoading description="Loading the districts" /> : null}
      {districts.isError ? (
        <LoadError what="the districts" error={districts.error} onRetry={districts.refetch} />
      ) : null}
      {districts.isSuccess && !district ? (
        <p>No districts yet: the administrator adds them under Admin, Blocks.</p>
      ) : null}
      {district ? (
        <>
          <ScorecardControls districts={list} choice={choice} problems={problems} onChange={update} />
          {sent.isPending ? <InlineLoading description="Looking for the district’s sent bulletins" /> : null}
          {sent.isError ? (
            <LoadError what="the district’s sent bulletins" error={sent.error} onRetry={sent.refetch} />
          ) : null}
          {datesProposed && sent.data ? (
            <p className="scorecard-note">
              Season proposed from the {sent.data.length} bulletin{sent.data.length === 1 ? '' : 's'} sent for{' '}
              {district.name}. Change the days to score another period.
            </p>
          ) : null}
          {sent.isSuccess && sent.data.length === 0 && !search.has('from') && !search.has('to') ? (
            <InlineNotification
              kind="info"
              lowContrast
              hideCloseButton
              title={`No bulletins have been sent for ${district.name} yet, so there is nothing to score.`}
            >
              <HowToGetScores />
            </InlineNotification>
          ) : null}
          {scorecard.isFetching && params ? (
            <InlineLoading
              description={`Scoring ${district.name} with ${SCORECARD_SOURCE_LABELS[params.source].toLowerCase()}${params.resamples ? `, drawing the days again ${params.resamples} times for the intervals` : ''}`}
            />
          ) : null}
          {scorecard.isError ? (
            <LoadError what="the scorecard" error={scorecard.error} onRetry={scorecard.refetch} />
          ) : null}
          {scorecard.data && params && !scorecard.isError ? (
            <ScorecardBody view={scorecard.data} params={params} />
          ) : null}
        </>
      ) : null}
    </section>
  );
}
