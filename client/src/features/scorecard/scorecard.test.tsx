import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { aDistrict, aSessionUser } from '../../test/builders';
import { aBulletinView } from '../../test/bulletinBuilders';
import type { FakeRequest, FakeRoutes } from '../../test/fakeApi';
import { renderApp } from '../../test/renderApp';
import { aScorecardView } from '../../test/scorecardBuilders';

// Invented districts, blocks and bulletins of the demo province; the scores come from the worked example
// of REFERENCES §5 (see aScorecardView).

const scientist = aSessionUser({ id: 2, role: 'scientist', name: 'Oren Halloway' });
const districts = [
  aDistrict({ id: 1, code: 'RVB', name: 'Riverbend' }),
  aDistrict({ id: 2, code: 'UPL', name: 'Upland' }),
];
const sentWeeks = [
  aBulletinView({
    id: 12,
    districtId: 1,
    number: 'RB-2025-28',
    weekStart: '2025-07-07',
    weekEnd: '2025-07-13',
    state: 'sent',
  }),
  aBulletinView({
    id: 11,
    districtId: 1,
    number: 'RB-2025-27',
    weekStart: '2025-06-30',
    weekEnd: '2025-07-06',
    state: 'sent',
  }),
];

function renderScorecard(extra: FakeRoutes = {}, path = '/scorecard') {
  return renderApp(path, {
    as: scientist,
    api: {
      'GET /api/districts': { body: districts },
      'GET /api/bulletins': (req) => ({ body: req.query.get('districtId') === '1' ? sentWeeks : [] }),
      'GET /api/scorecard': (req) => ({
        body: aScorecardView({ from: req.query.get('from') ?? '', to: req.query.get('to') ?? '' }),
      }),
      ...extra,
    },
  });
}

const scorecardCalls = (calls: FakeRequest[]) => calls.filter((c) => c.path === '/api/scorecard');

/** The first render loads the page's code lazily, which takes a while on a busy machine. */
const scores = () => screen.findByLabelText('Scores', { selector: 'dl' }, { timeout: 15_000 });

afterEach(() => vi.unstubAllGlobals());

