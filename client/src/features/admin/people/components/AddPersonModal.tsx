import { TextInput } from '@carbon/react';
import { CreateUserRequest, type DistrictView } from '@stormhour/shared';
import { useState } from 'react';
import { FormModal, useSaveAndClose } from '../../../../components/FormModal';
import { useCreateUser } from '../api';
import { districtIdFor } from '../peopleList';
import { RoleDistrictFields } from './RoleDistrictFields';

const EMPTY = { email: '', name: '', role: '', districtId: '', password: '' };

export function AddPersonModal({ districts, onClose }: { districts: DistrictView[]; onClose: () => void }) {
  const [values, setValues] = useState(EMPTY);
  const { errors, saveChecked } = useSaveAndClose(onClose);
  const mutation = useCreateUser();
  const set = (field: keyof typeof EMPTY) => (value: string) => setValues((v) => ({ ...v, [field]: value }));

  async function submit() {
    const person = {
      email: values.email,
      name: values.name,
      role: values.role === '' ? undefined : values.role,
      districtId: districtIdFor(values.role, values.districtId),
      password: values.password,
    };
    await saveChecked(CreateUserRequest, person, (body) => mutation.mutateAsync(body));
  }

  return (
    <FormModal
      heading="Add person"
      primaryButtonText="Add person"
      mutation={mutation}
      errorTitle="The person was not added."
      onSubmit={submit}
      onClose={onClose}
    >
      <TextInput
        id="person-email"
        labelText="Email"
        type="email"
        autoComplete="off"
        value={values.email}
        onChange={(e) => set('email')(e.target.value)}
        invalid={Boolean(errors.email)}
        invalidText={errors.email}
        data-modal-primary-focus
      />
      <TextInput
        id="person-name"
        labelText="Name"
        value={values.name}
        onChange={(e) => set('name')(e.target.value)}
        invalid={Boolean(errors.name)}
        invalidText={errors.name}
      />
      <RoleDistrictFields
        idPrefix="person"
        role={values.role}
        districtId={values.districtId}
        districts={districts}
        errors={errors}
        onRoleChange={set('role')}
        onDistrictChange={set('districtId')}
      />
      <TextInput
        id="person-password"
        labelText="Initial password"
        type="password"
        autoComplete="new-password"
        helperText="At least 10 characters. Give it to the person in private; they can change it after signing in."
        value={values.password}
        onChange={(e) => set('password')(e.target.value)}
        invalid={Boolean(errors.password)}
        invalidText={errors.password}
      />
    </FormModal>
  );
}
