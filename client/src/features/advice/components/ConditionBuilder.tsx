import { Button, Select, SelectItem, TextInput } from '@carbon/react';
import { BLOCK_AGGREGATES, COMPARISONS, MOISTURE_CLASSES } from '@stormhour/shared';
import {
  AGGREGATE_LABELS,
  type ClauseForm,
  METRIC_LABELS,
  type MetricChoice,
  newClause,
  type RuleForm,
} from '../ruleForm';

const OP_LABELS: Record<string, string> = { '>=': '≥', '>': '>', '<=': '≤', '<': '<' };

/** Clauses on the week's outlook, combined with all or any: a form, never free code. */
export function ConditionBuilder({
  form,
  errors,
  disabled,
  onChange,
}: {
  form: RuleForm;
  errors: Record<string, string>;
  disabled: boolean;
  onChange: (next: Pick<RuleForm, 'combine' | 'clauses'>) => void;
}) {
  const setClause = (index: number, clause: ClauseForm) =>
    onChange({ combine: form.combine, clauses: form.clauses.map((c, i) => (i === index ? clause : c)) });

  return (
    <fieldset className="condition-builder">
      <legend className="cds--label">Condition on the week’s outlook</legend>
      <Select
        id="rule-combine"
        labelText="Advise when"
        disabled={disabled}
        value={form.combine}
        onChange={(event) =>
          onChange({ combine: event.target.value as RuleForm['combine'], clauses: form.clauses })
        }
      >
        <SelectItem value="all" text="all of these hold" />
        <SelectItem value="any" text="any of these holds" />
      </Select>
      {form.clauses.length === 0 ? (
        <p className="cds--label-description">No clause: the rule applies every week.</p>
      ) : null}
      {form.clauses.map((clause, index) => {
        const n = index + 1;
        const valueError = errors[`condition.clauses.${index}.value`] ?? errors[`condition.clauses.${index}`];
        const numeric = clause.metric !== 'regimeMoisture' && clause.metric !== 'rainLikely24h';
        return (
          // biome-ignore lint/suspicious/noArrayIndexKey: clauses have no identity beyond their place
          <div className="condition-clause" key={index}>
            <Select
              id={`clause-${n}-metric`}
              labelText={`Clause ${n}: measure`}
              disabled={disabled}
              value={clause.metric}
              onChange={(event) => setClause(index, newClause(event.target.value as MetricChoice))}
            >
              {Object.entries(METRIC_LABELS).map(([value, text]) => (
                <SelectItem key={value} value={value} text={text} />
              ))}
            </Select>
            {clause.metric !== 'regimeMoisture' ? (
              <Select
                id={`clause-${n}-aggregate`}
                labelText="Where"
                disabled={disabled}
                value={clause.aggregate}
                onChange={(event) =>
                  setClause(index, { ...clause, aggregate: event.target.value as ClauseForm['aggregate'] })
                }
              >
                {BLOCK_AGGREGATES.filter((a) => numeric || a !== 'districtMean').map((a) => (
                  <SelectItem key={a} value={a} text={AGGREGATE_LABELS[a]} />
                ))}
              </Select>
            ) : null}
            {numeric ? (
              <Select
                id={`clause-${n}-op`}
                labelText="Is"
                disabled={disabled}
                value={clause.op}
                onChange={(event) =>
                  setClause(index, { ...clause, op: event.target.value as ClauseForm['op'] })
                }
              >
                {COMPARISONS.map((op) => (
                  <SelectItem key={op} value={op} text={OP_LABELS[op]} />
                ))}
              </Select>
            ) : clause.metric === 'regimeMoisture' ? (
              <Select
                id={`clause-${n}-op`}
                labelText="Is"
                disabled={disabled}
                value={clause.op}
                onChange={(event) =>
                  setClause(index, { ...clause, op: event.target.value as ClauseForm['op'] })
                }
              >
                <SelectItem value="is" text="is" />
                <SelectItem value="isNot" text="is not" />
              </Select>
            ) : null}
            {numeric ? (
              <TextInput
                id={`clause-${n}-value`}
                labelText={
                  clause.metric === 'afternoonChance'
                    ? 'Value (%)'
                    : clause.metric === 'peakHour'
                      ? 'Hour (0–24)'
                      : 'Ratio'
                }
                inputMode="decimal"
                disabled={disabled}
                value={clause.value}
                invalid={Boolean(valueError)}
                invalidText={valueError}
                onChange={(event) => setClause(index, { ...clause, value: event.target.value })}
              />
            ) : (
              <Select
                id={`clause-${n}-value`}
                labelText="Value"
                disabled={disabled}
                value={clause.value}
                onChange={(event) => setClause(index, { ...clause, value: event.target.value })}
              >
                {(clause.metric === 'regimeMoisture' ? MOISTURE_CLASSES : ['yes', 'no']).map((v) => (
                  <SelectItem key={v} value={v} text={v} />
                ))}
              </Select>
            )}
            {disabled ? null : (
              <Button
                kind="ghost"
                size="md"
                onClick={() =>
                  onChange({ combine: form.combine, clauses: form.clauses.filter((_, i) => i !== index) })
                }
              >
                Remove<span className="cds--visually-hidden"> clause {n}</span>
              </Button>
            )}
          </div>
        );
      })}
      {disabled ? null : (
        <Button
          kind="tertiary"
          size="sm"
          onClick={() => onChange({ combine: form.combine, clauses: [...form.clauses, newClause()] })}
        >
          Add clause
        </Button>
      )}
    </fieldset>
  );
}
