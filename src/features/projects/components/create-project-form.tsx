import type { ProjectSummary } from '../../../shared/projects';
import { createProjectBody } from '../../../shared/projects';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { useCreateProject } from '../api/create-project';

interface CreateProjectFormProps {
  onCreated: (project: ProjectSummary) => void;
  onCancel: () => void;
}

export function CreateProjectForm({ onCreated, onCancel }: CreateProjectFormProps) {
  const create = useCreateProject();
  const form = useZodForm(createProjectBody, { name: '', description: '' });

  return (
    <Form
      form={form}
      serverError={create.error}
      onSubmit={(body) => create.mutate(body, { onSuccess: onCreated })}
      aria-label="New project"
      className="flex flex-col gap-4"
    >
      <FormField name="name" label="Project name" autoFocus />
      <FormField name="description" label="Description" as="textarea" hint="What the group is mapping, and why. Optional." />
      {create.error && <ErrorAlert error={create.error} />}
      <div className="flex gap-2">
        <Button type="submit" pending={create.isPending} pendingText="Creating…">
          Create project
        </Button>
        <Button variant="ghost" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </Form>
  );
}
