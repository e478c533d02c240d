import { z } from 'zod';
import { addMemberBody } from '../../../shared/projects';
import { PROJECT_ROLES, ROLE_LABELS } from '../../../shared/roles';
import { Button } from '../../../components/ui/button';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { useAddMember } from '../api/add-member';

const roleOptions = PROJECT_ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));

// What the inputs hold, turned into the shared body: an empty name means "none given".
const schema = z
  .object({ email: z.string(), role: addMemberBody.shape.role, displayName: z.string() })
  .transform(({ displayName, ...rest }) => ({ ...rest, ...(displayName.trim() ? { displayName } : {}) }))
  .pipe(addMemberBody);

export function AddMemberForm({ projectId }: { projectId: number }) {
  const add = useAddMember(projectId);
  const form = useZodForm(schema, { email: '', role: 'modeller', displayName: '' });

  return (
    <Form
      form={form}
      serverError={add.error}
      onSubmit={(body) => add.mutate(body, { onSuccess: () => form.reset() })}
      aria-label="Add a member"
      className="flex flex-col gap-4"
    >
      <FormField name="email" label="Member e-mail" type="email" autoComplete="off" />
      <FormField name="role" label="Member role" as="select" options={roleOptions} />
      <FormField
        name="displayName"
        label="Member name"
        hint="Only for someone new to Beadloom: their account gets this name and an invitation by e-mail."
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
    </Form>
  );
}
