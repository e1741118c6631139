import { Button, InlineLoading, RadioButton, RadioButtonGroup, TextInput } from '@carbon/react';
import type { RegimeSettings } from '@stormhour/shared';
import { useState } from 'react';
import { FormModal, useSaveAndClose } from '../../../components/FormModal';
import { LoadError } from '../../../components/LoadError';
import { useRegimeSettings, useUpdateRegimeSettings } from '../api';
import {
  checkSettings,
  placeSettingsErrors,
  type RegimeSettingsValues,
  settingsValues,
} from '../regimeSettingsForm';

const HEADING = 'Regime settings';
const SUBMIT = 'Save settings';

interface RegimeSettingsModalProps {
  siteId: number;
  /** Told the version the save made, just before the modal closes. */
  onSaved: (version: number) => void;
  onClose: () => void;
}

type Sector = RegimeSettingsValues['sectors'][number];

function SectorsField({
  sectors,
  errors,
  onChange,
}: {
  sectors: Sector[];
  errors: Record<string, string>;
  onChange: (sectors: Sector[]) => void;
}) {
  const update = (index: number, patch: Partial<Sector>) =>
    onChange(sectors.map((s, i) => (i === index ? { ...s, ...patch } : s)));
  return (
    <fieldset className="site-form__section">
      <legend className="section-title">Flow sectors</legend>
      <p className="cds--label-description">
        The direction the anomaly wind blows from, in degrees clockwise from north. A sector may cross north,
        e.g. from 280° to 10°.
      </p>
      {sectors.map((sector, index) => (
        // Rows have no identity of their own; they are edited in place and never reordered.
        // biome-ignore lint/suspicious/noArrayIndexKey: see above.
        <div key={index} className="site-form__sector">
          <TextInput
            id={`regime-sector-${index}-name`}
            labelText={`Sector ${index + 1} name`}
            value={sector.name}
            invalid={Boolean(errors[`sectors.${index}.name`])}
            invalidText={errors[`sectors.${index}.name`]}
            onChange={(e) => update(index, { name: e.target.value })}
          />
          <TextInput
            id={`regime-sector-${index}-from`}
            labelText={`Sector ${index + 1} from (°)`}
            inputMode="decimal"
            value={sector.fromDeg}
            invalid={Boolean(errors[`sectors.${index}.fromDeg`])}
            invalidText={errors[`sectors.${index}.fromDeg`]}
            onChange={(e) => update(index, { fromDeg: e.target.value })}
          />
          <TextInput
            id={`regime-sector-${index}-to`}
            labelText={`Sector ${index + 1} to (°)`}
            inputMode="decimal"
            value={sector.toDeg}
            invalid={Boolean(errors[`sectors.${index}.toDeg`])}
            invalidText={errors[`sectors.${index}.toDeg`]}
            onChange={(e) => update(index, { toDeg: e.target.value })}
          />
          <Button kind="ghost" size="md" onClick={() => onChange(sectors.filter((_, i) => i !== index))}>
            Remove sector {index + 1}
          </Button>
          {errors[`sectors.${index}`] ? (
            <p className="field-problem" role="alert">
              {errors[`sectors.${index}`]}
            </p>
          ) : null}
        </div>
      ))}
      {errors.sectors ? (
        <p className="field-problem" role="alert">
          {errors.sectors}
        </p>
      ) : null}
      <Button
        kind="tertiary"
        size="sm"
        onClick={() => onChange([...sectors, { name: '', fromDeg: '', toDeg: '' }])}
      >
        Add a sector
      </Button>
    </fieldset>
  );
}

function SettingsForm({
  siteId,
  saved,
  onSaved,
  onClose,
}: RegimeSettingsModalProps & { saved: RegimeSettings }) {
  const [values, setValues] = useState(() => settingsValues(saved));
  const { errors: raw, setErrors, save } = useSaveAndClose(onClose);
  // The server's details name the same paths as the schema; both land on the fields shown.
  const errors = placeSettingsErrors(raw);
  const mutation = useUpdateRegimeSettings(siteId);
  const set = (patch: Partial<RegimeSettingsValues>) => setValues((v) => ({ ...v, ...patch }));

  async function submit() {
    const checked = checkSettings(values, saved);
    if (!checked.ok) {
      setErrors(checked.errors);
      return;
    }
    await save(async () => {
      const result = await mutation.mutateAsync(checked.body);
      onSaved(result.version);
    });
  }

  return (
    <FormModal
      heading={HEADING}
      primaryButtonText={SUBMIT}
      mutation={mutation}
      errorTitle="The settings were not saved."
      onSubmit={submit}
      onClose={onClose}
    >
      <RadioButtonGroup
        legendText="Moisture classes by"
        name="regime-moisture-method"
        orientation="vertical"
        valueSelected={values.moistureMethod}
        onChange={(value) => set({ moistureMethod: value as RegimeSettingsValues['moistureMethod'] })}
      >
        <RadioButton id="regime-method-terciles" labelText="Terciles of the period's q′" value="terciles" />
        <RadioButton id="regime-method-fixed" labelText="Fixed bounds" value="fixed" />
      </RadioButtonGroup>
      {values.moistureMethod === 'fixed' ? (
        <div className="site-form__sector">
          <TextInput
            id="regime-bound-dry"
            labelText="Dry bound (g/kg)"
            helperText="q′ below this is dry"
            inputMode="decimal"
            value={values.bounds[0]}
            invalid={Boolean(errors['fixedBoundsGKg.0'])}
            invalidText={errors['fixedBoundsGKg.0']}
            onChange={(e) => set({ bounds: [e.target.value, values.bounds[1]] })}
          />
          <TextInput
            id="regime-bound-moist"
            labelText="Moist bound (g/kg)"
            helperText="q′ above this is moist"
            inputMode="decimal"
            value={values.bounds[1]}
            invalid={Boolean(errors['fixedBoundsGKg.1'])}
            invalidText={errors['fixedBoundsGKg.1']}
            onChange={(e) => set({ bounds: [values.bounds[0], e.target.value] })}
          />
        </div>
      ) : null}
      <TextInput
        id="regime-weak-below"
        labelText="Weak wind below (m/s)"
        helperText="Days with a lighter anomaly wind are “weak”, whatever its direction"
        inputMode="decimal"
        value={values.weakBelowMs}
        invalid={Boolean(errors.weakBelowMs)}
        invalidText={errors.weakBelowMs}
        onChange={(e) => set({ weakBelowMs: e.target.value })}
      />
      <SectorsField sectors={values.sectors} errors={errors} onChange={(sectors) => set({ sectors })} />
    </FormModal>
  );
}

/** Edits a site's regime settings; the form opens once the settings in use are loaded. */
export function RegimeSettingsModal(props: RegimeSettingsModalProps) {
  const current = useRegimeSettings(props.siteId);
  if (current.isSuccess) return <SettingsForm {...props} saved={current.data.settings} />;
  return (
    <FormModal
      heading={HEADING}
      primaryButtonText={SUBMIT}
      // Nothing to save until the settings are loaded.
      mutation={{ isPending: true, isError: false, error: null }}
      errorTitle="The settings were not saved."
      onSubmit={() => {}}
      onClose={props.onClose}
    >
      {current.isError ? (
        <LoadError what="the regime settings" error={current.error} onRetry={current.refetch} />
      ) : (
        <InlineLoading description="Loading the regime settings" />
      )}
    </FormModal>
  );
}
