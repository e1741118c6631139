import { TextInput } from '@carbon/react';
import { CreateDistrictRequest } from '@stormhour/shared';
import { useState } from 'react';
import { FormModal, useSaveAndClose } from '../../../../components/FormModal';
import { useCreateDistrict } from '../api';

export function AddDistrictModal({ onClose }: { onClose: () => void }) {
  const [code, setCode] = useState('');
  const [name, setName] = useState('');
  const { errors, saveChecked } = useSaveAndClose(onClose);
  const mutation = useCreateDistrict();

  async function submit() {
    await saveChecked(CreateDistrictRequest, { code: code.toUpperCase(), name }, (body) =>
      mutation.mutateAsync(body),
    );
  }

  return (
    <FormModal
      heading="Add district"
      primaryButtonText="Add district"
      submitOnEnter
      mutation={mutation}
      errorTitle="The district was not added."
      onSubmit={submit}
      onClose={onClose}
    >
      <TextInput
        id="district-code"
        labelText="Code"
        helperText="Capital letters, digits, - or _, e.g. RVB"
        value={code}
        onChange={(e) => setCode(e.target.value)}
        invalid={Boolean(errors.code)}
        invalidText={errors.code}
        data-modal-primary-focus
      />
      <TextInput
        id="district-name"
        labelText="Name"
        value={name}
        onChange={(e) => setName(e.target.value)}
        invalid={Boolean(errors.name)}
        invalidText={errors.name}
      />
    </FormModal>
  );
}
