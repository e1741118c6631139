import { InlineNotification, Modal } from '@carbon/react';
import type { UserView } from '@stormhour/shared';
import { messageOf } from '../../../../lib/apiError';
import { useUpdateUser } from '../api';

/** Deactivating stops a person signing in but keeps their history; it can be undone. */
export function ConfirmActiveModal({ user, onClose }: { user: UserView; onClose: () => void }) {
  const mutation = useUpdateUser();
  const deactivating = user.active;
  const verb = deactivating ? 'Deactivate' : 'Reactivate';

  async function confirm() {
    try {
      await mutation.mutateAsync({ id: user.id, body: { active: !user.active } });
      onClose();
    } catch {
      // Shown below from mutation.error.
    }
  }

  return (
    <Modal
      open
      danger={deactivating}
      size="sm"
      modalHeading={`${verb} ${user.name}?`}
      primaryButtonText={verb}
      secondaryButtonText="Cancel"
      primaryButtonDisabled={mutation.isPending}
      onRequestSubmit={confirm}
      onRequestClose={onClose}
    >
      <p>
        {deactivating
          ? `${user.email} will no longer be able to sign in. What they did stays in the audit trail.`
          : `${user.email} will be able to sign in again with their existing password.`}
      </p>
      {mutation.isError ? (
        <InlineNotification
          kind="error"
          lowContrast
          hideCloseButton
          title={`Could not ${verb.toLowerCase()} this person.`}
          subtitle={messageOf(mutation.error)}
        />
      ) : null}
    </Modal>
  );
}
