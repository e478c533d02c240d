import type { ProjectSummary } from '../../../shared/projects';
import { createProjectBody } from '../../../shared/projects';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { TextField } from '../../../components/ui/text-field';
import { useForm } from '../../../hooks/use-form';
import { useCreateProject } from '../api/create-project';

interface CreateProjectFormProps {
  onCreated: (project: ProjectSummary) => void;
  onCancel: () => void;
}

export function CreateProjectForm({ onCreated, onCancel }: CreateProjectFormProps) {
  const create = useCreateProject();
  const form = useForm(createProjectBody, { name: '', description: '' }, { serverError: create.error });

  return (
    <form
      noValidate
      aria-label="New project"
      onSubmit={form.handleSubmit((body) => create.mutate(body, { onSuccess: onCreated }))}
      className="flex flex-col gap-4"
    >
      <TextField
        label="Project name"
        autoFocus
        {...form.field('name')}
      />
      <TextAreaField
        label="Description"
        hint="What the group is mapping, and why. Optional."
        {...form.field('description')}
      />
      {create.error && <ErrorAlert error={create.error} />}
      <div className="flex gap-2">
        <Button type="submit" pending={create.isPending} pendingText="Creating…">
          Create project
        </Button>
        <Button variant="ghost" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
