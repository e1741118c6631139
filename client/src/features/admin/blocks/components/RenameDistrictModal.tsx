import { TextInput } from '@carbon/react';
import { type DistrictView, UpdateDistrictRequest } from '@stormhour/shared';
import { useState } from 'react';
import { FormModal, useSaveAndClose } from '../../../../components/FormModal';
import { fieldErrorsFromZod } from '../../../../lib/fieldErrors';
import { useRenameDistrict } from '../api';

export function RenameDistrictModal({ district, onClose }: { district: DistrictView; onClose: () => void }) {
  const [name, setName] = useState(district.name);
  const { errors, setErrors, save } = useSaveAndClose(onClose);
  const mutation = useRenameDistrict();

  async function submit() {
    const parsed = UpdateDistrictRequest.safeParse({ name });
    if (!parsed.success) {
      setErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    if (parsed.data.name === district.name) {
      onClose();
      return;
    }
    await save(() => mutation.mutateAsync({ id: district.id, body: parsed.data }));
  }

  return (
    <FormModal
      heading={`Rename district ${district.code}`}
      primaryButtonText="Save"
      submitOnEnter
      mutation={mutation}
      errorTitle="The district was not renamed."
      onSubmit={submit}
      onClose={onClose}
    >
      <TextInput
        id="district-rename"
        labelText="Name"
        value={name}
        onChange={(e) => setName(e.target.value)}
        invalid={Boolean(errors.name)}
        invalidText={errors.name}
        data-modal-primary-focus
      />
    </FormModal>
  );
}
