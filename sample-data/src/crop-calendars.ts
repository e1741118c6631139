import type { DistrictCode } from './names.js';

/**
 * Crop calendars of the four invented districts (DESIGN §4): rice, pulses and vegetables in the valley,
 * maize, millet and orchards on the hills. Stages are over ISO weeks; a range that starts after it ends
 * wraps over the new year. Invented for the demo, shaped like a monsoon-season calendar (common practice):
 * nurseries at the onset, transplanting in July, flowering in late August, harvest from October.
 */
type Stage = readonly [stage: string, fromWeek: number, toWeek: number];
type Crop = readonly [crop: string, stages: readonly Stage[]];

const RICE: Crop = [
  'rice',
  [
    ['nursery', 24, 27],
    ['transplanting', 27, 30],
    ['tillering', 30, 34],
    ['flowering', 35, 38],
    ['grain filling', 38, 42],
    ['harvest', 43, 46],
  ],
];
const PULSES: Crop = [
  'pulses',
  [
    ['sowing', 22, 24],
    ['vegetative', 24, 28],
    ['flowering', 28, 31],
    ['pod filling', 31, 34],
    ['harvest', 34, 36],
  ],
];
const VEGETABLES: Crop = [
  'vegetables',
  [
    ['nursery', 26, 28],
    ['transplanting', 28, 30],
    ['vegetative', 30, 33],
    ['flowering', 33, 36],
    ['fruiting', 35, 40],
    ['harvest', 37, 44],
  ],
];
const MAIZE: Crop = [
  'maize',
  [
    ['sowing', 23, 25],
    ['vegetative', 25, 30],
    ['tasselling', 30, 32],
    ['grain filling', 32, 36],
    ['harvest', 36, 39],
  ],
];
const MILLET: Crop = [
  'millet',
  [
    ['sowing', 25, 27],
    ['vegetative', 27, 32],
    ['heading', 32, 34],
    ['grain filling', 34, 37],
    ['harvest', 37, 40],
  ],
];
const ORCHARDS: Crop = [
  'orchards',
  [
    ['flowering', 50, 4],
    ['fruit set', 5, 10],
    ['fruit growth', 10, 26],
    ['harvest', 26, 33],
  ],
];

/** Which crops each district grows, and how many weeks later than the valley plain its season runs. */
const DISTRICT_CROPS: Record<DistrictCode, { crops: readonly Crop[]; lagWeeks: number }> = {
  RVB: { crops: [RICE, PULSES, VEGETABLES], lagWeeks: 0 },
  LKS: { crops: [RICE, VEGETABLES, PULSES], lagWeeks: 1 },
  HLF: { crops: [MAIZE, VEGETABLES, ORCHARDS], lagWeeks: 0 },
  UPL: { crops: [MILLET, MAIZE, ORCHARDS], lagWeeks: 1 },
};

/** ISO weeks 1–52 (week 53 exists in some years only, so a lagged week wraps at 52). */
const lag = (week: number, by: number) => ((week - 1 + by) % 52) + 1;

/** The crop calendar CSV the demo loads through the same import a scientist uses. */
export function cropCalendarCsv(): string {
  const lines = ['district_code,crop,stage,from_week,to_week'];
  for (const [district, { crops, lagWeeks }] of Object.entries(DISTRICT_CROPS)) {
    for (const [crop, stages] of crops) {
      for (const [stage, from, to] of stages)
        lines.push(`${district},${crop},${stage},${lag(from, lagWeeks)},${lag(to, lagWeeks)}`);
    }
  }
  return `${lines.join('\n')}\n`;
}
