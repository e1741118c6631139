import { Button, InlineNotification, TextArea } from '@carbon/react';
import {
  type BulletinView,
  ReturnBulletinRequest,
  TransitionRequest,
  WithdrawBulletinRequest,
} from '@stormhour/shared';
import { useState } from 'react';
import type { z } from 'zod';
import { FormModal } from '../../../components/FormModal';
import type { BulletinAction } from '../../../config/paths';
import { fieldErrorsFromZod } from '../../../lib/fieldErrors';
import { useBulletinMutation } from '../api';

interface ActionSpec {
  label: string;
  heading: string;
  kind: 'primary' | 'secondary' | 'danger' | 'tertiary';
  /** The text box: "comment" (optional unless the schema says otherwise) or "reason". */
  field: 'comment' | 'reason';
  fieldLabel: string;
  schema: z.ZodType;
  done: string;
}

const ACTIONS: Record<BulletinAction, ActionSpec> = {
  submit: {
    label: 'Submit for review',
    heading: 'Submit for review',
    kind: 'primary',
    field: 'comment',
    fieldLabel: 'Note for the reviewer (optional)',
    schema: TransitionRequest,
    done: 'Submitted for review.',
  },
  approve: {
    label: 'Approve',
    heading: 'Approve this bulletin',
    kind: 'primary',
    field: 'comment',
    fieldLabel: 'Comment (optional)',
    schema: TransitionRequest,
    done: 'Approved. The writer can now send it.',
  },
  return: {
    label: 'Return to writer',
    heading: 'Return to the writer',
    kind: 'secondary',
    field: 'comment',
    fieldLabel: 'What should change',
    schema: ReturnBulletinRequest,
    done: 'Returned to the writer with your comment.',
  },
  send: {
    label: 'Send to officers',
    heading: 'Send to the district’s officers',
    kind: 'primary',
    field: 'comment',
    fieldLabel: 'Note for the history (optional)',
    schema: TransitionRequest,
    done: 'Sent. Delivery to each officer is shown below.',
  },
  withdraw: {
    label: 'Withdraw',
    heading: 'Withdraw this bulletin',
    kind: 'danger',
    field: 'reason',
    fieldLabel: 'Reason (goes to every officer in the correction notice)',
    schema: WithdrawBulletinRequest,
    done: 'Withdrawn. A correction notice goes to the same officers.',
  },
};

const ORDER: BulletinAction[] = ['submit', 'approve', 'return', 'send', 'withdraw'];

/**
 * The review steps the signed-in person may take now (the server says which, in `can`), each confirmed
 * in a small form. When the server refuses, its own message is shown.
 */
export function ReviewActions({
  bulletin,
  unsaved,
  onDone,
}: {
  bulletin: BulletinView;
  /** Unsaved edits: submitting now would send the last saved version, so say so instead. */
  unsaved: boolean;
  onDone: (message: string) => void;
}) {
  const [open, setOpen] = useState<BulletinAction | null>(null);
  const allowed = ORDER.filter((a) => bulletin.can[a]);
  if (allowed.length === 0) return null;
  return (
    <div className="review-actions">
      <div className="button-row">
        {allowed.map((action) => (
          <Button
            key={action}
            size="sm"
            kind={ACTIONS[action].kind}
            disabled={action === 'submit' && unsaved}
            onClick={() => setOpen(action)}
          >
            {ACTIONS[action].label}
          </Button>
        ))}
      </div>
      {unsaved && bulletin.can.submit ? (
        <p className="cds--form__helper-text">Save your changes before submitting them for review.</p>
      ) : null}
      {open ? (
        <ActionModal
          key={open}
          action={open}
          bulletin={bulletin}
          onClose={() => setOpen(null)}
          onDone={(message) => {
            setOpen(null);
            onDone(message);
          }}
        />
      ) : null}
    </div>
  );
}

function ActionModal({
  action,
  bulletin,
  onClose,
  onDone,
}: {
  action: BulletinAction;
  bulletin: BulletinView;
  onClose: () => void;
  onDone: (message: string) => void;
}) {
  const spec = ACTIONS[action];
  const [text, setText] = useState('');
  const [error, setError] = useState<string | undefined>();
  const mutation = useBulletinMutation(bulletin.id);
  const noRecipients = action === 'send' && bulletin.recipientsCount === 0;

  async function submit() {
    if (noRecipients) return;
    const value = text.trim();
    const body = value ? { [spec.field]: value } : {};
    const parsed = spec.schema.safeParse(body);
    if (!parsed.success) {
      setError(Object.values(fieldErrorsFromZod(parsed.error))[0]);
      return;
    }
    setError(undefined);
    try {
      await mutation.mutateAsync({ kind: action, body: parsed.data as { comment?: string } });
      onDone(spec.done);
    } catch {
      // The mutation's error is shown in the modal.
    }
  }

  return (
    <FormModal
      heading={spec.heading}
      label={`${bulletin.number}, ${bulletin.districtName}`}
      primaryButtonText={spec.label}
      mutation={{ ...mutation, isPending: mutation.isPending || noRecipients }}
      errorTitle="The server refused."
      onSubmit={submit}
      onClose={onClose}
    >
      {action === 'send' ? (
        noRecipients ? (
          <InlineNotification
            kind="error"
            lowContrast
            hideCloseButton
            title={`No extension officer in ${bulletin.districtName} would receive it.`}
            subtitle="An administrator must add an active officer for the district (Admin › People) before it can be sent."
          />
        ) : (
          <p>
            Version {bulletin.approvedVersion ?? bulletin.currentVersion} will be e-mailed to{' '}
            <strong>
              {bulletin.recipientsCount} {bulletin.recipientsCount === 1 ? 'officer' : 'officers'}
            </strong>{' '}
            of {bulletin.districtName}, with the PDF and the CAP file attached, and will appear in their
            inbox.
          </p>
        )
      ) : null}
      {action === 'withdraw' ? (
        <p>
          The bulletin stays in the officers’ inbox marked as withdrawn, and each officer who received it gets
          a correction notice with your reason.
        </p>
      ) : null}
      {action === 'approve' ? (
        <p>
          Approving freezes version {bulletin.currentVersion}: that is the text the officers will receive.
        </p>
      ) : null}
      {noRecipients ? null : (
        <TextArea
          id={`bulletin-${action}-text`}
          labelText={spec.fieldLabel}
          rows={3}
          value={text}
          invalid={Boolean(error)}
          invalidText={error}
          onChange={(e) => setText(e.target.value)}
          data-modal-primary-focus
        />
      )}
    </FormModal>
  );
}
