import { Button, Form, InlineNotification, Stack, TextInput } from '@carbon/react';
import { LoginRequest } from '@stormhour/shared';
import { type FormEvent, useState } from 'react';
import { Navigate, useLocation, useNavigate } from 'react-router';
import { paths } from '../../config/paths';
import { messageOf } from '../../lib/apiError';
import { useAuth } from '../../lib/auth';
import { fieldErrorsFromZod } from '../../lib/fieldErrors';
import { landingPathFor } from '../../lib/landing';

function destination(from: unknown, fallback: string): string {
  return typeof from === 'string' && from !== paths.home && from !== paths.signIn ? from : fallback;
}

export default function SignInPage() {
  const { user, signIn } = useAuth();
  const navigate = useNavigate();
  const location = useLocation();
  const from = (location.state as { from?: unknown } | null)?.from;
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  if (user && !busy) return <Navigate to={destination(from, landingPathFor(user.role))} replace />;

  async function submit(event: FormEvent) {
    event.preventDefault();
    setFailure(null);
    const parsed = LoginRequest.safeParse({ email, password });
    if (!parsed.success) {
      setFieldErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    setFieldErrors({});
    setBusy(true);
    try {
      const signedIn = await signIn(parsed.data.email, parsed.data.password);
      navigate(destination(from, landingPathFor(signedIn.role)), { replace: true });
    } catch (error) {
      setFailure(messageOf(error));
      setBusy(false);
    }
  }

  return (
    <main className="sign-in">
      <div className="sign-in__panel">
        <p className="sign-in__product">Stormhour</p>
        <h1 className="page-title">Sign in</h1>
        <Form onSubmit={submit} noValidate aria-label="Sign in">
          <Stack gap={6}>
            {failure ? (
              <InlineNotification
                kind="error"
                lowContrast
                hideCloseButton
                title="Could not sign in."
                subtitle={failure}
              />
            ) : null}
            <TextInput
              id="sign-in-email"
              labelText="Email"
              type="email"
              autoComplete="username"
              value={email}
              onChange={(e) => setEmail(e.target.value)}
              invalid={Boolean(fieldErrors.email)}
              invalidText={fieldErrors.email}
            />
            {/* A plain password field: the show/hide toggle would add a second control named "password". */}
            <TextInput
              id="sign-in-password"
              labelText="Password"
              type="password"
              autoComplete="current-password"
              value={password}
              onChange={(e) => setPassword(e.target.value)}
              invalid={Boolean(fieldErrors.password)}
              invalidText={fieldErrors.password}
            />
            <Button type="submit" disabled={busy}>
              Sign in
            </Button>
          </Stack>
        </Form>
      </div>
    </main>
  );
}
