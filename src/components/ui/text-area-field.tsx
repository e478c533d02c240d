import type { TextareaHTMLAttributes } from 'react';
import { controlClass, Field } from './field';

interface TextAreaFieldProps extends Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'onChange' | 'value' | 'id'> {
  label: string;
  value: string;
  onValueChange: (value: string) => void;
  error?: string;
  hint?: string;
}

export function TextAreaField({ label, value, onValueChange, error, hint, rows = 3, ...rest }: TextAreaFieldProps) {
  return (
    <Field label={label} error={error} hint={hint}>
      {(control) => (
        <textarea
          {...rest}
          {...control}
          rows={rows}
          value={value}
          onChange={(event) => onValueChange(event.target.value)}
          className={controlClass}
        />
      )}
    </Field>
  );
}
