import { TextInput } from '@carbon/react';
import { type DistrictView, UpdateDistrictRequest } from '@stormhour/shared';
import { useState } from 'react';
import { FormModal, useSaveAndClose } from '../../../../components/FormModal';
import { useRenameDistrict } from '../api';

export function RenameDistrictModal({ district, onClose }: { district: DistrictView; onClose: () => void }) {
  const [name, setName] = useState(district.name);
  const { errors, saveChecked } = useSaveAndClose(onClose);
  const mutation = useRenameDistrict();

  function submit() {
    return saveChecked(UpdateDistrictRequest, { name }, (body) =>
      body.name === district.name ? 'unchanged' : mutation.mutateAsync({ id: district.id, body }),
    );
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
