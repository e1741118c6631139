import { Button, InlineNotification, TextInput } from '@carbon/react';
import type { BulletinView } from '@stormhour/shared';
import { ApiError, messageOf } from '../../../lib/apiError';
import type { BulletinForm, CropRowForm } from '../bulletinForm';
import { newCropRow, warningsByField } from '../bulletinForm';
import { RichTextField } from './RichTextField';

/**
 * The writer's parts of the bulletin: issue date, summary, the crop advice table and the general advice.
 * The outlook's numbers, the header and the cautions come from the draft and are not edited here.
 */
export function BulletinEditor({
  bulletin,
  form,
  onChange,
  errors,
  saving,
  saveError,
  dirty,
  savedMessage,
  onSave,
  onReset,
}: {
  bulletin: BulletinView;
  form: BulletinForm;
  onChange: (form: BulletinForm) => void;
  errors: Record<string, string>;
  saving: boolean;
  saveError: unknown;
  dirty: boolean;
  savedMessage: string | null;
  onSave: () => void;
  onReset: () => void;
}) {
  const warnings = warningsByField(bulletin.warnings);
  const update = (patch: Partial<BulletinForm>) => onChange({ ...form, ...patch });
  const updateRow = (key: number, patch: Partial<CropRowForm>) =>
    update({ crops: form.crops.map((r) => (r.key === key ? { ...r, ...patch } : r)) });

  return (
    <form
      className="form-stack bulletin-editor"
      aria-label="Bulletin text"
      onSubmit={(event) => {
        event.preventDefault();
        onSave();
      }}
    >
      <TextInput
        id="bulletin-issue-date"
        type="date"
        labelText="Issue date"
        value={form.issueDate}
        invalid={Boolean(errors.issueDate)}
        invalidText={errors.issueDate}
        onChange={(e) => update({ issueDate: e.target.value })}
      />
      <RichTextField
        id="bulletin-summary"
        label="Summary"
        value={form.summary}
        error={errors.summary}
        warning={warnings.summary}
        onChange={(summary) => update({ summary })}
      />
      <fieldset className="crop-rows">
        <legend className="cds--label">Crop advice</legend>
        {form.crops.length === 0 ? <p>No crop in the district’s calendar this week.</p> : null}
        {form.crops.map((row, i) => (
          <div key={row.key} className="crop-row">
            <div className="form-row">
              <TextInput
                id={`crop-${row.key}-crop`}
                labelText={`Crop, row ${i + 1}`}
                value={row.crop}
                invalid={Boolean(errors[`crops.${i}.crop`])}
                invalidText={errors[`crops.${i}.crop`]}
                onChange={(e) => updateRow(row.key, { crop: e.target.value })}
              />
              <TextInput
                id={`crop-${row.key}-stage`}
                labelText={`Stage, row ${i + 1}`}
                value={row.stage}
                invalid={Boolean(errors[`crops.${i}.stage`])}
                invalidText={errors[`crops.${i}.stage`]}
                onChange={(e) => updateRow(row.key, { stage: e.target.value })}
              />
              <Button
                kind="ghost"
                size="md"
                className="crop-row__remove"
                onClick={() => update({ crops: form.crops.filter((r) => r.key !== row.key) })}
              >
                Remove<span className="cds--visually-hidden"> row {i + 1}</span>
              </Button>
            </div>
            <RichTextField
              id={`crop-${row.key}-advice`}
              label={`Advice for ${row.crop || `row ${i + 1}`}`}
              value={row.advice}
              rows={3}
              error={errors[`crops.${i}.advice`]}
              warning={warnings[`crops.${i}.advice`]}
              onChange={(advice) => updateRow(row.key, { advice })}
            />
          </div>
        ))}
        <Button kind="tertiary" size="sm" onClick={() => update({ crops: [...form.crops, newCropRow()] })}>
          Add crop row
        </Button>
      </fieldset>
      <RichTextField
        id="bulletin-general"
        label="General advice"
        value={form.generalAdvice}
        error={errors.generalAdvice}
        warning={warnings.generalAdvice}
        onChange={(generalAdvice) => update({ generalAdvice })}
      />
      {saveError && !(saveError instanceof ApiError && saveError.details.length > 0) ? (
        <InlineNotification
          kind="error"
          lowContrast
          hideCloseButton
          title="The bulletin was not saved."
          subtitle={messageOf(saveError)}
        />
      ) : null}
      {Object.keys(errors).length > 0 ? (
        <InlineNotification
          kind="error"
          lowContrast
          hideCloseButton
          title="The bulletin was not saved."
          subtitle={`${Object.keys(errors).length === 1 ? 'One field needs' : `${Object.keys(errors).length} fields need`} changing: ${Object.values(errors)[0]}`}
        />
      ) : null}
      <div className="button-row">
        <Button type="submit" size="sm" disabled={saving || !dirty}>
          {saving ? 'Saving…' : `Save as version ${bulletin.currentVersion + 1}`}
        </Button>
        <Button kind="secondary" size="sm" disabled={saving || !dirty} onClick={onReset}>
          Undo changes
        </Button>
        <span role="status" className="save-status">
          {savedMessage}
        </span>
      </div>
    </form>
  );
}
