import { describe, expect, it } from 'vitest';
import type { AdviceBlock, AdviceContext, ConditionClause, RuleCondition } from '../advice.js';
import { AdviceRuleRequest, placeholderProblems } from '../advice.js';
import {
  type EvaluableRule,
  evaluateRule,
  evaluateRules,
  listInWords,
  weekInWords,
} from './evaluate-rules.js';

// Invented blocks of the demo province; the figures are chosen so each case is worked by hand.
function aBlock(overrides: Partial<AdviceBlock>): AdviceBlock {
  return {
    code: 'RVB-01',
    name: 'Sallow Ford',
    afternoonChance: 0.2,
    lower: 0.1,
    upper: 0.3,
    n: 40,
    peakHourLocal: 15,
    climatologyChance: 0.25,
    ...overrides,
  };
}

function aContext(overrides: Partial<AdviceContext> = {}): AdviceContext {
  return {
    district: { id: 1, name: 'Riverbend' },
    weekStart: '2025-08-04',
    regime: 'moist / onshore',
    binHours: 3,
    blocks: [
      aBlock({ code: 'RVB-01', name: 'Sallow Ford', afternoonChance: 0.52, peakHourLocal: 15 }),
      aBlock({ code: 'RVB-02', name: 'Marrow Bend', afternoonChance: 0.35, peakHourLocal: 12 }),
      aBlock({ code: 'RVB-03', name: 'Tallow Reach', afternoonChance: 0.1, peakHourLocal: 18 }),
    ],
    crops: [
      { crop: 'rice', stage: 'tillering' },
      { crop: 'pulses', stage: 'harvest' },
    ],
    ...overrides,
  };
}

let nextId = 1;
function aRule(overrides: Partial<EvaluableRule> = {}): EvaluableRule {
  return {
    id: nextId++,
    crop: null,
    stage: null,
    condition: { combine: 'all', clauses: [] },
    priority: 50,
    text: 'Advice.',
    source: 'common practice',
    active: true,
    ...overrides,
  };
}

const when = (combine: RuleCondition['combine'], ...clauses: ConditionClause[]): RuleCondition => ({
  combine,
  clauses,
});
const chance = (aggregate: 'anyBlock' | 'allBlocks' | 'districtMean', op: '>=' | '<', value: number) =>
  ({ metric: 'afternoonChance', aggregate, op, value }) as const;

