import {
  type AdviceRuleRequest,
  BULLETIN_CAUTIONS,
  type BulletinContent,
  evaluateRules,
  type OutlookBlock,
} from '@stormhour/shared';
import { describe, expect, it } from 'vitest';
import { contradictionWarnings, sentences } from './contradictions.js';
import {
  adviceContext,
  adviceText,
  bulletinNumber,
  bulletinRow,
  draftContent,
  weekStartProblem,
} from './draft.js';
import { localToday, localToUtc, weekBounds } from './local-week.js';
import { textDiff } from './text-diff.js';

// Invented blocks of the demo province; the figures are made up for the test.
function block(overrides: Partial<OutlookBlock> = {}): OutlookBlock {
  const figure = { n: 40, x: 20, rate: 0.5, lower: 0.37, upper: 0.63, shrunk: 0.48, per100Km2: 0.2 };
  return {
    blockId: 1,
    code: 'RVB-01',
    name: 'Ashgrove',
    districtId: 1,
    districtCode: 'RVB',
    districtName: 'Riverbend',
    areaKm2: 300,
    coverage: 1,
    hasData: true,
    bins: Array.from({ length: 8 }, () => figure),
    afternoon: figure,
    climatologyRate: 0.25,
    ratioToClimatology: 2,
    week: { windows: 10, hits: 9, rate: 0.9, lower: 0.6, upper: 0.99 },
    peakBin: 5,
    ...overrides,
  };
}

describe('bulletin weeks and numbers', () => {
  // ISO 8601 week dates; expected values from Python's datetime.date.isocalendar(), a reference library.
  it('numbers a bulletin by the ISO week-numbering year and week of its Monday', () => {
    expect(bulletinNumber('RVB', '2025-09-29')).toBe('RVB-2025-40');
    // 29 December 2025 is in ISO week 1 of 2026 (Python: isocalendar() = (2026, 1, 1)).
    expect(bulletinNumber('RVB', '2025-12-29')).toBe('RVB-2026-01');
    expect(bulletinNumber('LKS', '2021-01-04', 2)).toBe('LKS-2021-01-R2');
  });

  it('takes only a Monday as the start of a week, and names the Monday to use', () => {
    expect(weekStartProblem('2025-09-29')).toBeNull();
    // Python: date(2025, 10, 1).strftime('%A') = 'Wednesday'.
    expect(weekStartProblem('2025-10-01')).toBe(
      '2025-10-01 is a Wednesday; bulletins run over ISO weeks from Monday to Sunday: use 2025-09-29',
    );
    expect(weekStartProblem('2025-10-05')).toMatch(/is a Sunday; .* use 2025-09-29$/);
    expect(weekStartProblem('2025-02-30')).toBe('2025-02-30 is not a calendar date');
  });

  it('reads local times at the district’s offset and keeps them to the week', () => {
    // 15:30 at UTC+06:00 is 09:30 UTC (Python: datetime(2025,9,30,15,30) - timedelta(minutes=360)).
    expect(localToUtc('2025-09-30T15:30', 360)?.toISOString()).toBe('2025-09-30T09:30:00.000Z');
    expect(localToUtc('2025-09-31T15:30', 360)).toBeNull();
    expect(localToUtc('2025-09-30T24:00', 360)).toBeNull();
    const week = weekBounds('2025-09-29', 360);
    expect(week.from.toISOString()).toBe('2025-09-28T18:00:00.000Z');
    expect(week.to.toISOString()).toBe('2025-10-05T18:00:00.000Z');
    expect(localToday(new Date('2025-09-28T19:00:00Z'), 360)).toBe('2025-09-29');
  });
});

