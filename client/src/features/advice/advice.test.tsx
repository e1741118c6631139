import type { AdviceRuleView, CropCalendarView } from '@stormhour/shared';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { aBlock, aDistrict, aSessionUser } from '../../test/builders';
import type { FakeRoutes } from '../../test/fakeApi';
import { renderApp } from '../../test/renderApp';

// Invented names of the demo province.
const scientist = aSessionUser({ id: 7, role: 'scientist', email: 'scientist@vessary.example' });
const writer = aSessionUser({ id: 8, role: 'writer', email: 'writer@vessary.example' });
const riverbend = aDistrict({ id: 1, code: 'RVB', name: 'Riverbend', blockCount: 2 });
const blocks = [
  aBlock({ id: 1, code: 'RVB-01', name: 'Sallow Ford' }),
  aBlock({ id: 2, code: 'RVB-02', name: 'Marrow Bend' }),
];

function aRule(overrides: Partial<AdviceRuleView> = {}): AdviceRuleView {
  return {
    id: 3,
    crop: null,
    stage: null,
    condition: {
      combine: 'all',
      clauses: [{ metric: 'afternoonChance', aggregate: 'anyBlock', op: '>=', value: 0.4 }],
    },
    priority: 10,
    text: 'Spray in the morning in {blocks} ({chance}).',
    source: 'common practice',
    active: true,
    origin: 'default',
    updatedAt: '2026-11-30T08:00:00.000Z',
    updatedBy: null,
    ...overrides,
  };
}

function aCalendar(overrides: Partial<CropCalendarView> = {}): CropCalendarView {
  return {
    districtId: 1,
    districtCode: 'RVB',
    districtName: 'Riverbend',
    entries: [{ crop: 'rice', stage: 'tillering', fromWeek: 30, toWeek: 34 }],
    updatedAt: '2026-11-30T08:00:00.000Z',
    ...overrides,
  };
}

function baseRoutes(extra: FakeRoutes = {}): FakeRoutes {
  return {
    'GET /api/districts': { body: [riverbend] },
    'GET /api/blocks': { body: blocks },
    'GET /api/advice-rules': {
      body: [aRule(), aRule({ id: 4, priority: 1, text: 'Lightning safety.', active: false })],
    },
    'GET /api/districts/1/crop-calendar': { body: aCalendar() },
    ...extra,
  };
}

async function openRule(id: number) {
  const table = await screen.findByRole('table', { name: 'Advice rules' }, { timeout: 5000 });
  await userEvent.click(await within(table).findByRole('button', { name: new RegExp(`rule ${id}$`) }));
  return screen.findByRole('form', { name: `Advice rule ${id}` });
}

