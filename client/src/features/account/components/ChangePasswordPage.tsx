import { Button, Form, InlineNotification, TextInput } from '@carbon/react';
import { type FormEvent, useState } from 'react';
import { PageHeading } from '../../../components/PageHeading';
import { ApiError, messageOf } from '../../../lib/apiError';
import { useChangePassword } from '../api';
import { type PasswordFormValues, validatePasswordForm } from '../passwordForm';

const EMPTY: PasswordFormValues = { currentPassword: '', newPassword: '', confirmPassword: '' };

const FIELDS: { key: keyof PasswordFormValues; label: string; autoComplete: string }[] = [
  { key: 'currentPassword', label: 'Current password', autoComplete: 'current-password' },
  { key: 'newPassword', label: 'New password', autoComplete: 'new-password' },
  { key: 'confirmPassword', label: 'Repeat the new password', autoComplete: 'new-password' },
];

export default function ChangePasswordPage() {
  const [values, setValues] = useState(EMPTY);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState(false);
  const mutation = useChangePassword();

  async function submit(event: FormEvent) {
    event.preventDefault();
    setDone(false);
    const checked = validatePasswordForm(values);
    if (!checked.ok) {
      setErrors(checked.errors);
      return;
    }
    setErrors({});
    try {
      await mutation.mutateAsync(checked.request);
      setValues(EMPTY);
      setDone(true);
    } catch (error) {
      if (error instanceof ApiError) setErrors(error.fieldErrors);
    }
  }

  return (
    <>
      <PageHeading title="Change password">
        Use at least 10 characters. A long phrase is easier to remember and harder to guess than a short mix
        of symbols.
      </PageHeading>
      <Form onSubmit={submit} noValidate aria-label="Change password" className="form-stack import-panel">
        {done ? (
          <InlineNotification kind="success" lowContrast title="Your password has been changed." />
        ) : null}
        {mutation.isError ? (
          <InlineNotification
            kind="error"
            lowContrast
            hideCloseButton
            title="The password was not changed."
            subtitle={messageOf(mutation.error)}
          />
        ) : null}
        {FIELDS.map((field) => (
          <TextInput
            key={field.key}
            id={`password-${field.key}`}
            type="password"
            labelText={field.label}
            autoComplete={field.autoComplete}
            value={values[field.key]}
            onChange={(e) => setValues({ ...values, [field.key]: e.target.value })}
            invalid={Boolean(errors[field.key])}
            invalidText={errors[field.key]}
          />
        ))}
        <Button type="submit" disabled={mutation.isPending}>
          Change password
        </Button>
      </Form>
    </>
  );
}
