import type { Me } from '../../../shared/auth';
import { updateMeBody } from '../../../shared/auth';
import { Button } from '../../../components/ui/button';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { controlClass, Field } from '../../../components/ui/field';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { useUpdateMe } from '../api/update-me';

export function DisplayNameForm({ me }: { me: Me }) {
  const update = useUpdateMe();
  const form = useZodForm(updateMeBody, { displayName: me.displayName });

  return (
    <Form form={form} serverError={update.error} onSubmit={(body) => update.mutate(body)} className="flex max-w-md flex-col gap-4">
      {/* Shown, not part of the form: only an admin changes an e-mail. */}
      <Field label="E-mail" hint="Ask an admin to change it.">
        {(control) => <input {...control} type="email" value={me.email} readOnly disabled className={controlClass} />}
      </Field>
      <FormField name="displayName" label="Display name" autoComplete="name" hint="Shown to the people you work with, beside your edits and comments." />
      {update.error && <ErrorAlert error={update.error} />}
      {update.isSuccess && <Notice>Display name saved.</Notice>}
      <div>
        <Button type="submit" pending={update.isPending} pendingText="Saving…">
          Save name
        </Button>
      </div>
    </Form>
  );
}
