import {
  type AdviceContext,
  type BlockView,
  type CropStageEntry,
  normaliseName,
  stagesInWeek,
} from '@stormhour/shared';

/** What the user adjusts in the rule editor's preview, standing in for the week's outlook. */
export interface ExampleSettings {
  weekStart: string;
  regime: string | null;
  /** Afternoon chance per block code, 0–1; blocks not listed take `defaultChance`. */
  chances: Record<string, number>;
  defaultChance: number;
  /** The usual (all-days) chance, the same for every block of the example. */
  climatology: number;
  peakHourLocal: number | null;
  rainLikely24h: boolean;
}

export interface ExampleCrop {
  crop: string;
  stage: string;
  /** Not in the district's calendar that week; added so the rule being edited has something to act on. */
  addedForPreview: boolean;
}

/** The crops of the example: the calendar's for the week, plus the rule's own crop and stage when missing. */
export function exampleCrops(
  calendar: readonly CropStageEntry[],
  weekStart: string,
  rule: { crop: string | null; stage: string | null } | null,
): ExampleCrop[] {
  const crops: ExampleCrop[] = stagesInWeek(calendar, weekStart).map((c) => ({
    ...c,
    addedForPreview: false,
  }));
  if (rule && (rule.crop || rule.stage)) {
    const crop = rule.crop ? normaliseName(rule.crop) : null;
    const stage = rule.stage ? normaliseName(rule.stage) : null;
    const covered = crops.some(
      (c) => (crop === null || c.crop === crop) && (stage === null || c.stage === stage),
    );
    if (!covered && crop !== null)
      crops.push({
        crop,
        stage: stage ?? calendar.find((e) => e.crop === crop)?.stage ?? 'any stage',
        addedForPreview: true,
      });
    else if (!covered && stage !== null) crops.push({ crop: 'example crop', stage, addedForPreview: true });
  }
  return crops;
}

/**
 * An AdviceContext built from the example settings and the district's blocks. It has the shape the
 * bulletin drafter fills from the real outlook, so the same preview can show either.
 */
export function buildExampleContext(
  district: { id: number; name: string },
  blocks: readonly Pick<BlockView, 'code' | 'name'>[],
  crops: readonly ExampleCrop[],
  settings: ExampleSettings,
): AdviceContext {
  return {
    district,
    weekStart: settings.weekStart,
    regime: settings.regime,
    binHours: 3,
    blocks: blocks.map((b) => ({
      code: b.code,
      name: b.name,
      afternoonChance: settings.chances[b.code] ?? settings.defaultChance,
      lower: null,
      upper: null,
      n: 0,
      peakHourLocal: settings.peakHourLocal,
      climatologyChance: settings.climatology,
      rainLikely24h: settings.rainLikely24h,
    })),
    crops: crops.map(({ crop, stage }) => ({ crop, stage })),
  };
}
