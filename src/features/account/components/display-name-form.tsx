import type { Me } from '../../../shared/auth';
import { updateMeBody } from '../../../shared/auth';
import { Button } from '../../../components/ui/button';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { TextField } from '../../../components/ui/text-field';
import { useForm } from '../../../hooks/use-form';
import { useUpdateMe } from '../api/update-me';

export function DisplayNameForm({ me }: { me: Me }) {
  const update = useUpdateMe();
  const form = useForm(updateMeBody, { displayName: me.displayName }, { serverError: update.error });

  return (
    <form noValidate onSubmit={form.handleSubmit((body) => update.mutate(body))} className="flex max-w-md flex-col gap-4">
      <TextField label="E-mail" value={me.email} onValueChange={() => {}} readOnly disabled hint="Ask an admin to change it." />
      <TextField
        label="Display name"
        autoComplete="name"
        hint="Shown to the people you work with, beside your edits and comments."
        {...form.field('displayName')}
      />
      {update.error && <ErrorAlert error={update.error} />}
      {update.isSuccess && <Notice>Display name saved.</Notice>}
      <div>
        <Button type="submit" pending={update.isPending} pendingText="Saving…">
          Save name
        </Button>
      </div>
    </form>
  );
}
