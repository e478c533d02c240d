import { createUserBody } from '../../../shared/users';
import { Button } from '../../../components/ui/button';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { useCreateUser } from '../api/create-user';

export function CreateUserForm() {
  const create = useCreateUser();
  const form = useZodForm(createUserBody, { email: '', displayName: '', isAdmin: false });

  return (
    <Form
      form={form}
      serverError={create.error}
      onSubmit={(body) => create.mutate(body, { onSuccess: () => form.reset() })}
      // A new attempt forgets the last answer, so an old server error never stands beside a new one.
      onSubmitCapture={() => create.reset()}
      aria-label="Create an account"
      className="flex flex-col gap-4"
    >
      <div className="grid gap-4 sm:grid-cols-2">
        <FormField name="email" label="E-mail" type="email" autoComplete="off" />
        <FormField name="displayName" label="Display name" autoComplete="off" />
      </div>
      <FormField name="isAdmin" label="Site admin" type="checkbox" hint="Admins manage accounts and see every project." />
      {create.error && <ErrorAlert error={create.error} />}
      {create.isSuccess && <Notice>Account created. {create.data.email} will receive a link to set a password.</Notice>}
      <div>
        <Button type="submit" pending={create.isPending} pendingText="Creating…">
          Create account
        </Button>
      </div>
    </Form>
  );
}
