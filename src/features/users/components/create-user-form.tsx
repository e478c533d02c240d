import type { FormEvent } from 'react';
import { createUserBody } from '../../../shared/users';
import { Button } from '../../../components/ui/button';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { CheckboxField } from '../../../components/ui/checkbox-field';
import { TextField } from '../../../components/ui/text-field';
import { useForm } from '../../../hooks/use-form';
import { useCreateUser } from '../api/create-user';

const empty = { email: '', displayName: '', isAdmin: false };

export function CreateUserForm() {
  const create = useCreateUser();
  const form = useForm(createUserBody, empty, { serverError: create.error });

  const check = form.handleSubmit((body) => create.mutate(body, { onSuccess: () => form.setValues(empty) }));
  // A new attempt forgets the last answer, so an old server error never stands beside a new one.
  const submit = (e: FormEvent<HTMLFormElement>) => {
    create.reset();
    check(e);
  };

  return (
    <form noValidate aria-label="Create an account" onSubmit={submit} className="flex flex-col gap-4">
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="E-mail"
          type="email"
          autoComplete="off"
          {...form.field('email')}
        />
        <TextField
          label="Display name"
          autoComplete="off"
          {...form.field('displayName')}
        />
      </div>
      <CheckboxField
        label="Site admin"
        hint="Admins manage accounts and see every project."
        checked={form.values.isAdmin}
        onCheckedChange={(v) => form.set('isAdmin', v)}
      />
      {create.error && <ErrorAlert error={create.error} />}
      {create.isSuccess && <Notice>Account created. {create.data.email} will receive a link to set a password.</Notice>}
      <div>
        <Button type="submit" pending={create.isPending} pendingText="Creating…">
          Create account
        </Button>
      </div>
    </form>
  );
}
