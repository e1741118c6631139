import { z } from 'zod';
import { MOISTURE_CLASSES } from './regimes.js';

// ── Crop calendars ────────────────────────────────────────────────────────────────────────────────

/** Stages usually kept for the crops of the demo province; a calendar may use any other name too. */
export const USUAL_STAGES: Record<string, readonly string[]> = {
  rice: ['nursery', 'transplanting', 'tillering', 'flowering', 'grain filling', 'harvest'],
  pulses: ['sowing', 'vegetative', 'flowering', 'pod filling', 'harvest'],
  vegetables: ['nursery', 'transplanting', 'vegetative', 'flowering', 'fruiting', 'harvest'],
  maize: ['sowing', 'vegetative', 'tasselling', 'grain filling', 'harvest'],
  millet: ['sowing', 'vegetative', 'heading', 'grain filling', 'harvest'],
  orchards: ['flowering', 'fruit set', 'fruit growth', 'harvest'],
};

/** Crop and stage names are kept lower case with single spaces, so rules and calendars match. */
export function normaliseName(text: string): string {
  return text.trim().replace(/\s+/g, ' ').toLowerCase();
}

const cropName = z
  .string()
  .transform(normaliseName)
  .pipe(z.string().min(1, 'Name the crop').max(40, 'Keep the crop’s name to 40 characters'));
const stageName = z
  .string()
  .transform(normaliseName)
  .pipe(z.string().min(1, 'Name the stage').max(40, 'Keep the stage’s name to 40 characters'));
const isoWeekNumber = z
  .number({ error: 'Give an ISO week number from 1 to 53' })
  .int('Give a whole ISO week number')
  .min(1, 'ISO weeks run from 1 to 53')
  .max(53, 'ISO weeks run from 1 to 53');

/**
 * One stage of one crop: the ISO weeks (ISO 8601) it spans, every year. A range whose first week is
 * after its last wraps over the new year (e.g. 50–6).
 */
export const CropStageEntry = z.object({
  crop: cropName,
  stage: stageName,
  fromWeek: isoWeekNumber,
  toWeek: isoWeekNumber,
});
export type CropStageEntry = z.infer<typeof CropStageEntry>;

export const CropCalendarRequest = z
  .object({ entries: z.array(CropStageEntry).max(500, 'A calendar holds at most 500 stages') })
  .strict()
  .superRefine((req, ctx) => {
    const seen = new Map<string, number>();
    req.entries.forEach((e, i) => {
      const key = `${e.crop}|${e.stage}|${e.fromWeek}|${e.toWeek}`;
      const first = seen.get(key);
      if (first !== undefined)
        ctx.addIssue({
          code: 'custom',
          path: ['entries', i],
          message: `The same stage is listed twice (also entry ${first + 1})`,
        });
      else seen.set(key, i);
    });
  });
export type CropCalendarRequest = z.infer<typeof CropCalendarRequest>;

export interface CropCalendarView {
  districtId: number;
  districtCode: string;
  districtName: string;
  entries: CropStageEntry[];
  updatedAt: string | null;
}

/** Columns a crop calendar CSV must have, in any order. */
export const CROP_CALENDAR_COLUMNS = ['district_code', 'crop', 'stage', 'from_week', 'to_week'] as const;

export interface CropCalendarImportResult {
  districts: { code: string; stages: number }[];
}

// ── Advice rules ──────────────────────────────────────────────────────────────────────────────────

export const NUMERIC_METRICS = ['afternoonChance', 'peakHour', 'ratioToClimatology'] as const;
export type NumericMetric = (typeof NUMERIC_METRICS)[number];
export const BLOCK_AGGREGATES = ['anyBlock', 'allBlocks', 'districtMean'] as const;
export type BlockAggregate = (typeof BLOCK_AGGREGATES)[number];
export const COMPARISONS = ['>=', '>', '<=', '<'] as const;
export type Comparison = (typeof COMPARISONS)[number];

const NumericClause = z
  .object({
    metric: z.enum(NUMERIC_METRICS),
    aggregate: z.enum(BLOCK_AGGREGATES),
    op: z.enum(COMPARISONS),
    value: z.number({ error: 'Give a number' }),
  })
  .strict()
  .superRefine((c, ctx) => {
    const bad = (message: string) => ctx.addIssue({ code: 'custom', path: ['value'], message });
    if (c.metric === 'afternoonChance' && (c.value < 0 || c.value > 1))
      bad('Give the chance as a fraction from 0 to 1 (0.4 = 40 %)');
    if (c.metric === 'peakHour' && (c.value < 0 || c.value > 24 || !Number.isInteger(c.value)))
      bad('Give a local hour from 0 to 24');
    if (c.metric === 'ratioToClimatology' && (c.value < 0 || c.value > 20))
      bad('Give a ratio from 0 to 20 (1.5 = half as likely again as usual)');
  });

const MoistureClause = z
  .object({
    metric: z.literal('regimeMoisture'),
    op: z.enum(['is', 'isNot']),
    value: z.enum(MOISTURE_CLASSES),
  })
  .strict();

const RainClause = z
  .object({
    metric: z.literal('rainLikely24h'),
    aggregate: z.enum(['anyBlock', 'allBlocks']),
    value: z.boolean(),
  })
  .strict();

export const ConditionClause = z.union([NumericClause, MoistureClause, RainClause]);
export type ConditionClause = z.infer<typeof ConditionClause>;

/** Clauses combined with all (and) or any (or); no clauses means the rule always applies. */
export const RuleCondition = z
  .object({
    combine: z.enum(['all', 'any']),
    clauses: z.array(ConditionClause).max(8, 'Keep a condition to 8 clauses'),
  })
  .strict();
