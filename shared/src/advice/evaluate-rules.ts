import type {
  AdviceBlock,
  AdviceContext,
  AdviceProposal,
  AdviceRuleView,
  Comparison,
  ConditionClause,
  CropAdvice,
  NumericMetric,
  PlaceholderName,
  ProposedAdvice,
} from '../advice.js';
import { normaliseName } from '../advice.js';
import { baseRateInWords, chanceInWords, formatPercent } from './chance-words.js';
import { addDays, parseDay } from './iso-week.js';

export type EvaluableRule = Pick<
  AdviceRuleView,
  'id' | 'crop' | 'stage' | 'condition' | 'priority' | 'text' | 'source' | 'active'
>;

export interface ClauseResult {
  met: boolean;
  /** The figure that decided: the best block for "any block", the worst for "all blocks", the mean. */
  observed: number | string | boolean | null;
  /** Blocks meeting a block clause; null for clauses on the whole district. */
  blocks: string[] | null;
}

export interface RuleEvaluation {
  fired: boolean;
  clauses: ClauseResult[];
  /** Codes of the blocks the advice is about. */
  blocks: string[];
}

/** The afternoon window used when no block has a peak hour (DESIGN §3.5: 12–18 local). */
const AFTERNOON = [12, 18] as const;

function metricOf(block: AdviceBlock, metric: NumericMetric): number | null {
  if (metric === 'afternoonChance') return block.afternoonChance;
  if (metric === 'peakHour') return block.peakHourLocal;
  const { afternoonChance: p, climatologyChance: base } = block;
  return p === null || base === null || base <= 0 ? null : p / base;
}

function compare(a: number, op: Comparison, b: number): boolean {
  if (op === '>=') return a >= b;
  if (op === '>') return a > b;
  if (op === '<=') return a <= b;
  return a < b;
}

/** The moisture part of a regime name such as "moist / onshore". */
export function regimeMoisture(regime: string | null): string | null {
  return regime ? regime.split('/')[0].trim() : null;
}

function evaluateClause(clause: ConditionClause, ctx: AdviceContext): ClauseResult {
  if (clause.metric === 'regimeMoisture') {
    const moisture = regimeMoisture(ctx.regime);
    // An unknown regime meets neither "is" nor "is not": advice must not rest on a guess.
    if (moisture === null) return { met: false, observed: null, blocks: null };
    const same = moisture === clause.value;
    return { met: clause.op === 'is' ? same : !same, observed: moisture, blocks: null };
  }
  if (clause.metric === 'rainLikely24h') {
    const known = ctx.blocks.filter((b) => b.rainLikely24h !== undefined);
    const matching = known.filter((b) => b.rainLikely24h === clause.value).map((b) => b.code);
    const met =
      clause.aggregate === 'anyBlock'
        ? matching.length > 0
        : known.length > 0 && matching.length === known.length;
    return { met, observed: known.length ? matching.length > 0 : null, blocks: matching };
  }
  const withData = ctx.blocks
    .map((b) => ({ code: b.code, v: metricOf(b, clause.metric) }))
    .filter((x): x is { code: string; v: number } => x.v !== null);
  if (withData.length === 0)
    return { met: false, observed: null, blocks: clause.aggregate === 'districtMean' ? null : [] };
  const values = withData.map((x) => x.v);
  const upward = clause.op === '>=' || clause.op === '>';
  let observed: number;
  if (clause.aggregate === 'districtMean') observed = values.reduce((s, v) => s + v, 0) / values.length;
  else if (clause.aggregate === 'anyBlock') observed = upward ? Math.max(...values) : Math.min(...values);
  else observed = upward ? Math.min(...values) : Math.max(...values);
  const met = compare(observed, clause.op, clause.value);
  const blocks =
    clause.aggregate === 'districtMean'
      ? null
      : withData.filter((x) => compare(x.v, clause.op, clause.value)).map((x) => x.code);
  return { met, observed, blocks };
}

/**
 * Whether a rule's condition holds for the week, and which blocks it is about: the blocks meeting every
 * met block clause (all) or any of them (any); when that leaves none, the union; when no clause names
 * blocks, every block with an afternoon chance.
 */
export function evaluateRule(rule: Pick<EvaluableRule, 'condition'>, ctx: AdviceContext): RuleEvaluation {
  const clauses = rule.condition.clauses.map((c) => evaluateClause(c, ctx));
  const fired =
    clauses.length === 0 ||
    (rule.condition.combine === 'all' ? clauses.every((c) => c.met) : clauses.some((c) => c.met));
  const narrowing = clauses.filter((c) => c.met && c.blocks !== null).map((c) => c.blocks as string[]);
  const union = new Set(narrowing.flat());
  let chosen: Set<string>;
  if (narrowing.length === 0) {
    const withChance = ctx.blocks.filter((b) => b.afternoonChance !== null);
    chosen = new Set((withChance.length ? withChance : ctx.blocks).map((b) => b.code));
  } else if (rule.condition.combine === 'all') {
    chosen = new Set([...union].filter((code) => narrowing.every((set) => set.includes(code))));
    if (chosen.size === 0) chosen = union;
  } else chosen = union;
  // Keep the district's own block order.
  const blocks = ctx.blocks.map((b) => b.code).filter((code) => chosen.has(code));
  return { fired, clauses, blocks };
}

