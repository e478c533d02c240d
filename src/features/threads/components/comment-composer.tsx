import { useId, useRef, useState, type FormEvent } from 'react';
import { commentText } from '../../../shared/threads';
import { mentionsAsText, textWithMentions, type Mention } from '../../../shared/threads-mentions';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { controlClass } from '../../../components/ui/field';
import { useMentionCandidates } from '../api/get-mention-candidates';
import { useMentionAutocomplete } from '../hooks/use-mention-autocomplete';
import { MentionOptions } from './mention-options';

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
  const ref = useRef<HTMLTextAreaElement>(null);
  // The box shows mentions as @Name; the people behind them are kept aside (and shown as chips).
  const [start] = useState(() => mentionsAsText(initial));
  const [value, setValue] = useState(start.text);
  const [picked, setPicked] = useState<Mention[]>(start.mentions);
  const [problem, setProblem] = useState<string | null>(null);
  const members = useMentionCandidates(projectId);
  const mentions = useMentionAutocomplete(ref, value, setValue, members.data ?? [], (m) => setPicked((p) => [...p.filter((x) => x.userId !== m.userId), m]));
  const present = picked.filter((m) => value.includes(`@${m.label}`));

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    const parsed = commentText.safeParse(textWithMentions(value, present));
    if (!parsed.success) {
      setProblem(parsed.error.issues[0]?.message ?? 'Check the comment.');
      ref.current?.focus();
      return;
    }
    setProblem(null);
    await onSubmit(parsed.data).then(() => (setValue(''), setPicked([])), () => undefined);
  };

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-2">
      <label htmlFor={id} className="text-xs font-semibold text-ink-700">
        {label}
      </label>
      <textarea
        id={id}
        ref={ref}
        rows={3}
        value={value}
        onChange={(e) => {
          setValue(e.target.value);
          mentions.track();
        }}
        onKeyDown={(e) => {
          // Ctrl/Cmd+Enter sends; Enter alone is a new line (or picks a mention).
          if (e.key === 'Enter' && (e.ctrlKey || e.metaKey)) return void (e.preventDefault(), e.currentTarget.form?.requestSubmit());
          mentions.onKeyDown(e);
        }}
        onKeyUp={mentions.track}
        onClick={mentions.track}
        aria-invalid={problem ? true : undefined}
        aria-describedby={`${id}-hint`}
        aria-controls={mentions.options.length ? `${id}-mentions` : undefined}
        aria-activedescendant={mentions.options.length ? `${id}-mentions-${mentions.options[mentions.active]?.userId}` : undefined}
        className={controlClass}
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
      <p id={`${id}-hint`} className="text-xs text-ink-600">
        *emphasis*, lists, `code` and [links](https://…) work; type @ to mention someone; Ctrl+Enter sends.
      </p>
      {problem && <ErrorAlert>{problem}</ErrorAlert>}
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
    </form>
  );
}
