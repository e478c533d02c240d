import type { LoginResponse } from '../../../shared/auth';
import { loginBody } from '../../../shared/auth';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { TextField } from '../../../components/ui/text-field';
import { TextLink } from '../../../components/ui/text-link';
import { useForm } from '../../../hooks/use-form';
import { paths } from '../../../lib/paths';
import { useLogin } from '../api/login';

export function SignInForm({ onSignedIn }: { onSignedIn: (response: LoginResponse) => void }) {
  const login = useLogin({ onSuccess: onSignedIn });
  const form = useForm(loginBody, { email: '', password: '' }, { serverError: login.error });

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
      {login.error && <ErrorAlert error={login.error} />}
      <Button type="submit" pending={login.isPending} pendingText="Signing in…">
        Sign in
      </Button>
      <p className="text-center text-sm">
        <TextLink to={paths.forgotPassword}>Forgot your password?</TextLink>
      </p>
    </form>
  );
}