describe('Bulletins › Advice rules', () => {
  it('lists the rules by priority, with their condition in words and their state', async () => {
    renderApp('/bulletins/rules', { as: scientist, api: baseRoutes() });
    const table = await screen.findByRole('table', { name: 'Advice rules' }, { timeout: 5000 });
    await waitFor(() => expect(within(table).getAllByRole('row')).toHaveLength(3));
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows[0].textContent).toContain('afternoon chance ≥ 40 % in any block');
    expect(within(rows[1]).getByText('retired')).toBeTruthy();
    expect(screen.getByRole('tab', { name: 'Advice rules' })).toBeTruthy();
    expect(screen.getByRole('tab', { name: 'Crop calendars' })).toBeTruthy();
  });

  it('previews the filled advice live as the example chance and the text change', async () => {
    renderApp('/bulletins/rules', { as: scientist, api: baseRoutes() });
    await openRule(3);
    // The example starts at 30 % in every block: below the rule's 40 %.
    expect(await screen.findByText('Does not fire this week')).toBeTruthy();
    const slider = await screen.findByRole('spinbutton', { name: /Afternoon chance in Sallow Ford/ });
    fireEvent.change(slider, { target: { value: '55' } });
    fireEvent.blur(slider);
    expect(await screen.findByText('Fires this week')).toBeTruthy();
    // 0.55 is nearest 1/2 on the documented ladder (shared chance-words).
    expect(screen.getByTestId('preview-text').textContent).toBe(
      'Spray in the morning in Sallow Ford (about 1 afternoon in 2 (55 %)).',
    );
    const text = screen.getByLabelText('Advice text');
    await userEvent.clear(text);
    await userEvent.type(text, 'Finish before {{peakHour}.');
    expect(screen.getByTestId('preview-text').textContent).toBe('Finish before 15:00.');
  }, 20_000);

  it('refuses an unknown placeholder, naming it and where it is, and sends nothing', async () => {
    const { server } = renderApp('/bulletins/rules', { as: scientist, api: baseRoutes() });
    await openRule(3);
    const text = screen.getByLabelText('Advice text');
    await userEvent.clear(text);
    await userEvent.type(text, 'Spray before {{peak}.');
    await userEvent.click(screen.getByRole('button', { name: 'Save rule' }));
    expect(
      (await screen.findAllByText(/\{peak\} at character 14: unknown placeholder/)).length,
    ).toBeGreaterThan(0);
    expect(server.calls.filter((c) => c.method === 'PUT')).toEqual([]);
  }, 20_000);

  it('saves a new rule with the chance as a fraction', async () => {
    const { server } = renderApp('/bulletins/rules', {
      as: scientist,
      api: baseRoutes({
        'POST /api/advice-rules': (req) => ({
          status: 201,
          body: { ...aRule({ id: 9 }), ...(req.body as object) },
        }),
      }),
    });
    await userEvent.click(await screen.findByRole('button', { name: 'New rule' }));
    await userEvent.type(screen.getByLabelText('Crop'), 'Rice');
    await userEvent.clear(screen.getByLabelText('Value (%)'));
    await userEvent.type(screen.getByLabelText('Value (%)'), '35');
    await userEvent.type(screen.getByLabelText('Advice text'), 'Cover harvested {{crop}.');
    await userEvent.click(screen.getByRole('button', { name: 'Add rule' }));
    expect(await screen.findByText('Rule 9 saved.')).toBeTruthy();
    const post = server.calls.find((c) => c.method === 'POST' && c.path === '/api/advice-rules');
    expect(post?.body).toEqual({
      crop: 'rice',
      stage: null,
      condition: {
        combine: 'all',
        clauses: [{ metric: 'afternoonChance', aggregate: 'anyBlock', op: '>=', value: 0.35 }],
      },
      priority: 50,
      text: 'Cover harvested {crop}.',
      source: 'common practice',
      active: true,
    });
  }, 20_000);

  it('lets the writer read rules but not change them', async () => {
    renderApp('/bulletins/rules', { as: writer, api: baseRoutes() });
    await openRule(3);
    expect(screen.queryByRole('button', { name: 'New rule' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Save rule' })).toBeNull();
    expect((screen.getByLabelText('Advice text') as HTMLTextAreaElement).disabled).toBe(true);
  });
});

describe('Crop calendars', () => {
  it('shows each refused row of an import by row and column', async () => {
    renderApp('/bulletins/calendars', {
      as: scientist,
      api: baseRoutes({
        'POST /api/crop-calendars/import': {
          status: 400,
          body: {
            statusCode: 400,
            message: 'calendar.csv: 1 row(s) have problems; nothing was imported.',
            details: [
              {
                where: 'row 3, column "to_week"',
                problem: '"x" is not a week number; give an ISO week from 1 to 53',
              },
            ],
          },
        },
      }),
    });
    const file = new File(['district_code,crop,stage,from_week,to_week\n'], 'calendar.csv', {
      type: 'text/csv',
    });
    await userEvent.upload(
      await screen.findByLabelText('Import crop calendars', {}, { timeout: 5000 }),
      file,
    );
    expect(
      await screen.findByText('calendar.csv: 1 row(s) have problems; nothing was imported.'),
    ).toBeTruthy();
    const problems = screen.getByRole('table', { name: 'Problems in the file' });
    expect(within(problems).getAllByRole('row')[1].textContent).toBe(
      'row 3, column "to_week""x" is not a week number; give an ISO week from 1 to 53',
    );
  }, 20_000);

  it('checks the edited rows before saving and sends the whole calendar', async () => {
    const { server } = renderApp('/bulletins/calendars', {
      as: scientist,
      api: baseRoutes({
        'PUT /api/districts/1/crop-calendar': (req) => ({
          body: aCalendar({ ...(req.body as object), updatedAt: '2026-12-01T08:00:00.000Z' }),
        }),
      }),
    });
    await screen.findByRole('table', { name: 'Crop calendar of Riverbend' }, { timeout: 5000 });
    expect(screen.getByRole('img', { name: 'Stages by ISO week' })).toBeTruthy();
    await userEvent.click(screen.getByRole('button', { name: 'Add stage' }));
    await userEvent.type(screen.getByLabelText('Crop, row 2'), 'Pulses');
    await userEvent.type(screen.getByLabelText('Stage, row 2'), 'harvest');
    await userEvent.type(screen.getByLabelText('From week, row 2'), '54');
    await userEvent.click(screen.getByRole('button', { name: 'Save calendar' }));
    expect(await screen.findByText('ISO weeks run from 1 to 53')).toBeTruthy();
    expect(await screen.findByText('Give an ISO week number from 1 to 53')).toBeTruthy();
    expect(server.calls.filter((c) => c.method === 'PUT')).toEqual([]);

    await userEvent.clear(screen.getByLabelText('From week, row 2'));
    await userEvent.type(screen.getByLabelText('From week, row 2'), '34');
    await userEvent.type(screen.getByLabelText('To week, row 2'), '36');
    await userEvent.click(screen.getByRole('button', { name: 'Save calendar' }));
    expect(await screen.findByText('Saved 2 stages of Riverbend.')).toBeTruthy();
    const put = server.calls.find((c) => c.method === 'PUT');
    expect(put?.body).toEqual({
      entries: [
        { crop: 'rice', stage: 'tillering', fromWeek: 30, toWeek: 34 },
        { crop: 'pulses', stage: 'harvest', fromWeek: 34, toWeek: 36 },
      ],
    });
  }, 20_000);

  it('is a tab of Admin too, and read-only for the writer', async () => {
    renderApp('/admin/crop-calendars', { as: aSessionUser(), api: baseRoutes() });
    expect(await screen.findByRole('tab', { name: 'Crop calendars' })).toBeTruthy();
    expect(await screen.findByRole('button', { name: 'Add stage' })).toBeTruthy();
  });

  it('shows the writer the calendar without editing controls', async () => {
    renderApp('/bulletins/calendars', { as: writer, api: baseRoutes() });
    const table = await screen.findByRole('table', { name: 'Crop calendar of Riverbend' }, { timeout: 5000 });
    expect(within(table).getByText('tillering')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Add stage' })).toBeNull();
    expect(screen.queryByLabelText('Import crop calendars')).toBeNull();
  });
});
