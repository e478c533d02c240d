import { z } from 'zod';
import { resetBody } from '../../../shared/auth';
import { PASSWORD_MIN } from '../../../shared/fields';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { useResetPassword } from '../api/reset-password';

// The shared schema checks the password; repeating it is a client-side courtesy.
const schema = resetBody
  .pick({ password: true })
  .extend({ repeat: z.string() })
  .refine((v) => v.password === v.repeat, { path: ['repeat'], message: 'The two passwords differ.' });

/** `onDone(signedIn)`: whether the server signed the person in with the new password. */
export function ResetPasswordForm({ token, onDone }: { token: string; onDone: (signedIn: boolean) => void }) {
  const reset = useResetPassword();
  const form = useZodForm(schema, { password: '', repeat: '' });

  return (
    <Form
      form={form}
      serverError={reset.error}
      onSubmit={({ password }) => reset.mutate({ token, password }, { onSuccess: (response) => onDone(!!response) })}
      className="flex flex-col gap-4"
    >
      <FormField name="password" label="New password" type="password" autoComplete="new-password" hint={`At least ${PASSWORD_MIN} characters.`} />
      <FormField name="repeat" label="Repeat the password" type="password" autoComplete="new-password" />
      {reset.error && <ErrorAlert error={reset.error} />}
      <Button type="submit" pending={reset.isPending} pendingText="Saving…">
        Set password
      </Button>
    </Form>
  );
}
