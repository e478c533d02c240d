import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { saveVersionBody } from '../../../shared/versions';
import { useSaveVersion } from '../api/save-version';

/** Saves the server's current draft as the next version, with a message. */
export function SaveVersionForm({ mappingId }: { mappingId: number }) {
  const save = useSaveVersion(mappingId);
  const form = useZodForm(saveVersionBody, { message: '' });
  return (
    <Form form={form} serverError={save.error} onSubmit={(body) => save.mutate(body, { onSuccess: () => form.reset() })} className="flex flex-col gap-2">
      <FormField name="message" label="Version message" maxLength={2000} hint="What changed since the last version?" />
      <ErrorAlert error={save.error} />
      <div>
        <Button type="submit" size="sm" pending={save.isPending} pendingText="Saving…">
          Save version
        </Button>
      </div>
    </Form>
  );
}