/** "A", "A and B", "A, B and C". */
export function listInWords(items: string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

const hour = (h: number) => `${String(h % 24).padStart(2, '0')}:00`;
const MONTHS = [
  'January',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July',
  'August',
  'September',
  'October',
  'November',
  'December',
];

/** "4–10 August 2025", "28 July – 3 August 2025", "29 December 2025 – 4 January 2026". */
export function weekInWords(weekStart: string): string {
  const a = parseDay(weekStart);
  const b = parseDay(addDays(weekStart, 6));
  if (!a || !b) return weekStart;
  const [da, ma, ya] = [a.getUTCDate(), MONTHS[a.getUTCMonth()], a.getUTCFullYear()];
  const [db, mb, yb] = [b.getUTCDate(), MONTHS[b.getUTCMonth()], b.getUTCFullYear()];
  if (ya !== yb) return `${da} ${ma} ${ya} – ${db} ${mb} ${yb}`;
  if (ma !== mb) return `${da} ${ma} – ${db} ${mb} ${yb}`;
  return `${da}–${db} ${mb} ${yb}`;
}

/** The value of every placeholder for one rule's blocks and, for crop rules, one crop. */
export function placeholderValues(
  ctx: AdviceContext,
  blockCodes: string[],
  crop: { crop: string; stage: string } | null,
): Record<PlaceholderName, string> {
  const blocks = ctx.blocks.filter((b) => blockCodes.includes(b.code));
  const withChance = blocks.filter((b) => b.afternoonChance !== null);
  const top = withChance.reduce<AdviceBlock | null>(
    (best, b) =>
      best === null || (b.afternoonChance as number) > (best.afternoonChance as number) ? b : best,
    null,
  );
  let chance = 'unknown';
  if (top) {
    const p = top.afternoonChance as number;
    const low = Math.min(...withChance.map((b) => b.afternoonChance as number));
    const pct =
      formatPercent(low) === formatPercent(p)
        ? formatPercent(p)
        : `${formatPercent(low).replace(' %', '')}–${formatPercent(p)}`;
    chance = `${chanceInWords(p)} (${pct})`;
  }
  const base = top?.climatologyChance ?? null;
  const peaks = blocks.map((b) => b.peakHourLocal).filter((h): h is number => h !== null);
  const first = peaks.length ? Math.min(...peaks) : null;
  const last = peaks.length ? Math.max(...peaks) : null;
  return {
    blocks:
      blocks.length > 0 && blocks.length === ctx.blocks.length && ctx.blocks.length > 1
        ? 'all blocks'
        : listInWords(blocks.map((b) => b.name)),
    window:
      first === null || last === null
        ? `${hour(AFTERNOON[0])}–${hour(AFTERNOON[1])}`
        : `${hour(first)}–${hour(last + ctx.binHours)}`,
    chance,
    baseRate: base === null ? 'unknown' : `${baseRateInWords(base)} (${formatPercent(base)})`,
    peakHour: first === null ? 'the afternoon' : hour(first),
    crop: crop?.crop ?? '',
    stage: crop?.stage ?? '',
    district: ctx.district.name,
    week: weekInWords(ctx.weekStart),
  };
}

/** Replaces each known {placeholder}; anything else is left as written (saving refuses it anyway). */
export function fillText(text: string, values: Record<PlaceholderName, string>): string {
  return text.replace(/\{(\w+)\}/g, (whole, name: string) =>
    name in values ? values[name as PlaceholderName] : whole,
  );
}

const byPriority = (a: ProposedAdvice, b: ProposedAdvice) => a.priority - b.priority || a.ruleId - b.ruleId;

/**
 * The advice the active rules propose for a district's week: for each crop and stage in the context,
 * the rules naming that crop or stage (or both) whose condition holds; general advice from the rules
 * naming neither. Each list is ordered by priority (1 first), then by rule id; texts are filled.
 */
export function evaluateRules(rules: readonly EvaluableRule[], ctx: AdviceContext): AdviceProposal {
  const general: ProposedAdvice[] = [];
  const crops: CropAdvice[] = ctx.crops.map((c) => ({ crop: c.crop, stage: c.stage, advice: [] }));
  for (const rule of rules) {
    if (!rule.active) continue;
    const result = evaluateRule(rule, ctx);
    if (!result.fired) continue;
    const propose = (crop: { crop: string; stage: string } | null): ProposedAdvice => ({
      ruleId: rule.id,
      priority: rule.priority,
      text: fillText(rule.text, placeholderValues(ctx, result.blocks, crop)),
      source: rule.source,
      blocks: result.blocks,
    });
    if (rule.crop === null && rule.stage === null) {
      general.push(propose(null));
      continue;
    }
    for (const entry of crops) {
      const cropMatches = rule.crop === null || normaliseName(rule.crop) === normaliseName(entry.crop);
      const stageMatches = rule.stage === null || normaliseName(rule.stage) === normaliseName(entry.stage);
      if (cropMatches && stageMatches) entry.advice.push(propose(entry));
    }
  }
  for (const entry of crops) entry.advice.sort(byPriority);
  return { crops, general: general.sort(byPriority) };
}
