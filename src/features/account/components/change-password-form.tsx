import { z } from 'zod';
import { changePasswordBody } from '../../../shared/auth';
import { PASSWORD_MIN } from '../../../shared/fields';
import { Button } from '../../../components/ui/button';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { TextField } from '../../../components/ui/text-field';
import { useForm } from '../../../hooks/use-form';
import { useChangePassword } from '../api/change-password';

const schema = changePasswordBody
  .extend({ repeat: z.string() })
  .refine((v) => v.newPassword === v.repeat, { path: ['repeat'], message: 'The two new passwords differ.' });

const empty = { currentPassword: '', newPassword: '', repeat: '' };

export function ChangePasswordForm() {
  const change = useChangePassword();
  const form = useForm(schema, empty, { serverError: change.error });

  const submit = form.handleSubmit(({ currentPassword, newPassword }) =>
    change.mutate({ currentPassword, newPassword }, { onSuccess: () => form.setValues(empty) }),
  );

  return (
    <form noValidate onSubmit={submit} className="flex max-w-md flex-col gap-4">
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        {...form.field('currentPassword')}
      />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters.`}
        {...form.field('newPassword')}
      />
      <TextField
        label="Repeat the new password"
        type="password"
        autoComplete="new-password"
        {...form.field('repeat')}
      />
      {change.error && <ErrorAlert error={change.error} />}
      {change.isSuccess && <Notice>Password changed. Your other sessions have been signed out.</Notice>}
      <div>
        <Button type="submit" pending={change.isPending} pendingText="Changing…">
          Change password
        </Button>
      </div>
    </form>
  );
}
