import { useId, type ReactNode } from 'react';

export interface FieldControlProps {
  id: string;
  'aria-invalid': boolean | undefined;
  'aria-describedby': string | undefined;
}

interface FieldProps {
  label: string;
  error?: string;
  hint?: string;
  /** Renders the control with the ids that tie it to its label, hint and error. */
  children: (control: FieldControlProps) => ReactNode;
}

/** Label, control, hint and inline error, wired up for assistive technology. */
export function Field({ label, error, hint, children }: FieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;

  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink-800">
        {label}
      </label>
      {children({ id, 'aria-invalid': error ? true : undefined, 'aria-describedby': describedBy })}
      {hint && (
        <p id={hintId} className="text-xs text-ink-600">
          {hint}
        </p>
      )}
      {error && (
        <p id={errorId} className="text-sm font-semibold text-alert-700">
          {error}
        </p>
      )}
    </div>
  );
}

export const controlClass =
  'w-full rounded-md border border-paper-400 bg-paper-50 px-3 py-2 text-ink-900 placeholder:text-ink-400 ' +
  'focus:border-ink-500 aria-invalid:border-alert-600 aria-invalid:bg-alert-50/40 disabled:opacity-60';
