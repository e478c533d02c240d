import type { InputHTMLAttributes } from 'react';
import { controlClass, Field } from './field';

interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'onChange' | 'value' | 'id'> {
  label: string;
  value: string;
  onValueChange: (value: string) => void;
  error?: string;
  hint?: string;
}

export function TextField({ label, value, onValueChange, error, hint, type = 'text', ...rest }: TextFieldProps) {
  return (
    <Field label={label} error={error} hint={hint}>
      {(control) => (
        <input
          {...rest}
          {...control}
          type={type}
          value={value}
          onChange={(event) => onValueChange(event.target.value)}
          className={controlClass}
        />
      )}
    </Field>
  );
}
