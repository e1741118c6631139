import { TextInput } from '@carbon/react';
import { type DistrictView, UpdateUserRequest, type UserView } from '@stormhour/shared';
import { useState } from 'react';
import { FormModal, useSaveAndClose } from '../../../../components/FormModal';
import { fieldErrorsFromZod } from '../../../../lib/fieldErrors';
import { useUpdateUser } from '../api';
import { districtIdFor } from '../peopleList';
import { RoleDistrictFields } from './RoleDistrictFields';

interface EditPersonModalProps {
  user: UserView;
  districts: DistrictView[];
  onClose: () => void;
}

export function EditPersonModal({ user, districts, onClose }: EditPersonModalProps) {
  const [name, setName] = useState(user.name);
  const [role, setRole] = useState<string>(user.role);
  const [districtId, setDistrictId] = useState(user.districtId === null ? '' : String(user.districtId));
  const { errors, setErrors, save } = useSaveAndClose(onClose);
  const mutation = useUpdateUser();

  async function submit() {
    const parsed = UpdateUserRequest.safeParse({ name, role, districtId: districtIdFor(role, districtId) });
    if (!parsed.success) {
      setErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    if (parsed.data.role === 'officer' && parsed.data.districtId === null) {
      setErrors({ districtId: 'An extension officer must be assigned to a district' });
      return;
    }
    await save(() => mutation.mutateAsync({ id: user.id, body: parsed.data }));
  }

  return (
    <FormModal
      heading={`Edit ${user.name}`}
      label={user.email}
      primaryButtonText="Save"
      mutation={mutation}
      errorTitle="The changes were not saved."
      onSubmit={submit}
      onClose={onClose}
    >
      <TextInput
        id="edit-person-name"
        labelText="Name"
        value={name}
        onChange={(e) => setName(e.target.value)}
        invalid={Boolean(errors.name)}
        invalidText={errors.name}
        data-modal-primary-focus
      />
      <RoleDistrictFields
        idPrefix="edit-person"
        role={role}
        districtId={districtId}
        districts={districts}
        errors={errors}
        onRoleChange={setRole}
        onDistrictChange={setDistrictId}
      />
    </FormModal>
  );
}
