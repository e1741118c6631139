import {
  Button,
  Checkbox,
  InlineNotification,
  RadioButton,
  RadioButtonGroup,
  Select,
  SelectItem,
  TextArea,
  TextInput,
} from '@carbon/react';
import type { InboxBulletinView } from '@stormhour/shared';
import { useState } from 'react';
import { ApiError, messageOf } from '../../../lib/apiError';
import { useFileFieldReport } from '../api';
import { checkReportForm, emptyReportForm, type ReportForm } from '../reportForm';

const USEFULNESS = [
  ['1', '1 not useful'],
  ['2', '2'],
  ['3', '3'],
  ['4', '4'],
  ['5', '5 very useful'],
] as const;

/** What an officer saw in one block during the bulletin's week; every problem is said beside its field. */
export function FieldReportForm({
  bulletin,
  onFiled,
}: {
  bulletin: Pick<InboxBulletinView, 'id' | 'blocks' | 'weekStart' | 'weekEnd'>;
  onFiled: (blockName: string) => void;
}) {
  const [form, setForm] = useState<ReportForm>(() =>
    emptyReportForm(bulletin.blocks.length === 1 ? bulletin.blocks[0].code : ''),
  );
  const [errors, setErrors] = useState<Record<string, string>>({});
  const file = useFileFieldReport(bulletin.id);
  const update = (patch: Partial<ReportForm>) => setForm((f) => ({ ...f, ...patch }));
  const errorCount = Object.keys(errors).length;

  function submit() {
    const checked = checkReportForm(form);
    if (!checked.ok) {
      setErrors(checked.errors);
      return;
    }
    setErrors({});
    file.mutate(checked.body, {
      onSuccess: (report) => {
        setForm(emptyReportForm(form.blockCode));
        onFiled(report.blockName);
      },
      onError: (error) => {
        if (error instanceof ApiError) setErrors(error.fieldErrors);
      },
    });
  }

  return (
    <form
      className="form-stack field-report"
      aria-label="Field report"
      noValidate
      onSubmit={(event) => {
        event.preventDefault();
        submit();
      }}
    >
      <Select
        id="report-block"
        labelText="Block"
        value={form.blockCode}
        invalid={Boolean(errors.blockCode)}
        invalidText={errors.blockCode}
        onChange={(e) => update({ blockCode: e.target.value })}
      >
        <SelectItem value="" text="Choose the block" />
        {bulletin.blocks.map((b) => (
          <SelectItem key={b.code} value={b.code} text={`${b.name} (${b.code})`} />
        ))}
      </Select>
      <RadioButtonGroup
        name="report-storm-seen"
        legendText="Storm seen in the block"
        valueSelected={form.stormSeen}
        invalid={Boolean(errors.stormSeen)}
        invalidText={errors.stormSeen}
        onChange={(value) =>
          update(
            value === 'no'
              ? { stormSeen: 'no', startTime: '', hail: false, windDamage: false }
              : { stormSeen: 'yes' },
          )
        }
      >
        <RadioButton id="report-storm-yes" labelText="Yes" value="yes" />
        <RadioButton id="report-storm-no" labelText="No" value="no" />
      </RadioButtonGroup>
      {form.stormSeen === 'yes' ? (
        <>
          <TextInput
            id="report-start"
            type="datetime-local"
            labelText="Start time (local)"
            helperText={`Within the week ${bulletin.weekStart} to ${bulletin.weekEnd}`}
            min={`${bulletin.weekStart}T00:00`}
            max={`${bulletin.weekEnd}T23:59`}
            value={form.startTime}
            invalid={Boolean(errors.startTime)}
            invalidText={errors.startTime}
            onChange={(e) => update({ startTime: e.target.value })}
          />
          <fieldset className="cds--fieldset">
            <legend className="cds--label">What the storm did</legend>
            <Checkbox
              id="report-hail"
              labelText="Hail"
              checked={form.hail}
              invalid={Boolean(errors.hail)}
              invalidText={errors.hail}
              onChange={(_, { checked }) => update({ hail: checked })}
            />
            <Checkbox
              id="report-wind"
              labelText="Wind damage"
              checked={form.windDamage}
              invalid={Boolean(errors.windDamage)}
              invalidText={errors.windDamage}
              onChange={(_, { checked }) => update({ windDamage: checked })}
            />
          </fieldset>
        </>
      ) : null}
      <Checkbox
        id="report-crop"
        labelText="Crop damage"
        checked={form.cropDamage}
        onChange={(_, { checked }) => update({ cropDamage: checked })}
      />
      <TextArea
        id="report-action"
        labelText="Action taken"
        helperText="What farmers did on the advice, if anything"
        rows={2}
        value={form.actionTaken}
        invalid={Boolean(errors.actionTaken)}
        invalidText={errors.actionTaken}
        onChange={(e) => update({ actionTaken: e.target.value })}
      />
      <RadioButtonGroup
        name="report-usefulness"
        legendText="How useful was the advice?"
        valueSelected={form.usefulness}
        invalid={Boolean(errors.usefulness)}
        invalidText={errors.usefulness}
        onChange={(value) => update({ usefulness: String(value) })}
      >
        {USEFULNESS.map(([value, label]) => (
          <RadioButton key={value} id={`report-useful-${value}`} labelText={label} value={value} />
        ))}
      </RadioButtonGroup>
      <TextArea
        id="report-notes"
        labelText="Notes"
        rows={2}
        value={form.notes}
        invalid={Boolean(errors.notes)}
        invalidText={errors.notes}
        onChange={(e) => update({ notes: e.target.value })}
      />
      {errorCount > 0 ? (
        <InlineNotification
          kind="error"
          lowContrast
          hideCloseButton
          title="The report was not filed."
          subtitle={`${errorCount === 1 ? 'One answer needs' : `${errorCount} answers need`} changing: ${Object.values(errors)[0]}`}
        />
      ) : null}
      {file.isError && !(file.error instanceof ApiError && file.error.details.length > 0) ? (
        <InlineNotification
          kind="error"
          lowContrast
          hideCloseButton
          title="The report was not filed."
          subtitle={messageOf(file.error)}
        />
      ) : null}
      <div className="button-row">
        <Button type="submit" size="sm" disabled={file.isPending}>
          {file.isPending ? 'Filing…' : 'File report'}
        </Button>
      </div>
    </form>
  );
}
