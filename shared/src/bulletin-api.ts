import { z } from 'zod';
import type { BulletinContent } from './bulletins.js';
import type { OutboxRecipientStatus } from './mail.js';

/**
 * The bulletins API (DESIGN §3.7): drafting, review, sending, the officers' inbox and field reports.
 * Request schemas validate at the server's edge and in the client's forms; response types are what the
 * routes answer.
 */

// ── States ────────────────────────────────────────────────────────────────────────────────────────

/**
 * draft → in_review → approved → sent → withdrawn; in_review → returned (editable again, with the
 * reviewer's comment) → in_review. Only draft and returned bulletins can be edited.
 */
export const BULLETIN_STATES = ['draft', 'in_review', 'returned', 'approved', 'sent', 'withdrawn'] as const;
export type BulletinState = (typeof BULLETIN_STATES)[number];

export const BULLETIN_STATE_LABELS: Record<BulletinState, string> = {
  draft: 'Draft',
  in_review: 'In review',
  returned: 'Returned',
  approved: 'Approved',
  sent: 'Sent',
  withdrawn: 'Withdrawn',
};

/** States in which the writer may save new versions. */
export const EDITABLE_STATES: readonly BulletinState[] = ['draft', 'returned'];

export const BULLETIN_TRANSITIONS = ['create', 'submit', 'approve', 'return', 'send', 'withdraw'] as const;
export type BulletinTransition = (typeof BULLETIN_TRANSITIONS)[number];

/** An afternoon chance from this value up counts as high for the contradiction warnings. */
export const HIGH_AFTERNOON_CHANCE = 0.4;

// ── Requests ──────────────────────────────────────────────────────────────────────────────────────

