import { useWatch } from 'react-hook-form';
import { preferencesBody, type Preferences } from '../../../shared/notifications';
import { Button } from '../../../components/ui/button';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { Loading } from '../../../components/ui/loading';
import { useZodForm } from '../../../hooks/use-zod-form';
import { usePreferences } from '../api/get-preferences';
import { useUpdatePreferences } from '../api/update-preferences';

/** E-mail on mentions / on replies; both off means never. The bell shows everything regardless. */
export function EmailPreferencesForm() {
  const prefs = usePreferences();
  if (prefs.isError) return <ErrorAlert error={prefs.error} />;
  if (!prefs.data) return <Loading label="Loading your settings…" />;
  return <PreferencesForm initial={prefs.data} />;
}

function PreferencesForm({ initial }: { initial: Preferences }) {
  const update = useUpdatePreferences();
  const form = useZodForm(preferencesBody, initial);
  const [onMention, onReply] = useWatch({ control: form.control, name: ['emailOnMention', 'emailOnReply'] });
  const never = !onMention && !onReply;
  return (
    <Form form={form} serverError={update.error} onSubmit={(body) => update.mutate(body)} className="flex max-w-md flex-col gap-3">
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-semibold text-ink-800">E-mail me</legend>
        <FormField name="emailOnMention" label="When someone mentions me" type="checkbox" />
        <FormField name="emailOnReply" label="When someone replies in a thread I take part in" type="checkbox" />
      </fieldset>
      <p className="text-xs text-ink-600" aria-live="polite">
        {never ? 'Never: you will get no e-mail about threads, only the bell in Beadloom.' : 'The bell in Beadloom always shows mentions and replies.'}
      </p>
      {update.error && <ErrorAlert error={update.error} />}
      {update.isSuccess && <Notice>E-mail settings saved.</Notice>}
      <div>
        <Button type="submit" pending={update.isPending} pendingText="Saving…">
          Save e-mail settings
        </Button>
      </div>
    </Form>
  );
}