describe('the draft', () => {
  it('copies the outlook’s numbers into the table unchanged; a block without data reads "no radar data"', () => {
    expect(bulletinRow(block(), 3)).toEqual({
      blockCode: 'RVB-01',
      blockName: 'Ashgrove',
      afternoonChance: 0.5,
      lower: 0.37,
      upper: 0.63,
      n: 40,
      // Peak bin 5 of 3-hour bins starts at 15:00 local.
      peakHourLocal: 15,
      climatologyChance: 0.25,
      // Natural frequencies (see chance-words.spec.ts): 1/2, usually 1/4.
      inWords: 'about 1 afternoon in 2, usually 1 in 4',
    });
    const none = bulletinRow(
      block({ hasData: false, afternoon: { ...block().afternoon, n: null, rate: null } }),
      3,
    );
    expect(none).toMatchObject({
      afternoonChance: null,
      n: 0,
      peakHourLocal: null,
      inWords: 'no radar data',
    });
  });

  it('fills the crop table and general advice from the rules, and always carries the cautions', () => {
    const rows = [
      bulletinRow(block(), 3),
      bulletinRow(
        block({ code: 'RVB-02', name: 'Millbrook', afternoon: { ...block().afternoon, rate: 0.1 } }),
        3,
      ),
    ];
    const rules: (AdviceRuleRequest & { id: number })[] = [
      {
        id: 1,
        crop: null,
        stage: null,
        priority: 1,
        condition: {
          combine: 'all',
          clauses: [{ metric: 'afternoonChance', aggregate: 'anyBlock', op: '>=', value: 0.4 }],
        },
        text: 'Lightning possible in {blocks}.',
        source: 'common practice',
        active: true,
      },
      {
        id: 2,
        crop: 'rice',
        stage: null,
        priority: 2,
        condition: { combine: 'all', clauses: [] },
        text: 'Top-dress {crop} in the morning.',
        source: 'common practice',
        active: true,
      },
    ];
    const ctx = adviceContext({
      district: { id: 1, name: 'Riverbend' },
      weekStart: '2025-09-29',
      regime: 'moist / onshore',
      binHours: 3,
      rows,
      crops: [
        { crop: 'rice', stage: 'grain filling' },
        { crop: 'pulses', stage: 'harvest' },
      ],
    });
    const content = draftContent({
      unitName: 'Agro-met unit',
      district: { id: 1, code: 'RVB', name: 'Riverbend' },
      weekStart: '2025-09-29',
      issueDate: '2025-09-26',
      number: 'RVB-2025-40',
      regime: 'moist / onshore',
      binHours: 3,
      afternoon: { fromHour: 12, toHour: 18 },
      rows,
      proposal: evaluateRules(rules, ctx),
    });
    expect(content).toMatchObject({
      weekEnd: '2025-10-05',
      number: 'RVB-2025-40',
      regimeLabel: 'moist / onshore',
      outlook: rows,
      crops: [
        { crop: 'rice', stage: 'grain filling', advice: 'Top-dress rice in the morning.' },
        { crop: 'pulses', stage: 'harvest', advice: 'No specific advice this week.' },
      ],
      generalAdvice: 'Lightning possible in Ashgrove.',
      cautions: [...BULLETIN_CAUTIONS],
    });
    expect(content.summary).toBe(
      "On days like those expected (moist / onshore), the chance of an afternoon storm for 29 September – 5 October 2025 is 10–50 % across the district's blocks, highest in Ashgrove: about 1 afternoon in 2, usually 1 in 4.",
    );
    expect(adviceText([], 'none')).toBe('none');
  });
});

function content(overrides: Partial<BulletinContent> = {}): BulletinContent {
  return {
    unitName: 'Agro-met unit',
    districtCode: 'RVB',
    districtName: 'Riverbend',
    number: 'RVB-2025-40',
    issueDate: '2025-09-26',
    weekStart: '2025-09-29',
    weekEnd: '2025-10-05',
    afternoonFromHour: 12,
    afternoonToHour: 18,
    regimeLabel: null,
    summary: 'Storms are likely.',
    outlook: [bulletinRow(block(), 3), bulletinRow(block({ code: 'RVB-02', name: 'Millbrook' }), 3)],
    crops: [{ crop: 'rice', stage: 'tillering', advice: 'Top-dress in the morning.' }],
    generalAdvice: 'When thunder is heard, go indoors.',
    cautions: [...BULLETIN_CAUTIONS],
    ...overrides,
  };
}

