import { useId, type ReactNode } from 'react';
import { cn } from '../../lib/cn';

export interface FieldControlProps {
  id: string;
  'aria-invalid': boolean | undefined;
  'aria-describedby': string | undefined;
}

interface FieldProps {
  label: string;
  error?: string;
  hint?: string;
  /** The label is read by screen readers only (a compact editor panel or a table cell). */
  hideLabel?: boolean;
  /** The error is announced as it appears (role="alert"), for a compact panel whose fields are far from a summary. */
  announce?: boolean;
  /** `checkbox`: the control before its label, on one line; `inline`: the label before a small control. */
  layout?: 'stacked' | 'checkbox' | 'inline';
  className?: string;
  /** Renders the control with the ids that tie it to its label, hint and error. */
  children: (control: FieldControlProps) => ReactNode;
}

/**
 * Label, control, hint and inline error, wired up for assistive technology: the control names its
 * hint and error with aria-describedby and says aria-invalid while the error shows. Every form field
 * goes through here (usually by way of FormField, which binds it to react-hook-form).
 */
export function Field({ label, error, hint, hideLabel = false, announce = false, layout = 'stacked', className, children }: FieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;
  const control = children({ id, 'aria-invalid': error ? true : undefined, 'aria-describedby': describedBy });
  const labelEl = (
    <label htmlFor={id} className={cn('text-sm font-semibold text-ink-800', hideLabel && 'sr-only')}>
      {label}
    </label>
  );
  const notes = (
    <>
      {hint && (
        <p id={hintId} className="text-xs text-ink-600">
          {hint}
        </p>
      )}
      {error && (
        <p id={errorId} role={announce ? 'alert' : undefined} className="text-sm font-semibold text-alert-700">
          {error}
        </p>
      )}
    </>
  );

  if (layout === 'checkbox') {
    return (
      <div className={cn('flex items-start gap-2', className)}>
        {control}
        <div>
          {labelEl}
          {notes}
        </div>
      </div>
    );
  }
  if (layout === 'inline') {
    return (
      <div className={cn('flex flex-col gap-0.5', className)}>
        <div className="flex items-center gap-2">
          {labelEl}
          {control}
        </div>
        {notes}
      </div>
    );
  }
  return (
    <div className={cn('flex flex-col gap-1', className)}>
      {labelEl}
      {control}
      {notes}
    </div>
  );
}

export const controlClass =
  'w-full rounded-md border border-paper-400 bg-paper-50 px-3 py-2 text-ink-900 placeholder:text-ink-400 ' +
  'focus:border-ink-500 aria-invalid:border-alert-600 aria-invalid:bg-alert-50/40 disabled:opacity-60';

export const checkboxClass = 'mt-0.5 size-4 rounded border-paper-400 accent-ink-700';
