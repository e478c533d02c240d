import type { LoginResponse } from '../../../shared/auth';
import { loginBody } from '../../../shared/auth';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { TextField } from '../../../components/ui/text-field';
import { TextLink } from '../../../components/ui/text-link';
import { useForm } from '../../../hooks/use-form';
import { paths } from '../../../lib/paths';
import { useLogin } from '../api/login';
import { retryAfterSeconds, useRetryCountdown } from '../hooks/use-retry-countdown';

export function SignInForm({ onSignedIn }: { onSignedIn: (response: LoginResponse) => void }) {
  const login = useLogin({ onSuccess: onSignedIn });
  const form = useForm(loginBody, { email: '', password: '' }, { serverError: login.error });
  const waitSeconds = useRetryCountdown(login.error);
  const limited = retryAfterSeconds(login.error) !== null;

  return (
    <form noValidate onSubmit={form.handleSubmit((body) => login.mutate(body))} className="flex flex-col gap-4">
      <TextField
        label="E-mail"
        type="email"
        autoComplete="username"
        autoFocus
        {...form.field('email')}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        {...form.field('password')}
      />
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
    </form>
  );
}
