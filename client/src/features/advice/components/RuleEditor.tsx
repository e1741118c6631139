import { Button, InlineNotification, TextArea, TextInput, Toggle } from '@carbon/react';
import { type AdviceRuleView, type EvaluableRule, RuleCondition, USUAL_STAGES } from '@stormhour/shared';
import { useRef, useState } from 'react';
import { ApiError, messageOf } from '../../../lib/apiError';
import { useSaveAdviceRule } from '../api';
import { checkRuleForm, emptyRuleForm, formFromRule, type RuleForm, requestFromForm } from '../ruleForm';
import { ConditionBuilder } from './ConditionBuilder';
import { ExamplePreview } from './ExamplePreview';
import { PlaceholderHelp } from './PlaceholderHelp';

const USUAL_STAGE_NAMES = [...new Set(Object.values(USUAL_STAGES).flat())];

/** The rule as the preview sees it while it is edited: the last whole condition, the text as typed. */
function previewRule(form: RuleForm, id: number, lastCondition: RuleCondition): EvaluableRule {
  return {
    id,
    crop: form.crop.trim() || null,
    stage: form.stage.trim() || null,
    condition: lastCondition,
    priority: Number(form.priority) || 50,
    text: form.text,
    source: form.source,
    active: form.active,
  };
}

/** One rule's form (the scientist edits, the writer reads) beside a live preview of its advice. */
export function RuleEditor({
  rule,
  canEdit,
  onDone,
}: {
  rule: AdviceRuleView | null;
  canEdit: boolean;
  onDone: (saved: AdviceRuleView | null) => void;
}) {
  const [form, setForm] = useState<RuleForm>(() => (rule ? formFromRule(rule) : emptyRuleForm()));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [lastCondition, setLastCondition] = useState<RuleCondition>(
    () =>
      RuleCondition.safeParse((requestFromForm(form) as { condition: unknown }).condition).data ?? {
        combine: 'all',
        clauses: [],
      },
  );
  const textRef = useRef<HTMLTextAreaElement>(null);
  const save = useSaveAdviceRule();
  const disabled = !canEdit;

  function update(patch: Partial<RuleForm>) {
    const next = { ...form, ...patch };
    setForm(next);
    // The preview follows the condition as soon as it is whole, even while another field is not.
    const parsed = RuleCondition.safeParse((requestFromForm(next) as { condition: unknown }).condition);
    if (parsed.success) setLastCondition(parsed.data);
  }

  function insertPlaceholder(name: string) {
    const area = textRef.current;
    const at = area ? area.selectionStart : form.text.length;
    const token = `{${name}}`;
    update({ text: form.text.slice(0, at) + token + form.text.slice(at) });
    requestAnimationFrame(() => {
      area?.focus();
      area?.setSelectionRange(at + token.length, at + token.length);
    });
  }

  function submit() {
    const checked = checkRuleForm(form);
    if (!checked.ok) {
      setErrors(checked.errors);
      return;
    }
    setErrors({});
    save.mutate(
      { id: rule?.id ?? null, body: checked.rule },
      {
        onSuccess: (saved) => onDone(saved),
        onError: (error) => {
          if (error instanceof ApiError) setErrors(error.fieldErrors);
        },
      },
    );
  }

  return (
    <div className="rule-editor">
      <form
        className="form-stack rule-editor__form"
        aria-label={rule ? `Advice rule ${rule.id}` : 'New advice rule'}
        onSubmit={(event) => {
          event.preventDefault();
          submit();
        }}
      >
        <datalist id="rule-crops">
          {Object.keys(USUAL_STAGES).map((c) => (
            <option key={c} value={c} />
          ))}
        </datalist>
        <datalist id="rule-stages">
          {USUAL_STAGE_NAMES.map((s) => (
            <option key={s} value={s} />
          ))}
        </datalist>
        <div className="form-row">
          <TextInput
            id="rule-crop"
            labelText="Crop"
            helperText="Empty: any crop"
            list="rule-crops"
            disabled={disabled}
            value={form.crop}
            invalid={Boolean(errors.crop)}
            invalidText={errors.crop}
            onChange={(event) => update({ crop: event.target.value })}
          />
          <TextInput
            id="rule-stage"
            labelText="Stage"
            helperText="Empty: any stage"
            list="rule-stages"
            disabled={disabled}
            value={form.stage}
            invalid={Boolean(errors.stage)}
            invalidText={errors.stage}
            onChange={(event) => update({ stage: event.target.value })}
          />
          <TextInput
            id="rule-priority"
            labelText="Priority"
            helperText="1 comes first"
            inputMode="numeric"
            disabled={disabled}
            value={form.priority}
            invalid={Boolean(errors.priority)}
            invalidText={errors.priority}
            onChange={(event) => update({ priority: event.target.value })}
          />
        </div>
        <p className="cds--label-description">
          With neither crop nor stage the advice is general; otherwise it goes to each crop of the week that
          matches.
        </p>
        <ConditionBuilder form={form} errors={errors} disabled={disabled} onChange={(next) => update(next)} />
        <TextArea
          id="rule-text"
          ref={textRef}
          labelText="Advice text"
          helperText="Defer to labels, licensed advice and official warnings where the advice touches them."
          rows={4}
          disabled={disabled}
          value={form.text}
          invalid={Boolean(errors.text)}
          invalidText={errors.text}
          onChange={(event) => update({ text: event.target.value })}
        />
        <PlaceholderHelp disabled={disabled} onInsert={insertPlaceholder} />
        <TextInput
          id="rule-source"
          labelText="Source"
          helperText='"common practice", or a citation'
          disabled={disabled}
          value={form.source}
          invalid={Boolean(errors.source)}
          invalidText={errors.source}
          onChange={(event) => update({ source: event.target.value })}
        />
        <Toggle
          id="rule-active"
          labelText="In use"
          labelA="Retired"
          labelB="Active"
          disabled={disabled}
          toggled={form.active}
          onToggle={(on) => update({ active: on })}
        />
        {save.isError && !(save.error instanceof ApiError && save.error.details.length) ? (
          <InlineNotification
            kind="error"
            lowContrast
            title="The rule was not saved."
            subtitle={messageOf(save.error)}
          />
        ) : null}
        {Object.keys(errors).length > 0 ? (
          <InlineNotification
            kind="error"
            lowContrast
            hideCloseButton
            title="The rule was not saved."
            subtitle={Object.values(errors)[0]}
          />
        ) : null}
        <div className="button-row">
          {canEdit ? (
            <Button type="submit" size="sm" disabled={save.isPending}>
              {rule ? 'Save rule' : 'Add rule'}
            </Button>
          ) : null}
          <Button kind="secondary" size="sm" onClick={() => onDone(null)}>
            {canEdit ? 'Cancel' : 'Close'}
          </Button>
        </div>
      </form>
      <ExamplePreview rule={previewRule(form, rule?.id ?? 0, lastCondition)} />
    </div>
  );
}
