import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { TextField } from '../../../components/ui/text-field';
import { useSaveVersion } from '../api/save-version';

/** Saves the server's current draft as the next version, with a message. */
export function SaveVersionForm({ mappingId }: { mappingId: number }) {
  const [message, setMessage] = useState('');
  const save = useSaveVersion(mappingId);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    save.mutate({ message }, { onSuccess: () => setMessage('') });
  };
  return (
    <form onSubmit={submit} className="flex flex-col gap-2">
      <TextField label="Version message" value={message} onValueChange={setMessage} maxLength={2000} hint="What changed since the last version?" />
      <ErrorAlert error={save.error} />
      <div>
        <Button type="submit" size="sm" pending={save.isPending} pendingText="Saving…">
          Save version
        </Button>
      </div>
    </form>
  );
}
