import { forgotBody } from '../../../shared/auth';
import { Button } from '../../../components/ui/button';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { useRequestPasswordReset } from '../api/forgot-password';

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const form = useZodForm(forgotBody, { email: '' });

  if (request.isSuccess) {
    return (
      <Notice>
        If an account uses <strong>{request.variables.email}</strong>, a link to choose a new password is on its way.
        It works once and for 48 hours.
      </Notice>
    );
  }

  return (
    <Form form={form} serverError={request.error} onSubmit={(body) => request.mutate(body)} className="flex flex-col gap-4">
      <FormField name="email" label="E-mail" type="email" autoComplete="email" />
      {request.error && <ErrorAlert error={request.error} />}
      <Button type="submit" pending={request.isPending} pendingText="Sending…">
        Send me a link
      </Button>
    </Form>
  );
}
