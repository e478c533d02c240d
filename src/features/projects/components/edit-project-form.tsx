import type { ProjectSummary } from '../../../shared/projects';
import { updateProjectBody } from '../../../shared/projects';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { TextField } from '../../../components/ui/text-field';
import { useForm } from '../../../hooks/use-form';
import { useUpdateProject } from '../api/update-project';

export function EditProjectForm({ project, onDone }: { project: ProjectSummary; onDone: () => void }) {
  const update = useUpdateProject(project.id);
  const form = useForm(
    updateProjectBody,
    { name: project.name, description: project.description },
    { serverError: update.error },
  );

  return (
    <form
      noValidate
      aria-label="Edit project"
      onSubmit={form.handleSubmit((body) => update.mutate(body, { onSuccess: onDone }))}
      className="flex flex-col gap-4"
    >
      <TextField label="Project name" {...form.field('name')} />
      <TextAreaField
        label="Description"
        rows={4}
        {...form.field('description')}
      />
      {update.error && <ErrorAlert error={update.error} />}
      <div className="flex gap-2">
        <Button type="submit" pending={update.isPending} pendingText="Saving…">
          Save
        </Button>
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
