import { Select, SelectItem, TextInput } from '@carbon/react';
import { type BlockView, type DistrictView, UpdateBlockRequest } from '@stormhour/shared';
import { useState } from 'react';
import { FormModal, useSaveAndClose } from '../../../../components/FormModal';
import { useUpdateBlock } from '../api';

interface EditBlockModalProps {
  block: BlockView;
  districts: DistrictView[];
  onClose: () => void;
}

export function EditBlockModal({ block, districts, onClose }: EditBlockModalProps) {
  const [name, setName] = useState(block.name);
  const [districtId, setDistrictId] = useState(block.districtId);
  const { errors, saveChecked } = useSaveAndClose(onClose);
  const mutation = useUpdateBlock();

  async function submit() {
    // Send only what changed, so a concurrent edit of the other field is not overwritten.
    const changes = {
      ...(name !== block.name ? { name } : {}),
      ...(districtId !== block.districtId ? { districtId } : {}),
    };
    await saveChecked(UpdateBlockRequest, changes, (body) =>
      Object.keys(body).length === 0 ? 'unchanged' : mutation.mutateAsync({ id: block.id, body }),
    );
  }

  return (
    <FormModal
      heading={`Edit block ${block.code}`}
      primaryButtonText="Save"
      submitOnEnter
      mutation={mutation}
      errorTitle="The block was not saved."
      onSubmit={submit}
      onClose={onClose}
    >
      <TextInput
        id="block-name"
        labelText="Name"
        value={name}
        onChange={(e) => setName(e.target.value)}
        invalid={Boolean(errors.name)}
        invalidText={errors.name}
        data-modal-primary-focus
      />
      <Select
        id="block-district"
        labelText="District"
        value={String(districtId)}
        onChange={(e) => setDistrictId(Number(e.target.value))}
        invalid={Boolean(errors.districtId)}
        invalidText={errors.districtId}
      >
        {districts.map((d) => (
          <SelectItem key={d.id} value={String(d.id)} text={`${d.name} (${d.code})`} />
        ))}
      </Select>
    </FormModal>
  );
}
