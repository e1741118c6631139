import { BULLETIN_CAUTIONS, type BulletinBlockOutlook, type BulletinContent } from '@stormhour/shared';

// Invented names and figures of the demo province; no real place or observation.

export function aBlockOutlook(overrides: Partial<BulletinBlockOutlook> = {}): BulletinBlockOutlook {
  return {
    blockCode: 'RVB-01',
    blockName: 'Sallow Ford',
    afternoonChance: 0.52,
    lower: 0.31,
    upper: 0.6,
    n: 40,
    peakHourLocal: 15,
    climatologyChance: 0.25,
    inWords: 'about 1 afternoon in 2, usually 1 in 4',
    ...overrides,
  };
}

export function aBulletinContent(overrides: Partial<BulletinContent> = {}): BulletinContent {
  return {
    unitName: 'Vessary agro-met unit',
    districtCode: 'RVB',
    districtName: 'Riverbend',
    number: 'RVB-2025-27',
    issueDate: '2025-06-28',
    weekStart: '2025-06-30',
    weekEnd: '2025-07-06',
    afternoonFromHour: 12,
    afternoonToHour: 18,
    regimeLabel: 'moist / onshore',
    summary: 'Afternoon storms are likely in the hills.',
    outlook: [
      aBlockOutlook(),
      aBlockOutlook({
        blockCode: 'RVB-02',
        blockName: 'Marrow Bend',
        afternoonChance: null,
        lower: null,
        upper: null,
        n: 0,
        peakHourLocal: null,
        climatologyChance: null,
        inWords: 'no data',
      }),
    ],
    crops: [{ crop: 'rice', stage: 'tillering', advice: 'Spray in the morning.' }],
    generalAdvice: 'Keep livestock away from lone trees.',
    cautions: [...BULLETIN_CAUTIONS],
    ...overrides,
  };
}
