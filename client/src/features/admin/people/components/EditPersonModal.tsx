import { InlineNotification, Modal, Stack, TextInput } from '@carbon/react';
import { type DistrictView, UpdateUserRequest, type UserView } from '@stormhour/shared';
import { useState } from 'react';
import { ApiError, messageOf } from '../../../../lib/apiError';
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
  const [errors, setErrors] = useState<Record<string, string>>({});
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
    setErrors({});
    try {
      await mutation.mutateAsync({ id: user.id, body: parsed.data });
      onClose();
    } catch (error) {
      if (error instanceof ApiError) setErrors(error.fieldErrors);
    }
  }

  return (
    <Modal
      open
      modalHeading={`Edit ${user.name}`}
      modalLabel={user.email}
      primaryButtonText="Save"
      secondaryButtonText="Cancel"
      primaryButtonDisabled={mutation.isPending}
      onRequestSubmit={submit}
      onRequestClose={onClose}
    >
      <Stack gap={5}>
        {mutation.isError ? (
          <InlineNotification
            kind="error"
            lowContrast
            hideCloseButton
            title="The changes were not saved."
            subtitle={messageOf(mutation.error)}
          />
        ) : null}
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
      </Stack>
    </Modal>
  );
}