describe('evaluateRule: conditions (worked by hand from the context above)', () => {
  it.each<[string, RuleCondition, boolean, string[]]>([
    ['no clause always holds', when('all'), true, ['RVB-01', 'RVB-02', 'RVB-03']],
    ['any block ≥ 40 %', when('all', chance('anyBlock', '>=', 0.4)), true, ['RVB-01']],
    ['any block ≥ 60 %', when('all', chance('anyBlock', '>=', 0.6)), false, ['RVB-01', 'RVB-02', 'RVB-03']],
    ['all blocks ≥ 10 %', when('all', chance('allBlocks', '>=', 0.1)), true, ['RVB-01', 'RVB-02', 'RVB-03']],
    ['all blocks ≥ 20 %', when('all', chance('allBlocks', '>=', 0.2)), false, ['RVB-01', 'RVB-02', 'RVB-03']],
    // mean of 0.52, 0.35, 0.10 = 0.3233…
    [
      'district mean ≥ 32 %',
      when('all', chance('districtMean', '>=', 0.32)),
      true,
      ['RVB-01', 'RVB-02', 'RVB-03'],
    ],
    [
      'district mean ≥ 33 %',
      when('all', chance('districtMean', '>=', 0.33)),
      false,
      ['RVB-01', 'RVB-02', 'RVB-03'],
    ],
    ['any block < 15 % (dry spell)', when('all', chance('anyBlock', '<', 0.15)), true, ['RVB-03']],
    [
      'peak before 15:00 in any block',
      when('all', { metric: 'peakHour', aggregate: 'anyBlock', op: '<', value: 15 }),
      true,
      ['RVB-02'],
    ],
    [
      // ratios to the 25 % climatology: 2.08, 1.4, 0.4
      'twice the usual chance in any block',
      when('all', { metric: 'ratioToClimatology', aggregate: 'anyBlock', op: '>=', value: 2 }),
      true,
      ['RVB-01'],
    ],
    [
      'regime is moist',
      when('all', { metric: 'regimeMoisture', op: 'is', value: 'moist' }),
      true,
      ['RVB-01', 'RVB-02', 'RVB-03'],
    ],
    [
      'regime is not moist',
      when('all', { metric: 'regimeMoisture', op: 'isNot', value: 'moist' }),
      false,
      ['RVB-01', 'RVB-02', 'RVB-03'],
    ],
    [
      'all: ≥ 30 % and peak before 15:00 → only the block meeting both',
      when('all', chance('anyBlock', '>=', 0.3), {
        metric: 'peakHour',
        aggregate: 'anyBlock',
        op: '<',
        value: 15,
      }),
      true,
      ['RVB-02'],
    ],
    [
      'all: met by different blocks → the union',
      when('all', chance('anyBlock', '>=', 0.5), {
        metric: 'peakHour',
        aggregate: 'anyBlock',
        op: '>',
        value: 16,
      }),
      true,
      ['RVB-01', 'RVB-03'],
    ],
    [
      'any: one clause met is enough, and only met clauses name blocks',
      when('any', chance('anyBlock', '>=', 0.9), chance('anyBlock', '>=', 0.3)),
      true,
      ['RVB-01', 'RVB-02'],
    ],
    [
      'all: one clause unmet stops the rule',
      when('all', chance('anyBlock', '>=', 0.3), chance('anyBlock', '>=', 0.9)),
      false,
      ['RVB-01', 'RVB-02'],
    ],
  ])('%s', (_name, condition, fired, blocks) => {
    const result = evaluateRule({ condition }, aContext());
    expect(result.fired).toBe(fired);
    expect(result.blocks).toEqual(blocks);
  });

  it('reports the deciding figure of each clause', () => {
    const result = evaluateRule(
      { condition: when('all', chance('anyBlock', '>=', 0.6), chance('allBlocks', '>=', 0.2)) },
      aContext(),
    );
    expect(result.clauses.map((c) => c.observed)).toEqual([0.52, 0.1]);
  });

  it('skips blocks without data, and does not fire on a district with none', () => {
    const ctx = aContext({
      blocks: [
        aBlock({ code: 'A', afternoonChance: null, climatologyChance: null }),
        aBlock({ code: 'B', afternoonChance: 0.3 }),
      ],
    });
    expect(evaluateRule({ condition: when('all', chance('allBlocks', '>=', 0.3)) }, ctx).fired).toBe(true);
    const empty = aContext({ blocks: [aBlock({ afternoonChance: null, climatologyChance: null })] });
    expect(evaluateRule({ condition: when('all', chance('allBlocks', '<', 0.9)) }, empty).fired).toBe(false);
    expect(evaluateRule({ condition: when('all', chance('districtMean', '<', 0.9)) }, empty).fired).toBe(
      false,
    );
  });

  it('does not guess an unknown regime or an unknown rain forecast', () => {
    const ctx = aContext({ regime: null });
    expect(
      evaluateRule({ condition: when('all', { metric: 'regimeMoisture', op: 'isNot', value: 'dry' }) }, ctx)
        .fired,
    ).toBe(false);
    const rain = { metric: 'rainLikely24h', aggregate: 'anyBlock', value: true } as const;
    expect(evaluateRule({ condition: when('all', rain) }, ctx).fired).toBe(false);
    const wet = aContext({
      blocks: [aBlock({ code: 'A', rainLikely24h: false }), aBlock({ code: 'B', rainLikely24h: true })],
    });
    const result = evaluateRule({ condition: when('all', rain) }, wet);
    expect(result).toMatchObject({ fired: true, blocks: ['B'] });
    expect(evaluateRule({ condition: when('all', { ...rain, aggregate: 'allBlocks' }) }, wet).fired).toBe(
      false,
    );
  });
});

