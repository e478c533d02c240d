import { useId, useRef, useState } from 'react';
import { useWatch } from 'react-hook-form';
import { z } from 'zod';
import { commentText } from '../../../shared/threads';
import { mentionsAsText, textWithMentions, type Mention } from '../../../shared/threads-mentions';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { useMentionCandidates } from '../api/get-mention-candidates';
import { useMentionAutocomplete } from '../hooks/use-mention-autocomplete';
import { MentionOptions } from './mention-options';

// The box's own text is checked with the route's rule as the person types; see `submit` for the text as sent.
const schema = z.object({ body: commentText });

interface ComposerProps {
  projectId: number;
  label: string;
  submitText: string;
  initial?: string;
  pending: boolean;
  error: unknown;
  onSubmit(body: string): Promise<unknown>;
  onCancel?(): void;
}

/** A comment box: Markdown subset, @ mentions of project members, checked with the route's schema. */
export function CommentComposer({ projectId, label, submitText, initial = '', pending, error, onSubmit, onCancel }: ComposerProps) {
  const id = useId();
  const ref = useRef<HTMLTextAreaElement | null>(null);
  // The box shows mentions as @Name; the people behind them are kept aside (and shown as chips).
  const [start] = useState(() => mentionsAsText(initial));
  const [picked, setPicked] = useState<Mention[]>(start.mentions);
  const form = useZodForm(schema, { body: start.text });
  const value = useWatch({ control: form.control, name: 'body' });
  const setValue = (next: string) => form.setValue('body', next, { shouldValidate: form.formState.isSubmitted });
  const members = useMentionCandidates(projectId);
  const mentions = useMentionAutocomplete(ref, value, setValue, members.data ?? [], (m) => setPicked((p) => [...p.filter((x) => x.userId !== m.userId), m]));
  const present = picked.filter((m) => value.includes(`@${m.label}`));

  const submit = ({ body }: { body: string }) => {
    // The text as sent has @Name turned back into mention tokens; the route's rule is checked on that too.
    const sent = commentText.safeParse(textWithMentions(body, present));
    if (!sent.success) return form.setError('body', { message: sent.error.issues[0]?.message ?? 'Check the comment.' }, { shouldFocus: true });
    return onSubmit(sent.data).then(
      () => {
        form.reset({ body: '' });
        setPicked([]);
      },
      () => undefined,
    );
  };

  return (
    <Form form={form} onSubmit={submit} className="flex flex-col gap-2">
      <FormField
        name="body"
        label={label}
        as="textarea"
        rows={3}
        controlRef={(el) => (ref.current = el as HTMLTextAreaElement | null)}
        onChange={() => mentions.track()}
        onKeyDown={(e) => {
          // Ctrl/Cmd+Enter sends; Enter alone is a new line (or picks a mention).
          if (e.key === 'Enter' && (e.ctrlKey || e.metaKey)) return void (e.preventDefault(), e.currentTarget.form?.requestSubmit());
          mentions.onKeyDown(e);
        }}
        onKeyUp={mentions.track}
        onClick={mentions.track}
        aria-controls={mentions.options.length ? `${id}-mentions` : undefined}
        aria-activedescendant={mentions.options.length ? `${id}-mentions-${mentions.options[mentions.active]?.userId}` : undefined}
        hint="*emphasis*, lists, `code` and [links](https://…) work; type @ to mention someone; Ctrl+Enter sends."
      />
      <MentionOptions id={`${id}-mentions`} options={mentions.options} active={mentions.active} onPick={mentions.pick} />
      {present.length > 0 && (
        <ul aria-label="Mentioned" className="flex flex-wrap items-center gap-1 text-xs">
          <li className="text-ink-600">Mentions:</li>
          {present.map((m) => (
            <li key={m.userId} data-mention-chip={m.userId} className="rounded-full bg-ink-100 px-2 py-0.5 font-semibold text-ink-800">@{m.label}</li>
          ))}
        </ul>
      )}
      {!!error && <ErrorAlert error={error} />}
      <div className="flex gap-2">
        <Button type="submit" size="sm" pending={pending} pendingText="Sending…">
          {submitText}
        </Button>
        {onCancel && (
          <Button size="sm" variant="ghost" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </Form>
  );
}
