import { describe, expect, it } from 'vitest';
import { validatePasswordForm } from './passwordForm';

describe('validatePasswordForm', () => {
  it('accepts a long new password typed twice', () => {
    const result = validatePasswordForm({
      currentPassword: 'old one',
      newPassword: 'ten chars!',
      confirmPassword: 'ten chars!',
    });
    expect(result).toEqual({ ok: true, request: { currentPassword: 'old one', newPassword: 'ten chars!' } });
  });

  it.each([
    // Messages of ChangePasswordRequest and NewPassword in shared/auth.ts.
    [
      { currentPassword: '', newPassword: 'long enough pw', confirmPassword: 'long enough pw' },
      'currentPassword',
      'Enter your current password',
    ],
    [
      { currentPassword: 'old', newPassword: 'nine char', confirmPassword: 'nine char' },
      'newPassword',
      'Use at least 10 characters',
    ],
    [
      { currentPassword: 'old', newPassword: 'long enough pw', confirmPassword: 'long enough px' },
      'confirmPassword',
      'The two new passwords differ',
    ],
    [
      { currentPassword: 'same long pw', newPassword: 'same long pw', confirmPassword: 'same long pw' },
      'newPassword',
      'Choose a password different from the current one',
    ],
  ])('refuses %o', (values, field, message) => {
    const result = validatePasswordForm(values);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.errors[field]).toBe(message);
  });
});