describe('evaluateRules: what is proposed, in what order, with what text', () => {
  it('proposes crop advice per crop and stage, general advice apart, each ordered by priority', () => {
    const rules = [
      aRule({ id: 10, priority: 20, text: 'General B.' }),
      aRule({ id: 11, priority: 5, text: 'General A.' }),
      aRule({ id: 12, crop: 'rice', priority: 30, text: 'Rice at {stage}.' }),
      aRule({ id: 13, stage: 'harvest', priority: 10, text: 'Harvest {crop}.' }),
      aRule({ id: 14, crop: 'rice', stage: 'flowering', text: 'Not this week.' }),
      aRule({ id: 15, crop: 'rice', priority: 1, text: 'Rice first.' }),
      aRule({ id: 16, priority: 1, text: 'Inactive.', active: false }),
      aRule({ id: 17, priority: 5, text: 'General C, same priority as A, later id.' }),
      aRule({ id: 18, crop: 'Rice', text: 'Crop names match whatever their case.' }),
    ];
    const proposal = evaluateRules(rules, aContext());
    expect(proposal.general.map((a) => a.text)).toEqual([
      'General A.',
      'General C, same priority as A, later id.',
      'General B.',
    ]);
    expect(proposal.crops.map((c) => [c.crop, c.stage, c.advice.map((a) => a.text)])).toEqual([
      ['rice', 'tillering', ['Rice first.', 'Rice at tillering.', 'Crop names match whatever their case.']],
      ['pulses', 'harvest', ['Harvest pulses.']],
    ]);
  });

  it('fills every placeholder', () => {
    const rule = aRule({
      crop: 'rice',
      condition: when('all', chance('anyBlock', '>=', 0.3)),
      text: '{district}, {week}: storms are likely in {blocks} ({chance}; {baseRate}), from {peakHour}, mostly {window}. {crop} at {stage}.',
    });
    const [rice] = evaluateRules([rule], aContext()).crops;
    // Blocks ≥ 30 %: Sallow Ford 52 % (peak 15) and Marrow Bend 35 % (peak 12); 3-hour bins → 12:00–18:00.
    expect(rice.advice[0].text).toBe(
      'Riverbend, 4–10 August 2025: storms are likely in Sallow Ford and Marrow Bend ' +
        '(about 1 afternoon in 2 (35–52 %); usually 1 in 4 (25 %)), from 12:00, mostly 12:00–18:00. rice at tillering.',
    );
    expect(rice.advice[0].blocks).toEqual(['RVB-01', 'RVB-02']);
  });

  it('says "all blocks" when every block met the condition, and fills one block without a range', () => {
    const all = aRule({ text: 'In {blocks}.' });
    expect(evaluateRules([all], aContext()).general[0].text).toBe('In all blocks.');
    const one = aRule({
      condition: when('all', chance('anyBlock', '>=', 0.5)),
      text: '{blocks}: {chance}, peak {peakHour}, {window}.',
    });
    expect(evaluateRules([one], aContext()).general[0].text).toBe(
      'Sallow Ford: about 1 afternoon in 2 (52 %), peak 15:00, 15:00–18:00.',
    );
  });

  it('falls back to the afternoon window and plain words when the outlook has no figures', () => {
    const ctx = aContext({
      blocks: [aBlock({ afternoonChance: null, climatologyChance: null, peakHourLocal: null })],
    });
    const rule = aRule({ text: '{chance}; {baseRate}; {peakHour}; {window}.' });
    expect(evaluateRules([rule], ctx).general[0].text).toBe('unknown; unknown; the afternoon; 12:00–18:00.');
  });
});

describe('placeholders', () => {
  it.each([
    ['Spray before {peakHour}.', true, []],
    ['Spray before {peakhour}.', true, ['{peakhour} at character 14']],
    ['{chanse} in {blocks}', true, ['{chanse} at character 1']],
    ['Protect {crop}.', true, ['{crop} at character 9']],
    ['Protect {crop}.', false, []],
    ['Open { never closed', true, ['{ at character 6']],
    ['Stray } brace', true, ['} at character 7']],
  ])('"%s" (general rule: %s) → %j', (text, general, problems) => {
    expect(
      placeholderProblems(text, { general }).map((p) => `${p.token} at character ${p.position}`),
    ).toEqual(problems);
  });

  it('refuses an unknown placeholder on save, naming it and where it is', () => {
    const result = AdviceRuleRequest.safeParse({
      crop: null,
      stage: null,
      condition: { combine: 'all', clauses: [] },
      priority: 3,
      text: 'Finish spraying by {peak_hour}.',
      source: 'common practice',
      active: true,
    });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].path).toEqual(['text']);
    expect(result.error?.issues[0].message).toMatch(
      /^\{peak_hour\} at character 20: unknown placeholder; use one of \{blocks\}/,
    );
  });
});

describe('words', () => {
  it.each([
    [[], ''],
    [['A'], 'A'],
    [['A', 'B'], 'A and B'],
    [['A', 'B', 'C'], 'A, B and C'],
  ])('lists %j as "%s"', (items, words) => {
    expect(listInWords(items)).toBe(words);
  });

  // Calendar facts (any calendar): 4 Aug 2025 is a Monday; July has 31 days; 2025-12-29 + 6 = 2026-01-04.
  it.each([
    ['2025-08-04', '4–10 August 2025'],
    ['2025-07-28', '28 July – 3 August 2025'],
    ['2025-12-29', '29 December 2025 – 4 January 2026'],
  ])('names the week of %s as %s', (day, words) => {
    expect(weekInWords(day)).toBe(words);
  });
});
