import { Tag } from '@carbon/react';
import {
  type AdviceContext,
  type EvaluableRule,
  evaluateRule,
  evaluateRules,
  formatPercent,
} from '@stormhour/shared';
import { describeCondition } from '../ruleForm';

function observedText(metric: string, observed: number | string | boolean | null): string {
  if (observed === null) return 'no data';
  if (typeof observed === 'boolean') return observed ? 'yes' : 'no';
  if (typeof observed === 'string') return observed;
  if (metric === 'afternoonChance') return formatPercent(observed);
  if (metric === 'peakHour') return `${String(observed).padStart(2, '0')}:00`;
  return `${observed.toFixed(2)} × usual`;
}

/**
 * What one rule proposes for a week: whether it fires, why (each clause with the deciding figure), and
 * the filled advice. The context is the week's outlook: an example here, the real one in a bulletin.
 */
export function RulePreview({ rule, context }: { rule: EvaluableRule; context: AdviceContext }) {
  const evaluation = evaluateRule(rule, context);
  const proposal = evaluateRules([{ ...rule, active: true }], context);
  const texts = [
    ...proposal.general.map((a) => ({ heading: 'General advice', text: a.text })),
    ...proposal.crops.flatMap((c) =>
      c.advice.map((a) => ({ heading: `${c.crop}, ${c.stage}`, text: a.text })),
    ),
  ];
  return (
    <section className="rule-preview" aria-label="Preview" aria-live="polite">
      <div>
        {evaluation.fired ? (
          <Tag type="green">Fires this week</Tag>
        ) : (
          <Tag type="gray">Does not fire this week</Tag>
        )}
        {rule.active ? null : <Tag type="warm-gray">Retired: bulletins will not use it</Tag>}
      </div>
      <ul className="rule-preview__clauses">
        {rule.condition.clauses.map((clause, index) => (
          // biome-ignore lint/suspicious/noArrayIndexKey: clauses have no identity beyond their place
          <li key={index}>
            {evaluation.clauses[index].met ? '✓' : '✗'}{' '}
            {describeCondition({ combine: 'all', clauses: [clause] })} —{' '}
            {observedText(clause.metric, evaluation.clauses[index].observed)}
          </li>
        ))}
      </ul>
      {evaluation.fired && texts.length === 0 ? (
        <p className="cds--label-description">
          The condition holds, but no crop of the example is at this rule’s crop or stage.
        </p>
      ) : null}
      {texts.map((t) => (
        <blockquote key={t.heading} className="rule-preview__advice">
          <p className="cds--label">{t.heading}</p>
          <p data-testid="preview-text">{t.text}</p>
        </blockquote>
      ))}
    </section>
  );
}
