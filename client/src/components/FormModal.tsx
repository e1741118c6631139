import { InlineNotification, Modal, Stack } from '@carbon/react';
import { type ReactNode, useState } from 'react';
import type { z } from 'zod';
import { ApiError, messageOf } from '../lib/apiError';
import { fieldErrorsFromZod } from '../lib/fieldErrors';

type FieldErrors = Record<string, string>;

/**
 * Field errors for a form that saves through the server and closes when done.
 * `save` clears old errors, sends, then closes; a refusal with field errors puts them beside the fields,
 * and any other failure is left to the mutation's error, which the modal shows.
 */
export function useSaveAndClose(onClose: () => void) {
  const [errors, setErrors] = useState<FieldErrors>({});

  async function save(send: () => Promise<unknown>) {
    setErrors({});
    try {
      await send();
      onClose();
    } catch (error) {
      if (error instanceof ApiError) setErrors(error.fieldErrors);
    }
  }

  /**
   * Checks the values with the form's schema first: a refusal puts the schema's messages beside the
   * fields and sends nothing. `send` gets the parsed values; it may return 'unchanged' to just close.
   */
  async function saveChecked<S extends z.ZodType>(
    schema: S,
    values: unknown,
    send: (parsed: z.infer<S>) => Promise<unknown> | 'unchanged',
  ) {
    const parsed = schema.safeParse(values);
    if (!parsed.success) {
      setErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    const sending = send(parsed.data);
    if (sending === 'unchanged') onClose();
    else await save(() => sending);
  }

  return { errors, setErrors, save, saveChecked };
}

interface FormModalProps {
  heading: string;
  /** Small text above the heading. */
  label?: string;
  primaryButtonText: string;
  /** Submit when Enter is pressed in a field; only for short forms. */
  submitOnEnter?: boolean;
  /** The mutation that saves the form; its state disables the button and shows why a save failed. */
  mutation: { isPending: boolean; isError: boolean; error: unknown };
  /** Title of the notice shown when saving failed. */
  errorTitle: string;
  onSubmit: () => void;
  onClose: () => void;
  children: ReactNode;
}

/** A modal form with Cancel, a primary button that submits, and a notice when the save fails. */
export function FormModal({
  heading,
  label,
  primaryButtonText,
  submitOnEnter,
  mutation,
  errorTitle,
  onSubmit,
  onClose,
  children,
}: FormModalProps) {
  return (
    <Modal
      open
      modalHeading={heading}
      modalLabel={label}
      primaryButtonText={primaryButtonText}
      secondaryButtonText="Cancel"
      primaryButtonDisabled={mutation.isPending}
      shouldSubmitOnEnter={submitOnEnter}
      onRequestSubmit={onSubmit}
      onRequestClose={onClose}
    >
      <Stack gap={5}>
        {mutation.isError ? (
          <InlineNotification
            kind="error"
            lowContrast
            hideCloseButton
            title={errorTitle}
            subtitle={messageOf(mutation.error)}
          />
        ) : null}
        {children}
      </Stack>
    </Modal>
  );
}
