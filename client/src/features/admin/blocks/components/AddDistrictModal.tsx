import { InlineNotification, Modal, Stack, TextInput } from '@carbon/react';
import { CreateDistrictRequest } from '@stormhour/shared';
import { useState } from 'react';
import { ApiError, messageOf } from '../../../../lib/apiError';
import { fieldErrorsFromZod } from '../../../../lib/fieldErrors';
import { useCreateDistrict } from '../api';

export function AddDistrictModal({ onClose }: { onClose: () => void }) {
  const [code, setCode] = useState('');
  const [name, setName] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const mutation = useCreateDistrict();

  async function submit() {
    const parsed = CreateDistrictRequest.safeParse({ code: code.toUpperCase(), name });
    if (!parsed.success) {
      setErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    setErrors({});
    try {
      await mutation.mutateAsync(parsed.data);
      onClose();
    } catch (error) {
      if (error instanceof ApiError) setErrors(error.fieldErrors);
    }
  }

  return (
    <Modal
      open
      modalHeading="Add district"
      primaryButtonText="Add district"
      secondaryButtonText="Cancel"
      primaryButtonDisabled={mutation.isPending}
      shouldSubmitOnEnter
      onRequestSubmit={submit}
      onRequestClose={onClose}
    >
      <Stack gap={5}>
        {mutation.isError ? (
          <InlineNotification
            kind="error"
            lowContrast
            hideCloseButton
            title="The district was not added."
            subtitle={messageOf(mutation.error)}
          />
        ) : null}
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
      </Stack>
    </Modal>
  );
}
