import { addMemberBody } from '../../../shared/projects';
import { PROJECT_ROLES, ROLE_LABELS } from '../../../shared/roles';
import { Button } from '../../../components/ui/button';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { useForm } from '../../../hooks/use-form';
import { useAddMember } from '../api/add-member';

const roleOptions = PROJECT_ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));
const empty = { email: '', role: 'modeller', displayName: '' };

export function AddMemberForm({ projectId }: { projectId: number }) {
  const add = useAddMember(projectId);
  const form = useForm(addMemberBody, empty, {
    serverError: add.error,
    toInput: (v) => ({ ...v, displayName: v.displayName.trim() || undefined }),
  });

  const submit = form.handleSubmit((body) => add.mutate(body, { onSuccess: () => form.setValues(empty) }));

  return (
    <form noValidate aria-label="Add a member" onSubmit={submit} className="flex flex-col gap-4">
      <TextField label="Member e-mail" type="email" autoComplete="off" {...form.field('email')} />
      <SelectField label="Member role" options={roleOptions} {...form.field('role')} />
      <TextField
        label="Member name"
        hint="Only for someone new to Beadloom: their account gets this name and an invitation by e-mail."
        {...form.field('displayName')}
      />
      {add.error && <ErrorAlert error={add.error} />}
      {add.isSuccess && (
        <Notice>
          {add.data.activated
            ? `${add.data.displayName || add.data.email} is now a member.`
            : `${add.data.email} is invited: they will receive an e-mail to set their password.`}
        </Notice>
      )}
      <div>
        <Button type="submit" pending={add.isPending} pendingText="Adding…">
          Add member
        </Button>
      </div>
    </form>
  );
}
