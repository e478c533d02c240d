import type { ProjectSummary } from '../../../shared/projects';
import { updateProjectBody } from '../../../shared/projects';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { Form, FormError } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { useUpdateProject } from '../api/update-project';

export function EditProjectForm({ project, onDone }: { project: ProjectSummary; onDone: () => void }) {
  const update = useUpdateProject(project.id);
  const form = useZodForm(updateProjectBody, { name: project.name, description: project.description });

  return (
    <Form
      form={form}
      serverError={update.error}
      onSubmit={(body) => update.mutate(body, { onSuccess: onDone })}
      aria-label="Edit project"
      className="flex flex-col gap-4"
    >
      <FormField name="name" label="Project name" />
      <FormField name="description" label="Description" as="textarea" rows={4} />
      <FormError />
      {update.error && <ErrorAlert error={update.error} />}
      <div className="flex gap-2">
        <Button type="submit" pending={update.isPending} pendingText="Saving…">
          Save
        </Button>
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </Form>
  );
}
