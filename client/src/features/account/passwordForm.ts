import { ChangePasswordRequest } from '@stormhour/shared';
import { fieldErrorsFromZod } from '../../lib/fieldErrors';

export interface PasswordFormValues {
  currentPassword: string;
  newPassword: string;
  confirmPassword: string;
}

export type PasswordFormResult =
  | { ok: true; request: ChangePasswordRequest }
  | { ok: false; errors: Record<string, string> };

/** Checks the form with the shared schema, plus the confirmation only the form knows about. */
export function validatePasswordForm(values: PasswordFormValues): PasswordFormResult {
  const parsed = ChangePasswordRequest.safeParse({
    currentPassword: values.currentPassword,
    newPassword: values.newPassword,
  });
  const errors = parsed.success ? {} : fieldErrorsFromZod(parsed.error);
  if (!errors.newPassword && values.confirmPassword !== values.newPassword) {
    errors.confirmPassword = 'The two new passwords differ';
  }
  if (!errors.newPassword && values.newPassword === values.currentPassword && values.newPassword) {
    errors.newPassword = 'Choose a password different from the current one';
  }
  if (parsed.success && Object.keys(errors).length === 0) return { ok: true, request: parsed.data };
  return { ok: false, errors };
}
