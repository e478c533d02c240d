import { z } from 'zod';
import { resetBody } from '../../../shared/auth';
import { PASSWORD_MIN } from '../../../shared/fields';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { TextField } from '../../../components/ui/text-field';
import { useForm } from '../../../hooks/use-form';
import { useResetPassword } from '../api/reset-password';

// The shared schema checks the password; repeating it is a client-side courtesy.
const schema = resetBody
  .pick({ password: true })
  .extend({ repeat: z.string() })
  .refine((v) => v.password === v.repeat, { path: ['repeat'], message: 'The two passwords differ.' });

/** `onDone(signedIn)`: whether the server signed the person in with the new password. */
export function ResetPasswordForm({ token, onDone }: { token: string; onDone: (signedIn: boolean) => void }) {
  const reset = useResetPassword();
  const form = useForm(schema, { password: '', repeat: '' }, { serverError: reset.error });

  return (
    <form
      noValidate
      onSubmit={form.handleSubmit(({ password }) => reset.mutate({ token, password }, { onSuccess: (response) => onDone(!!response) }))}
      className="flex flex-col gap-4"
    >
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters.`}
        {...form.field('password')}
      />
      <TextField
        label="Repeat the password"
        type="password"
        autoComplete="new-password"
        {...form.field('repeat')}
      />
      {reset.error && <ErrorAlert error={reset.error} />}
      <Button type="submit" pending={reset.isPending} pendingText="Saving…">
        Set password
      </Button>
    </form>
  );
}
