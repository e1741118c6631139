import {
  AdviceRuleRequest,
  type AdviceRuleView,
  type BlockAggregate,
  type Comparison,
  type ConditionClause,
  type RuleCondition,
} from '@stormhour/shared';
import { fieldErrorsFromZod } from '../../lib/fieldErrors';

export type MetricChoice = ConditionClause['metric'];

/** A clause as the form edits it: a chance in per cent, every value as text. */
export interface ClauseForm {
  metric: MetricChoice;
  aggregate: BlockAggregate;
  op: Comparison | 'is' | 'isNot';
  value: string;
}

export interface RuleForm {
  crop: string;
  stage: string;
  combine: RuleCondition['combine'];
  clauses: ClauseForm[];
  priority: string;
  text: string;
  source: string;
  active: boolean;
}

export const METRIC_LABELS: Record<MetricChoice, string> = {
  afternoonChance: 'Afternoon chance (%)',
  peakHour: 'Peak hour (local)',
  ratioToClimatology: 'Chance ÷ usual chance',
  regimeMoisture: 'Regime moisture',
  rainLikely24h: 'Rain likely within 24 h',
};

export const AGGREGATE_LABELS: Record<BlockAggregate, string> = {
  anyBlock: 'in any block',
  allBlocks: 'in every block',
  districtMean: 'as the district mean',
};

export function newClause(metric: MetricChoice = 'afternoonChance'): ClauseForm {
  if (metric === 'regimeMoisture') return { metric, aggregate: 'anyBlock', op: 'is', value: 'moist' };
  if (metric === 'rainLikely24h') return { metric, aggregate: 'anyBlock', op: 'is', value: 'yes' };
  if (metric === 'peakHour') return { metric, aggregate: 'anyBlock', op: '<', value: '15' };
  if (metric === 'ratioToClimatology') return { metric, aggregate: 'anyBlock', op: '>=', value: '1.5' };
  return { metric, aggregate: 'anyBlock', op: '>=', value: '40' };
}

export function emptyRuleForm(): RuleForm {
  return {
    crop: '',
    stage: '',
    combine: 'all',
    clauses: [newClause()],
    priority: '50',
    text: '',
    source: 'common practice',
    active: true,
  };
}

const round = (v: number) => Math.round(v * 1e6) / 1e6;

export function formFromRule(rule: AdviceRuleView): RuleForm {
  return {
    crop: rule.crop ?? '',
    stage: rule.stage ?? '',
    combine: rule.condition.combine,
    clauses: rule.condition.clauses.map((c): ClauseForm => {
      if (c.metric === 'regimeMoisture')
        return { metric: c.metric, aggregate: 'anyBlock', op: c.op, value: c.value };
      if (c.metric === 'rainLikely24h')
        return { metric: c.metric, aggregate: c.aggregate, op: 'is', value: c.value ? 'yes' : 'no' };
      const value = c.metric === 'afternoonChance' ? round(c.value * 100) : c.value;
      return { metric: c.metric, aggregate: c.aggregate, op: c.op, value: String(value) };
    }),
    priority: String(rule.priority),
    text: rule.text,
    source: rule.source,
    active: rule.active,
  };
}

const num = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));

/** The request body the form stands for, not yet checked. */
export function requestFromForm(form: RuleForm): unknown {
  return {
    crop: form.crop.trim() === '' ? null : form.crop,
    stage: form.stage.trim() === '' ? null : form.stage,
    condition: {
      combine: form.combine,
      clauses: form.clauses.map((c) => {
        if (c.metric === 'regimeMoisture') return { metric: c.metric, op: c.op, value: c.value };
        if (c.metric === 'rainLikely24h')
          return {
            metric: c.metric,
            aggregate: c.aggregate === 'allBlocks' ? 'allBlocks' : 'anyBlock',
            value: c.value === 'yes',
          };
        const value = c.metric === 'afternoonChance' ? num(c.value) / 100 : num(c.value);
        return { metric: c.metric, aggregate: c.aggregate, op: c.op, value };
      }),
    },
    priority: num(form.priority),
    text: form.text,
    source: form.source,
    active: form.active,
  };
}

/** Checks the form with the server's schema: the rule, or errors keyed by field path. */
export function checkRuleForm(
  form: RuleForm,
): { ok: true; rule: AdviceRuleRequest } | { ok: false; errors: Record<string, string> } {
  const parsed = AdviceRuleRequest.safeParse(requestFromForm(form));
  if (parsed.success) return { ok: true, rule: parsed.data };
  const errors = fieldErrorsFromZod(parsed.error);
  // A chance is typed in per cent; the schema speaks of fractions.
  for (const [key, message] of Object.entries(errors))
    if (/fraction from 0 to 1/.test(message)) errors[key] = 'Give a chance from 0 to 100 %';
  return { ok: false, errors };
}

const OP_WORDS: Record<string, string> = { '>=': '≥', '>': '>', '<=': '≤', '<': '<' };

/** "afternoon chance ≥ 40 % in any block and regime is moist"; "always" with no clause. */
export function describeCondition(condition: RuleCondition): string {
  if (condition.clauses.length === 0) return 'always';
  const parts = condition.clauses.map((c) => {
    if (c.metric === 'regimeMoisture') return `regime ${c.op === 'is' ? 'is' : 'is not'} ${c.value}`;
    if (c.metric === 'rainLikely24h')
      return `rain ${c.value ? 'likely' : 'unlikely'} within 24 h ${AGGREGATE_LABELS[c.aggregate]}`;
    const value =
      c.metric === 'afternoonChance'
        ? `${round(c.value * 100)} %`
        : c.metric === 'peakHour'
          ? `${String(c.value).padStart(2, '0')}:00`
          : `${c.value} × usual`;
    const what =
      c.metric === 'afternoonChance' ? 'afternoon chance' : c.metric === 'peakHour' ? 'peak hour' : 'chance';
    return `${what} ${OP_WORDS[c.op]} ${value} ${AGGREGATE_LABELS[c.aggregate]}`;
  });
  return parts.join(condition.combine === 'all' ? ' and ' : ' or ');
}