const isoDate = z
  .string({ error: 'Give a date such as 2025-09-29' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Give a date such as 2025-09-29');

/** POST /api/bulletins: a draft for a district's ISO week (weekStart must be a Monday). */
export const CreateBulletinRequest = z
  .object({
    districtId: z.number({ error: 'Choose a district' }).int().positive('Choose a district'),
    weekStart: isoDate,
    /** The radar site whose outlook is used; by default the one covering most of the district's blocks. */
    siteId: z.number().int().positive().optional(),
    /**
     * The regime the chances are conditioned on: a regime name, "all" for every day, or left out for
     * the week's expected regime (from forecast grids; all days when there are none).
     */
    regime: z.string().trim().min(1).max(80).optional(),
  })
  .strict();
export type CreateBulletinRequest = z.infer<typeof CreateBulletinRequest>;

export const BulletinListQuery = z
  .object({
    districtId: z.coerce.number().int().positive().optional(),
    state: z
      .enum(BULLETIN_STATES, { message: `state must be one of ${BULLETIN_STATES.join(', ')}` })
      .optional(),
  })
  .strict();
export type BulletinListQuery = z.infer<typeof BulletinListQuery>;

const richText = (what: string, max: number) => z.string().max(max, `Keep the ${what} to ${max} characters`);

/**
 * PUT /api/bulletins/:id: the writer's parts of the content. The outlook table, header and cautions come
 * from the draft and cannot be edited (the numbers must stay the outlook's). `baseVersion` is the version
 * the edit started from: a save over a newer version is refused (409) rather than lost.
 */
export const SaveBulletinRequest = z
  .object({
    baseVersion: z.number({ error: 'Say which version the edit started from' }).int().positive(),
    issueDate: isoDate,
    summary: richText('summary', 4000),
    crops: z
      .array(
        z
          .object({
            crop: z.string().trim().min(1, 'Name the crop').max(40),
            stage: z.string().trim().min(1, 'Name the stage').max(40),
            advice: richText('advice', 4000),
          })
          .strict(),
      )
      .max(50, 'Keep the crop table to 50 rows'),
    generalAdvice: richText('general advice', 4000),
  })
  .strict();
export type SaveBulletinRequest = z.infer<typeof SaveBulletinRequest>;

/** POST /api/bulletins/:id/return: the reviewer says what to change. */
export const ReturnBulletinRequest = z
  .object({
    comment: z
      .string({ error: 'Say what should change' })
      .trim()
      .min(1, 'Say what should change')
      .max(2000, 'Keep the comment to 2000 characters'),
  })
  .strict();
export type ReturnBulletinRequest = z.infer<typeof ReturnBulletinRequest>;

/** POST /api/bulletins/:id/withdraw: the reason goes to every officer in the correction notice. */
export const WithdrawBulletinRequest = z
  .object({
    reason: z
      .string({ error: 'Give the reason for withdrawing' })
      .trim()
      .min(1, 'Give the reason for withdrawing')
      .max(2000, 'Keep the reason to 2000 characters'),
  })
  .strict();
export type WithdrawBulletinRequest = z.infer<typeof WithdrawBulletinRequest>;

/** POST /api/bulletins/:id/submit | approve | send: an optional note for the history. */
export const TransitionRequest = z
  .object({ comment: z.string().trim().max(2000, 'Keep the comment to 2000 characters').optional() })
  .strict();
export type TransitionRequest = z.infer<typeof TransitionRequest>;

/**
 * POST /api/inbox/:id/reports: what an officer saw in one block during the bulletin's week. `startTime`
 * is local time of the district ("2025-09-30T15:30"), required when a storm was seen.
 */
export const FieldReportRequest = z
  .object({
    blockCode: z.string({ error: 'Choose the block' }).trim().min(1, 'Choose the block'),
    stormSeen: z.boolean({ error: 'Say whether a storm was seen' }),
    startTime: z
      .string()
      .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, 'Give the local start time such as 2025-09-30T15:30')
      .nullable()
      .optional(),
    hail: z.boolean().default(false),
    windDamage: z.boolean().default(false),
    cropDamage: z.boolean().default(false),
    actionTaken: z.string().trim().max(1000, 'Keep the action taken to 1000 characters').default(''),
    usefulness: z
      .number({ error: 'Rate the bulletin’s usefulness from 1 to 5' })
      .int('Rate the bulletin’s usefulness with a whole number from 1 to 5')
      .min(1, 'Rate the bulletin’s usefulness from 1 (not useful) to 5 (very useful)')
      .max(5, 'Rate the bulletin’s usefulness from 1 (not useful) to 5 (very useful)'),
    notes: z.string().trim().max(2000, 'Keep the notes to 2000 characters').default(''),
  })
  .strict()
  .superRefine((r, ctx) => {
    if (r.stormSeen && !r.startTime)
      ctx.addIssue({
        code: 'custom',
        path: ['startTime'],
        message: 'Give the local time the storm started',
      });
    if (!r.stormSeen && (r.hail || r.windDamage))
      ctx.addIssue({
        code: 'custom',
        path: [r.hail ? 'hail' : 'windDamage'],
        message: 'Hail or wind damage means a storm was seen: tick "storm seen"',
      });
  });
export type FieldReportRequest = z.infer<typeof FieldReportRequest>;
export type FieldReportInput = z.input<typeof FieldReportRequest>;

// ── Responses ─────────────────────────────────────────────────────────────────────────────────────

export interface BulletinSummaryView {
  id: number;
  districtId: number;
  districtCode: string;
  districtName: string;
  /** Monday of the ISO week, and its Sunday. */
  weekStart: string;
  weekEnd: string;
  /** "RB-2025-40"; a bulletin drafted again after a withdrawal gets "-R1", "-R2". */
  number: string;
  state: BulletinState;
  authorId: number;
  authorEmail: string;
  currentVersion: number;
  /** The version approved (and sent); null before approval. */
  approvedVersion: number | null;
  createdAt: string;
  updatedAt: string;
  sentAt: string | null;
}

export interface BulletinVersionSummary {
  version: number;
  savedBy: string;
  savedAt: string;
}

export interface BulletinEventView {
  transition: BulletinTransition;
  from: BulletinState | null;
  to: BulletinState;
  actor: string;
  at: string;
  comment: string | null;
}

/** Advice that contradicts the bulletin's own numbers; shown to the writer, never blocks saving. */
export interface BulletinWarning {
  kind: 'afternoon-work' | 'dry-wording' | 'no-lightning-advice';
  /** The part of the content: "summary", "generalAdvice", "crops[2].advice", "outlook[RB-03]". */
  where: string;
  message: string;
}

/** What the outlook was when the draft was made and when it was approved. */
export interface BulletinOutlookInputs {
  siteId: number;
  siteCode: string;
  /** The regime asked for ("all" = every day) and how it was chosen. */
  regime: string;
  regimeChosenBy: 'request' | 'forecast' | 'no-forecast';
  binHours: number;
  afternoonFrom: number;
  afternoonTo: number;
  /** The outlook's data fingerprint: different data give a different one. */
  fingerprint: string;
  /** The rules whose advice the draft proposed, for "which rule said this". */
  proposedBy: { ruleId: number; crop: string | null; stage: string | null; source: string }[];
}

export interface BulletinView extends BulletinSummaryView {
  content: BulletinContent;
  versions: BulletinVersionSummary[];
  events: BulletinEventView[];
  warnings: BulletinWarning[];
  /** Active extension officers of the district: who a send would reach. */
  recipientsCount: number;
  /** The inputs at drafting, and at approval (null before). */
  draftedFrom: BulletinOutlookInputs;
  approvedFrom: BulletinOutlookInputs | null;
  /** True when the outlook's data changed since the draft was made (before approval only). */
  outlookChangedSinceDraft: boolean;
  /** What the signed-in user may do now. */
  can: {
    edit: boolean;
    submit: boolean;
    approve: boolean;
    return: boolean;
    send: boolean;
    withdraw: boolean;
  };
}

export interface BulletinVersionView {
  bulletinId: number;
  version: number;
  savedBy: string;
  savedAt: string;
  content: BulletinContent;
}

export interface DiffLine {
  op: 'same' | 'added' | 'removed';
  text: string;
}

export interface BulletinTextDiff {
  /** What the text is compared with; null when there is nothing to compare with. */
  against: { bulletinId: number; number: string; version: number } | null;
  lines: DiffLine[];
  added: number;
  removed: number;
}

/** GET /api/bulletins/:id/compare?from&to: two saved versions of one bulletin. */
export const CompareVersionsQuery = z.object({
  from: z.coerce.number().int().min(1),
  to: z.coerce.number().int().min(1),
});
export type CompareVersionsQuery = z.infer<typeof CompareVersionsQuery>;

/** GET /api/bulletins/:id/diff: the plain text against the district's previous sent bulletin and version. */
export interface BulletinDiffView {
  version: number;
  previousSent: BulletinTextDiff;
  previousVersion: BulletinTextDiff;
}

export interface BulletinDeliveryView {
  bulletinId: number;
  /** The outbox key, "bulletin:<id>:v<n>"; null before sending. */
  key: string | null;
  recipients: OutboxRecipientStatus[];
  /** The correction notice after a withdrawal. */
  withdrawalKey: string | null;
  withdrawal: OutboxRecipientStatus[];
  counts: { queued: number; sending: number; sent: number; failed: number };
}

export interface InboxItem {
  id: number;
  number: string;
  districtName: string;
  weekStart: string;
  weekEnd: string;
  state: 'sent' | 'withdrawn';
  sentAt: string;
  withdrawnAt: string | null;
  withdrawalReason: string | null;
  readAt: string | null;
  acknowledgedAt: string | null;
  unread: boolean;
  /** The highest afternoon chance of any block, for the list. */
  highestChance: number | null;
  reportCount: number;
}

export interface InboxBulletinView extends InboxItem {
  content: BulletinContent;
  /** Blocks a field report may name: the district's blocks. */
  blocks: { code: string; name: string }[];
}

export interface FieldReportView {
  id: number;
  bulletinId: number;
  blockCode: string;
  blockName: string;
  officerEmail: string;
  stormSeen: boolean;
  /** Local time, "2025-09-30T15:30", as given; and the same instant in UTC. */
  startTime: string | null;
  startTimeUtc: string | null;
  hail: boolean;
  windDamage: boolean;
  cropDamage: boolean;
  actionTaken: string;
  usefulness: number;
  notes: string;
  at: string;
}
