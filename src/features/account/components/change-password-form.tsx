import { z } from 'zod';
import { changePasswordBody } from '../../../shared/auth';
import { PASSWORD_MIN } from '../../../shared/fields';
import { Button } from '../../../components/ui/button';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { useChangePassword } from '../api/change-password';

const schema = changePasswordBody
  .extend({ repeat: z.string() })
  .refine((v) => v.newPassword === v.repeat, { path: ['repeat'], message: 'The two new passwords differ.' });

export function ChangePasswordForm() {
  const change = useChangePassword();
  const form = useZodForm(schema, { currentPassword: '', newPassword: '', repeat: '' });

  return (
    <Form
      form={form}
      serverError={change.error}
      onSubmit={({ currentPassword, newPassword }) => change.mutate({ currentPassword, newPassword }, { onSuccess: () => form.reset() })}
      className="flex max-w-md flex-col gap-4"
    >
      <FormField name="currentPassword" label="Current password" type="password" autoComplete="current-password" />
      <FormField name="newPassword" label="New password" type="password" autoComplete="new-password" hint={`At least ${PASSWORD_MIN} characters.`} />
      <FormField name="repeat" label="Repeat the new password" type="password" autoComplete="new-password" />
      {change.error && <ErrorAlert error={change.error} />}
      {change.isSuccess && <Notice>Password changed. Your other sessions have been signed out.</Notice>}
      <div>
        <Button type="submit" pending={change.isPending} pendingText="Changing…">
          Change password
        </Button>
      </div>
    </Form>
  );
}
