import type { LoginResponse } from '../../../shared/auth';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { TextLink } from '../../../components/ui/text-link';
import { useLazyZodForm } from '../../../hooks/use-zod-form';
import { paths } from '../../../lib/paths';
import { useLogin } from '../api/login';
import { retryAfterSeconds, useRetryCountdown } from '../hooks/use-retry-countdown';

export function SignInForm({ onSignedIn }: { onSignedIn: (response: LoginResponse) => void }) {
  const login = useLogin({ onSuccess: onSignedIn });
  // The shared schema (and zod with it) loads when the person starts typing, not with the page.
  const form = useLazyZodForm(() => import('../../../shared/auth').then((m) => m.loginBody), { email: '', password: '' });
  const waitSeconds = useRetryCountdown(login.error);
  const limited = retryAfterSeconds(login.error) !== null;

  return (
    <Form form={form} serverError={login.error} onSubmit={(body) => login.mutate(body)} className="flex flex-col gap-4">
      <FormField name="email" label="E-mail" type="email" autoComplete="username" autoFocus />
      <FormField name="password" label="Password" type="password" autoComplete="current-password" />
      {login.error && !limited && <ErrorAlert error={login.error} />}
      {limited && (
        <ErrorAlert>
          {waitSeconds > 0 ? `Too many failed sign-in attempts. Try again in ${waitSeconds} s.` : 'You can try again now.'}
        </ErrorAlert>
      )}
      <Button type="submit" pending={login.isPending} pendingText="Signing in…" disabled={waitSeconds > 0}>
        Sign in
      </Button>
      <p className="text-center text-sm">
        <TextLink to={paths.forgotPassword}>Forgot your password?</TextLink>
      </p>
    </Form>
  );
}