export type RuleCondition = z.infer<typeof RuleCondition>;

/** Placeholders advice text may use, with what each becomes. */
export const PLACEHOLDERS = {
  blocks: 'the blocks that meet the condition, by name',
  window: 'the storm-prone hours of those blocks, e.g. 15:00–18:00',
  chance: 'the highest afternoon chance among them, in words and %',
  baseRate: 'the usual (all-days) chance of that block, in words and %',
  peakHour: 'the earliest peak hour among them, e.g. 15:00',
  crop: 'the crop (rules for a crop or a stage only)',
  stage: 'the crop’s stage this week (rules for a crop or a stage only)',
  district: 'the district’s name',
  week: 'the week, e.g. 4–10 August 2025',
} as const;
export type PlaceholderName = keyof typeof PLACEHOLDERS;
export const PLACEHOLDER_NAMES = Object.keys(PLACEHOLDERS) as PlaceholderName[];

export interface PlaceholderProblem {
  /** What was written between the braces, or the lone brace. */
  token: string;
  /** 1-based character position of the opening brace. */
  position: number;
  problem: string;
}

/** Every placeholder in a text that cannot be filled, with its position. */
export function placeholderProblems(text: string, opts: { general: boolean }): PlaceholderProblem[] {
  const problems: PlaceholderProblem[] = [];
  const known = PLACEHOLDER_NAMES.map((n) => `{${n}}`).join(', ');
  for (let i = 0; i < text.length; i++) {
    if (text[i] === '}') {
      problems.push({ token: '}', position: i + 1, problem: 'a closing brace with no opening brace' });
      continue;
    }
    if (text[i] !== '{') continue;
    const end = text.indexOf('}', i + 1);
    const nextOpen = text.indexOf('{', i + 1);
    if (end < 0 || (nextOpen >= 0 && nextOpen < end)) {
      problems.push({ token: '{', position: i + 1, problem: 'an opening brace that is never closed' });
      continue;
    }
    const name = text.slice(i + 1, end);
    if (!(name in PLACEHOLDERS)) {
      problems.push({
        token: `{${name}}`,
        position: i + 1,
        problem: `unknown placeholder; use one of ${known}`,
      });
    } else if (opts.general && (name === 'crop' || name === 'stage')) {
      problems.push({
        token: `{${name}}`,
        position: i + 1,
        problem: 'only a rule for a crop or a stage can name its crop and stage',
      });
    }
    i = end;
  }
  return problems;
}

export const AdviceRuleRequest = z
  .object({
    crop: cropName.nullable(),
    stage: stageName.nullable(),
    condition: RuleCondition,
    /** 1 comes first; ties keep the order of the rules' ids. */
    priority: z
      .number({ error: 'Give a priority from 1 to 99' })
      .int('Give a whole number')
      .min(1, 'Priorities run from 1 (first) to 99')
      .max(99, 'Priorities run from 1 (first) to 99'),
    text: z.string().trim().min(1, 'Write the advice').max(1000, 'Keep the advice to 1000 characters'),
    /** "common practice" or a citation. */
    source: z.string().trim().min(1, 'Say where the advice comes from, or "common practice"').max(300),
    active: z.boolean(),
  })
  .strict()
  .superRefine((rule, ctx) => {
    for (const p of placeholderProblems(rule.text, { general: rule.crop === null && rule.stage === null }))
      ctx.addIssue({
        code: 'custom',
        path: ['text'],
        message: `${p.token} at character ${p.position}: ${p.problem}`,
      });
  });
export type AdviceRuleRequest = z.infer<typeof AdviceRuleRequest>;

export interface AdviceRuleView extends AdviceRuleRequest {
  id: number;
  /** Shipped with Stormhour ("default") or written by the unit ("unit"). */
  origin: 'default' | 'unit';
  updatedAt: string;
  updatedBy: string | null;
}

// ── What the rules are evaluated against ──────────────────────────────────────────────────────────

/**
 * The week's outlook of one district, as the rules see it. The bulletin drafter fills it from the
 * block outlook; the rule editor's preview fills it from an example the user adjusts.
 */
export interface AdviceContext {
  district: { id: number; name: string };
  /** First day of the valid week, YYYY-MM-DD. */
  weekStart: string;
  /** The expected regime, e.g. "moist / onshore"; null when unknown. */
  regime: string | null;
  /** Width of the outlook's time-of-day bins in hours (3 by default). */
  binHours: number;
  blocks: AdviceBlock[];
  /** Crops and their stages this week, from the district's crop calendar. */
  crops: { crop: string; stage: string }[];
}

export interface AdviceBlock {
  code: string;
  name: string;
  /** Chance of at least one storm start in the afternoon window on a day of the week, 0–1. */
  afternoonChance: number | null;
  /** The 90 % interval of that chance. */
  lower: number | null;
  upper: number | null;
  /** Days behind the figure. */
  n: number;
  /** Local start hour of the time-of-day bin with the most onsets. */
  peakHourLocal: number | null;
  /** The same chance over all days of the record, whatever the regime. */
  climatologyChance: number | null;
  /** From a short-range forecast when one is available; unknown otherwise. */
  rainLikely24h?: boolean;
}

export interface ProposedAdvice {
  ruleId: number;
  priority: number;
  text: string;
  source: string;
  /** Codes of the blocks that met the condition (every block with data when none narrowed it). */
  blocks: string[];
}

export interface CropAdvice {
  crop: string;
  stage: string;
  advice: ProposedAdvice[];
}

export interface AdviceProposal {
  crops: CropAdvice[];
  general: ProposedAdvice[];
}
