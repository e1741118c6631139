import type { AdviceRuleView } from '@stormhour/shared';
import { describe, expect, it } from 'vitest';
import { checkRows, newRow, weekSpans } from './calendarRows';
import { buildExampleContext, exampleCrops } from './exampleContext';
import { checkRuleForm, describeCondition, emptyRuleForm, formFromRule } from './ruleForm';

const rule: AdviceRuleView = {
  id: 1,
  crop: 'rice',
  stage: null,
  condition: {
    combine: 'any',
    clauses: [
      { metric: 'afternoonChance', aggregate: 'districtMean', op: '>=', value: 0.45 },
      { metric: 'regimeMoisture', op: 'isNot', value: 'dry' },
      { metric: 'rainLikely24h', aggregate: 'allBlocks', value: true },
      { metric: 'peakHour', aggregate: 'anyBlock', op: '<', value: 15 },
    ],
  },
  priority: 4,
  text: 'Drain {crop} fields.',
  source: 'common practice',
  active: true,
  origin: 'unit',
  updatedAt: '2026-11-30T08:00:00.000Z',
  updatedBy: null,
};

describe('rule form', () => {
  it('round-trips a stored rule through the form unchanged (chance shown in per cent)', () => {
    const form = formFromRule(rule);
    expect(form.clauses[0].value).toBe('45');
    const checked = checkRuleForm(form);
    expect(checked.ok && checked.rule).toEqual({
      crop: rule.crop,
      stage: rule.stage,
      condition: rule.condition,
      priority: rule.priority,
      text: rule.text,
      source: rule.source,
      active: rule.active,
    });
  });

  it('speaks of per cent when a chance is out of range, and names an empty text', () => {
    const form = { ...emptyRuleForm(), text: '' };
    form.clauses[0].value = '140';
    const checked = checkRuleForm(form);
    expect(checked.ok).toBe(false);
    if (checked.ok) return;
    expect(checked.errors['condition.clauses.0.value']).toBe('Give a chance from 0 to 100 %');
    expect(checked.errors.text).toBe('Write the advice');
  });

  it('describes a condition in words', () => {
    expect(describeCondition(rule.condition)).toBe(
      'afternoon chance ≥ 45 % as the district mean or regime is not dry or rain likely within 24 h in every block or peak hour < 15:00 in any block',
    );
    expect(describeCondition({ combine: 'all', clauses: [] })).toBe('always');
  });
});

describe('calendar rows', () => {
  it('names the cell of each problem by its row', () => {
    const rows = [newRow({ crop: 'rice', stage: 'nursery', fromWeek: '24', toWeek: '' })];
    const checked = checkRows(rows);
    expect(checked).toEqual({
      ok: false,
      errors: { [`${rows[0].key}.toWeek`]: 'Give an ISO week number from 1 to 53' },
    });
  });

  it('splits a stage over the new year into two spans', () => {
    expect(weekSpans(50, 4, 53)).toEqual([
      [50, 53],
      [1, 4],
    ]);
    expect(weekSpans(10, 12)).toEqual([[10, 12]]);
  });
});

describe('example context', () => {
  const calendar = [{ crop: 'rice', stage: 'tillering', fromWeek: 30, toWeek: 34 }];

  it('takes the calendar’s crops for the week and adds the rule’s own when missing', () => {
    // 2025-07-28 is in ISO week 31 (see shared iso-week spec, checked against date-fns).
    expect(exampleCrops(calendar, '2025-07-28', { crop: 'rice', stage: null })).toEqual([
      { crop: 'rice', stage: 'tillering', addedForPreview: false },
    ]);
    expect(exampleCrops(calendar, '2025-07-28', { crop: 'Pulses', stage: 'harvest' })).toEqual([
      { crop: 'rice', stage: 'tillering', addedForPreview: false },
      { crop: 'pulses', stage: 'harvest', addedForPreview: true },
    ]);
  });

  it('gives every block the example’s figures', () => {
    const context = buildExampleContext(
      { id: 1, name: 'Riverbend' },
      [
        { code: 'A', name: 'Sallow Ford' },
        { code: 'B', name: 'Marrow Bend' },
      ],
      [],
      {
        weekStart: '2025-07-28',
        regime: null,
        chances: { A: 0.6 },
        defaultChance: 0.3,
        climatology: 0.25,
        peakHourLocal: 15,
        rainLikely24h: true,
      },
    );
    expect(
      context.blocks.map((b) => [b.code, b.afternoonChance, b.climatologyChance, b.rainLikely24h]),
    ).toEqual([
      ['A', 0.6, 0.25, true],
      ['B', 0.3, 0.25, true],
    ]);
  });
});
