import {
  BULLETIN_CAUTIONS,
  type BulletinBlockOutlook,
  type BulletinContent,
  type BulletinView,
  type InboxBulletinView,
} from '@stormhour/shared';

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

export function aBulletinView(overrides: Partial<BulletinView> = {}): BulletinView {
  const inputs = {
    siteId: 1,
    siteCode: 'VSR',
    regime: 'moist / onshore',
    regimeChosenBy: 'forecast' as const,
    binHours: 3,
    afternoonFrom: 12,
    afternoonTo: 18,
    fingerprint: 'f1',
    proposedBy: [],
  };
  return {
    id: 5,
    districtId: 1,
    districtCode: 'RVB',
    districtName: 'Riverbend',
    weekStart: '2025-06-30',
    weekEnd: '2025-07-06',
    number: 'RVB-2025-27',
    state: 'draft',
    authorId: 8,
    authorEmail: 'writer@vessary.example',
    currentVersion: 1,
    approvedVersion: null,
    createdAt: '2025-06-27T08:00:00.000Z',
    updatedAt: '2025-06-27T08:00:00.000Z',
    sentAt: null,
    content: aBulletinContent(),
    versions: [{ version: 1, savedBy: 'writer@vessary.example', savedAt: '2025-06-27T08:00:00.000Z' }],
    events: [
      {
        transition: 'create',
        from: null,
        to: 'draft',
        actor: 'writer@vessary.example',
        at: '2025-06-27T08:00:00.000Z',
        comment: null,
      },
    ],
    warnings: [],
    recipientsCount: 1,
    draftedFrom: inputs,
    approvedFrom: null,
    outlookChangedSinceDraft: false,
    can: { edit: true, submit: true, approve: false, return: false, send: false, withdraw: false },
    ...overrides,
  };
}

export function anInboxBulletin(overrides: Partial<InboxBulletinView> = {}): InboxBulletinView {
  return {
    id: 5,
    number: 'RVB-2025-27',
    districtName: 'Riverbend',
    weekStart: '2025-06-30',
    weekEnd: '2025-07-06',
    state: 'sent',
    sentAt: '2025-06-28T03:00:00.000Z',
    withdrawnAt: null,
    withdrawalReason: null,
    readAt: null,
    acknowledgedAt: null,
    unread: true,
    highestChance: 0.52,
    reportCount: 0,
    content: aBulletinContent(),
    blocks: [
      { code: 'RVB-01', name: 'Sallow Ford' },
      { code: 'RVB-02', name: 'Marrow Bend' },
    ],
    ...overrides,
  };
}
