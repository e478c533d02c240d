import { useId } from 'react';

interface CheckboxFieldProps {
  label: string;
  checked: boolean;
  onCheckedChange: (checked: boolean) => void;
  hint?: string;
  disabled?: boolean;
}

export function CheckboxField({ label, checked, onCheckedChange, hint, disabled }: CheckboxFieldProps) {
  const id = useId();
  return (
    <div className="flex items-start gap-2">
      <input
        id={id}
        type="checkbox"
        checked={checked}
        disabled={disabled}
        onChange={(event) => onCheckedChange(event.target.checked)}
        aria-describedby={hint ? `${id}-hint` : undefined}
        className="mt-0.5 size-4 rounded border-paper-400 accent-ink-700"
      />
      <div>
        <label htmlFor={id} className="text-sm font-semibold text-ink-800">
          {label}
        </label>
        {hint && (
          <p id={`${id}-hint`} className="text-xs text-ink-600">
            {hint}
          </p>
        )}
      </div>
    </div>
  );
}