// Spraying or working in the open in storm-prone hours, and lightning safety: common practice
// (and the 30-minute rule of the default advice rules).
describe('contradiction warnings', () => {
  it('says nothing when the advice fits the numbers', () => {
    expect(contradictionWarnings(content())).toEqual([]);
  });

  it('flags afternoon spraying or field work while a block’s afternoon chance is high', () => {
    const warnings = contradictionWarnings(
      content({
        crops: [
          {
            crop: 'rice',
            stage: 'tillering',
            advice: '- Weed in the morning.\n- Spray fungicide in the afternoon.',
          },
          { crop: 'pulses', stage: 'harvest', advice: 'Do not spray in the afternoon. Harvest before noon.' },
        ],
      }),
    );
    expect(warnings).toEqual([
      {
        kind: 'afternoon-work',
        where: 'crops[0].advice',
        message:
          '“Spray fungicide in the afternoon.” recommends afternoon work while the afternoon storm chance is 50 % in Ashgrove and Millbrook; advise the morning instead.',
      },
    ]);
  });

  it('flags dry-spell or "harvest now" wording while chances are high', () => {
    const warnings = contradictionWarnings(content({ summary: 'A dry spell is expected. Harvest now.' }));
    expect(warnings.map((w) => [w.kind, w.where])).toEqual([
      ['dry-wording', 'summary'],
      ['dry-wording', 'summary'],
    ]);
  });

  it('flags each high-chance block when no advice mentions lightning (the fixed cautions do not count)', () => {
    const warnings = contradictionWarnings(
      content({
        generalAdvice: 'Clear the drains.',
        outlook: [
          bulletinRow(block(), 3),
          bulletinRow(
            block({ code: 'RVB-02', name: 'Millbrook', afternoon: { ...block().afternoon, rate: 0.2 } }),
            3,
          ),
        ],
      }),
    );
    expect(warnings).toEqual([
      {
        kind: 'no-lightning-advice',
        where: 'outlook[RVB-01]',
        message:
          'Ashgrove has a 50 % afternoon storm chance but the advice says nothing about lightning; add lightning safety for field work.',
      },
    ]);
  });

  it('keeps quiet in a week where no block reaches the high chance', () => {
    const calm = content({
      summary: 'A dry spell: spray in the afternoon if needed.',
      generalAdvice: '',
      outlook: [bulletinRow(block({ afternoon: { ...block().afternoon, rate: 0.39 } }), 3)],
    });
    expect(contradictionWarnings(calm)).toEqual([]);
    expect(contradictionWarnings(calm, 0.3).map((w) => w.kind)).toEqual([
      'afternoon-work',
      'dry-wording',
      'no-lightning-advice',
    ]);
  });

  it('splits Markdown into sentences and list items', () => {
    expect(sentences('One. Two!\n- three\n2. four')).toEqual(['One.', 'Two!', 'three', 'four']);
  });
});

describe('text diff', () => {
  // Line diff by jsdiff (Myers 1986 shortest edit script); the expected script worked by hand.
  it('lists kept, removed and added lines in order', () => {
    const d = textDiff(
      'title\nAshgrove: 40 %\nMillbrook: 20 %\nend\n',
      'title\nAshgrove: 55 %\nMillbrook: 20 %\nend\n',
    );
    expect(d.lines).toEqual([
      { op: 'same', text: 'title' },
      { op: 'removed', text: 'Ashgrove: 40 %' },
      { op: 'added', text: 'Ashgrove: 55 %' },
      { op: 'same', text: 'Millbrook: 20 %' },
      { op: 'same', text: 'end' },
    ]);
    expect([d.added, d.removed]).toEqual([1, 1]);
  });
});
