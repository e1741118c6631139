import type { AdviceRuleRequest } from '@stormhour/shared';

const LABELS = 'Follow the product label and licensed local advice.';
const WARNINGS = 'Official warnings of the national weather service come first.';

/**
 * The rules Stormhour ships, loaded into an empty rules table at start. Each says where its advice
 * comes from; the unit edits or retires them like its own. Chances are fractions (0.4 = 40 %).
 */
export const DEFAULT_ADVICE_RULES: AdviceRuleRequest[] = [
  {
    crop: null,
    stage: null,
    priority: 1,
    condition: {
      combine: 'all',
      clauses: [{ metric: 'afternoonChance', aggregate: 'anyBlock', op: '>=', value: 0.1 }],
    },
    text:
      'Lightning: storms are possible in {blocks} ({chance}), most likely {window}. When thunder is heard, ' +
      'stop field work and go to a building or a closed vehicle, not under a tree or an open shelter; wait ' +
      '30 minutes after the last thunder before going back out. In those hours do not start field jobs ' +
      `that cannot be stopped quickly. ${WARNINGS}`,
    source:
      '30-minute wait after the last thunder: Holle, López & Zimmermann 1999, Bull. Amer. Meteor. Soc. 80; ' +
      '"When thunder roars, go indoors": US National Weather Service; common practice',
    active: true,
  },
  {
    crop: null,
    stage: null,
    priority: 5,
    condition: {
      combine: 'all',
      clauses: [{ metric: 'rainLikely24h', aggregate: 'anyBlock', value: true }],
    },
    text:
      'Rain is likely within 24 hours in {blocks}: postpone spraying and fertiliser top-dressing there ' +
      `until the rain-free period on the label can be kept. ${LABELS}`,
    source: 'common practice',
    active: true,
  },
  {
    crop: null,
    stage: null,
    priority: 10,
    condition: {
      combine: 'all',
      clauses: [{ metric: 'afternoonChance', aggregate: 'anyBlock', op: '>=', value: 0.4 }],
    },
    text:
      'Afternoon storms are likely in {blocks}: {chance}, {baseRate}. Spray and top-dress in the morning, ' +
      `finishing well before {peakHour}, and keep to the rain-free period on the label. ${LABELS}`,
    source: 'common practice',
    active: true,
  },
  {
    crop: null,
    stage: null,
    priority: 15,
    condition: {
      combine: 'all',
      clauses: [
        { metric: 'afternoonChance', aggregate: 'districtMean', op: '>=', value: 0.45 },
        { metric: 'regimeMoisture', op: 'is', value: 'moist' },
      ],
    },
    text:
      'Heavy showers are likely this week ({chance}, {baseRate}). Clear drains and field outlets now and ' +
      `postpone irrigation in {blocks} until after the rain. ${WARNINGS}`,
    source: 'common practice',
    active: true,
  },
  {
    crop: null,
    stage: null,
    priority: 20,
    condition: {
      combine: 'all',
      clauses: [{ metric: 'afternoonChance', aggregate: 'anyBlock', op: '>=', value: 0.3 }],
    },
    text:
      'Livestock: keep animals away from isolated trees, open water and wire fences when storms build in ' +
      '{blocks}, most likely {window}; bring them to shelter before {peakHour} where possible.',
    source: 'common practice',
    active: true,
  },
  {
    crop: null,
    stage: 'harvest',
    priority: 10,
    condition: {
      combine: 'all',
      clauses: [{ metric: 'afternoonChance', aggregate: 'anyBlock', op: '>=', value: 0.3 }],
    },
    text:
      'Storms are likely in {blocks} ({chance}), most often {window}. Harvest mature {crop} in the dry ' +
      'morning hours and cover or store the produce before {peakHour}.',
    source: 'common practice',
    active: true,
  },
  {
    crop: null,
    stage: 'harvest',
    priority: 12,
    condition: {
      combine: 'all',
      clauses: [{ metric: 'afternoonChance', aggregate: 'allBlocks', op: '<', value: 0.2 }],
    },
    text:
      'A dry spell is likely ({chance}): a good week to harvest mature {crop} and dry the produce. ' +
      'Keep covers at hand; a storm can still form.',
    source: 'common practice',
    active: true,
  },
  {
    crop: 'orchards',
    stage: null,
    priority: 20,
    condition: {
      combine: 'all',
      clauses: [{ metric: 'afternoonChance', aggregate: 'anyBlock', op: '>=', value: 0.4 }],
    },
    text:
      'Storm gusts are possible in {blocks} ({chance}). Prop heavily laden branches and stake young trees ' +
      '({stage}); do not work on ladders or under trees when storms build.',
    source: 'common practice',
    active: true,
  },
  {
    crop: 'maize',
    stage: null,
    priority: 25,
    condition: {
      combine: 'all',
      clauses: [{ metric: 'afternoonChance', aggregate: 'anyBlock', op: '>=', value: 0.4 }],
    },
    text:
      'Storm gusts can flatten tall {crop} at {stage} in {blocks} ({chance}). Earth up the rows and stake ' +
      'where practical.',
    source: 'common practice',
    active: true,
  },
];
