import { z } from 'zod';

/**
 * The scorecard (DESIGN §3.8): the afternoon chances sent in bulletins, paired with what happened,
 * and scored. Radar pairs come from onsets in the block's afternoon window on days with enough radar
 * availability; report pairs from officers' field reports.
 */

/** Where outcomes come from: radar only, field reports only, or radar with reports where radar has none. */
export const SCORECARD_SOURCES = ['radar', 'reports', 'combined'] as const;
export type ScorecardSource = (typeof SCORECARD_SOURCES)[number];

export const SCORECARD_SOURCE_LABELS: Record<ScorecardSource, string> = {
  radar: 'Radar onsets',
  reports: 'Field reports',
  combined: 'Radar, and field reports where radar has no data',
};

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Give a date such as 2025-09-29');

export const ScorecardQuery = z
  .object({
    districtId: z.coerce.number().int().positive({ message: 'Choose a district' }),
    from: isoDate,
    to: isoDate,
    source: z
      .enum(SCORECARD_SOURCES, { message: `source must be one of ${SCORECARD_SOURCES.join(', ')}` })
      .default('combined'),
    /** Bootstrap resamples for the intervals; 0 leaves them out. */
    resamples: z.coerce.number().int().min(0).max(10_000).default(1000),
  })
  .strict()
  .refine((q) => q.from <= q.to, { message: 'The first day must not be after the last', path: ['to'] });
export type ScorecardQuery = z.infer<typeof ScorecardQuery>;

/** One issued chance and what happened on one day in one block. */
export interface ScorecardPair {
  bulletinId: number;
  bulletinNumber: string;
  blockCode: string;
  blockName: string;
  /** Local date, YYYY-MM-DD. */
  date: string;
  /** The afternoon chance the bulletin gave the block, 0–1. */
  chance: number;
  /** The block's all-days chance printed beside it; null where the bulletin had none. */
  climatologyChance: number | null;
  /** 1 when a storm started in the block's afternoon window that day. */
  observed: 0 | 1;
  source: 'radar' | 'report';
}

export interface ScoreInterval {
  lower: number;
  upper: number;
}

export interface ReliabilityRow {
  lower: number;
  upper: number;
  count: number;
  meanChance: number | null;
  events: number;
  observedFrequency: number | null;
  /** 90 % interval of the observed frequency (Wilson); null for an empty bin. */
  interval: ScoreInterval | null;
  /** Fewer cases than the scorecard trusts (see `fewCases`). */
  few: boolean;
}

export interface ThresholdScores {
  /** "Yes" means an issued chance of at least this. */
  threshold: number;
  hits: number;
  misses: number;
  falseAlarms: number;
  correctNegatives: number;
  hitRate: number | null;
  falseAlarmRatio: number | null;
}

export interface BlockScore {
  blockCode: string;
  blockName: string;
  pairs: number;
  events: number;
  brier: number;
  /** Skill against the block's all-days chance; null without one. */
  skill: number | null;
  /** The bulletins whose chances were scored here, newest first. */
  bulletins: { id: number; number: string }[];
}

/** Radar against field reports on the block-days both cover. */
export interface SourceAgreement {
  both: number;
  radarOnly: number;
  reportOnly: number;
  neither: number;
}

export interface ScorecardView {
  districtId: number;
  districtName: string;
  from: string;
  to: string;
  source: ScorecardSource;
  bulletins: number;
  pairs: number;
  days: number;
  events: number;
  /** Null where there are no pairs (or, for skill, no reference). */
  brier: number | null;
  brierInterval: ScoreInterval | null;
  /** Brier score of the all-days chances on the same pairs, and the skill against it. */
  climatologyBrier: number | null;
  skill: number | null;
  skillInterval: ScoreInterval | null;
  murphy: { reliability: number; resolution: number; uncertainty: number; withinBin: number } | null;
  reliability: ReliabilityRow[];
  /** Bins with fewer pairs than this are marked few. */
  fewCases: number;
  /** ROC points from the highest issued chance down; the curve starts at (0, 0), not listed. */
  roc: { points: { threshold: number; hitRate: number; falseAlarmRate: number }[]; area: number | null };
  rocAreaInterval: ScoreInterval | null;
  thresholds: ThresholdScores[];
  agreement: SourceAgreement;
  /** Worst first. */
  blocks: BlockScore[];
  resamples: number;
}
