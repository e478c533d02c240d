import { forgotBody } from '../../../shared/auth';
import { Button } from '../../../components/ui/button';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { TextField } from '../../../components/ui/text-field';
import { useForm } from '../../../hooks/use-form';
import { useRequestPasswordReset } from '../api/forgot-password';

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const form = useForm(forgotBody, { email: '' }, { serverError: request.error });

  if (request.isSuccess) {
    return (
      <Notice>
        If an account uses <strong>{request.variables.email}</strong>, a link to choose a new password is on its way.
        It works once and for 48 hours.
      </Notice>
    );
  }

  return (
    <form noValidate onSubmit={form.handleSubmit((body) => request.mutate(body))} className="flex flex-col gap-4">
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        {...form.field('email')}
      />
      {request.error && <ErrorAlert error={request.error} />}
      <Button type="submit" pending={request.isPending} pendingText="Sending…">
        Send me a link
      </Button>
    </form>
  );
}