describe('Scorecard', { timeout: 30_000 }, () => {
  it('scores the season of the district’s sent bulletins, each score with its interval and a plain explanation', async () => {
    const { server } = renderScorecard();
    const list = await scores();
    // The season proposed from the sent bulletins' weeks.
    const call = scorecardCalls(server.calls)[0];
    expect(Object.fromEntries(call.query)).toEqual({
      districtId: '1',
      from: '2025-06-30',
      to: '2025-07-13',
      source: 'combined',
      resamples: '1000',
    });
    expect(screen.getByText(/Season proposed from the 2 bulletins sent for Riverbend/)).toBeTruthy();
    expect(within(list).getByText('0.170 (90 % interval 0.090–0.250)')).toBeTruthy();
    expect(within(list).getByText('0.320 (90 % interval 0.050–0.610)')).toBeTruthy();
    expect(within(list).getByText('0.800 (90 % interval 0.620–0.950)')).toBeTruthy();
    expect(within(list).getByText(/0 is perfect/)).toBeTruthy();
    expect(within(list).getByText(/Better than the usual chance/)).toBeTruthy();
  });

  it('draws the reliability diagram and ROC curve with their numbers beside them', async () => {
    renderScorecard();
    await scores();
    const diagram = screen.getByRole('img', { name: 'Reliability diagram' });
    // Two bins with cases, both under 10 cases: drawn hollow.
    expect(diagram.querySelectorAll('.scorecard-point--few')).toHaveLength(2);
    expect(diagram.querySelector('.scorecard-diagonal')).toBeTruthy();
    expect(screen.getByRole('img', { name: 'How often each chance was issued' })).toBeTruthy();
    const reliability = screen.getByRole('table', { name: 'Reliability by chance issued' });
    const seventy = within(reliability).getByRole('row', { name: /70–80 %/ });
    expect(within(seventy).getByText('80.0 % (43.5 %–95.4 %)')).toBeTruthy();
    expect(within(seventy).getByText('few cases')).toBeTruthy();

    const roc = screen.getByRole('img', { name: 'ROC curve' });
    // (0,0), the two listed points, and (1,1) already reached by the lowest chance.
    expect(roc.querySelector('.plot__line')?.getAttribute('d')?.match(/[ML]/g)).toHaveLength(3);
    const points = within(screen.getByRole('table', { name: 'ROC points' }))
      .getAllByRole('row')
      .slice(1);
    expect(points.map((r) => r.textContent)).toEqual([
      '70 % or more80.0 %20.0 %',
      '10 % or more100.0 %100.0 %',
    ]);
  });

  it('shows the thresholds, the Murphy decomposition adding up to the Brier score, and radar against reports', async () => {
    renderScorecard();
    await scores();
    const thresholds = screen.getByRole('table', { name: 'Scores at each threshold' });
    expect(within(thresholds).getByRole('row', { name: /40 % or more/ }).textContent).toContain('80.0 %');
    const murphy = screen.getByRole('table', { name: 'Murphy decomposition of the Brier score' });
    // REFERENCES §5: REL 0.01 − RES 0.09 + UNC 0.25 = BS 0.17.
    expect(within(murphy).getByRole('row', { name: /= Brier score/ }).textContent).toContain('0.1700');
    const agreement = screen.getByRole('table', { name: 'Radar against field reports' });
    expect(within(agreement).getByRole('row', { name: /Radar: storm/ }).textContent).toContain('3');
    // 7 of 8 agree; κ = (0.875 − 0.5) / 0.5 = 0.75 (Cohen 1960's definition).
    expect(screen.getByText(/agree on 7 of 8 block-days \(88 %\); Cohen’s kappa 0\.75/)).toBeTruthy();
  });

  it('lists the blocks worst first, sorts and filters them, and links to their bulletins', async () => {
    renderScorecard();
    await scores();
    const table = screen.getByRole('table', { name: 'Blocks, worst scored first' });
    const firstBlock = () => within(within(table).getAllByRole('row')[1]).getAllByRole('cell')[0].textContent;
    expect(firstBlock()).toBe('Umberlyn (RVB-02)');
    const umberlyn = within(table).getByRole('row', { name: /Umberlyn/ });
    expect(within(umberlyn).getByRole('link', { name: 'RB-2025-27' }).getAttribute('href')).toBe(
      '/bulletins/11',
    );
    await userEvent.click(within(table).getByRole('button', { name: /Brier score/ }));
    expect(firstBlock()).toBe('Sallow Ford (RVB-01)');
    await userEvent.type(screen.getByRole('searchbox', { name: 'Find a block' }), 'umber');
    expect(within(table).getAllByRole('row')).toHaveLength(2);
    expect(firstBlock()).toBe('Umberlyn (RVB-02)');
  });

  it('downloads the pairs as CSV and the report as PDF with the same query', async () => {
    const createObjectURL = vi.fn(() => 'blob:scorecard');
    vi.stubGlobal('URL', Object.assign(URL, { createObjectURL, revokeObjectURL: vi.fn() }));
    const { server } = renderScorecard({
      'GET /api/scorecard.csv': { body: 'bulletin,block,date,chance,observed,source' },
      'GET /api/scorecard.pdf': { body: '%PDF-1.7' },
    });
    await scores();
    await userEvent.click(screen.getByRole('button', { name: 'Download the pairs (CSV)' }));
    await waitFor(() => expect(createObjectURL).toHaveBeenCalledTimes(1));
    await userEvent.click(screen.getByRole('button', { name: 'Download the season’s report (PDF)' }));
    await waitFor(() => expect(createObjectURL).toHaveBeenCalledTimes(2));
    const csv = server.calls.find((c) => c.path === '/api/scorecard.csv');
    const pdf = server.calls.find((c) => c.path === '/api/scorecard.pdf');
    expect(csv?.query.toString()).toBe(scorecardCalls(server.calls)[0].query.toString());
    expect(pdf?.query.toString()).toBe(csv?.query.toString());
  });

  it('says when a district has no sent bulletins, and how to get some', async () => {
    const { server } = renderScorecard({}, '/scorecard?district=2');
    expect(
      await screen.findByText(
        'No bulletins have been sent for Upland yet, so there is nothing to score.',
        {},
        { timeout: 15_000 },
      ),
    ).toBeTruthy();
    expect(screen.getByText(/only sent bulletins are scored/)).toBeTruthy();
    expect(screen.getByText(/once it has passed/)).toBeTruthy();
    expect(scorecardCalls(server.calls)).toHaveLength(0);
  });

  it('says when no sent bulletin covers a past day of the period, and how to get some', async () => {
    renderScorecard(
      {
        'GET /api/scorecard': {
          body: aScorecardView({
            districtName: 'Riverbend',
            from: '2025-05-01',
            to: '2025-05-31',
            bulletins: 0,
            pairs: 0,
          }),
        },
      },
      '/scorecard?district=1&from=2025-05-01&to=2025-05-31',
    );
    expect(
      await screen.findByText(
        /No bulletin sent for Riverbend covers a day between 2025-05-01 and 2025-05-31 that has passed/,
        {},
        { timeout: 15_000 },
      ),
    ).toBeTruthy();
    expect(screen.queryByRole('img', { name: 'Reliability diagram' })).toBeNull();
    expect(screen.getByText(/only sent bulletins are scored/)).toBeTruthy();
  });

  it('says "not yet scorable" when bulletins were sent but no day has an outcome', async () => {
    renderScorecard({
      'GET /api/scorecard': { body: aScorecardView({ bulletins: 2, pairs: 0, source: 'reports' }) },
    });
    expect(
      await screen.findByText(
        /2 bulletins were sent for Riverbend, .* but none of their days can be scored yet with field reports/,
        {},
        { timeout: 15_000 },
      ),
    ).toBeTruthy();
  });

  it('refuses a season that ends before it starts, and shows the server’s problems under the field', async () => {
    const { server } = renderScorecard(
      {
        'GET /api/scorecard': {
          status: 400,
          body: {
            statusCode: 400,
            message: 'Check the season.',
            details: [{ where: 'from', problem: 'No radar data before 2025-06-01' }],
          },
        },
      },
      '/scorecard?district=1&from=2025-07-13&to=2025-06-30',
    );
    expect(
      await screen.findByText('The first day must not be after the last', {}, { timeout: 15_000 }),
    ).toBeTruthy();
    expect(scorecardCalls(server.calls)).toHaveLength(0);

    const to = screen.getByLabelText('Last day (local)');
    await userEvent.clear(to);
    await userEvent.type(to, '2025-07-20');
    expect(await screen.findByText('No radar data before 2025-06-01')).toBeTruthy();
    expect(screen.getByText('Check the season.')).toBeTruthy();
  });
});
