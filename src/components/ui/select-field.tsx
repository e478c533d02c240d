import type { SelectHTMLAttributes } from 'react';
import { controlClass, Field } from './field';

export interface SelectOption {
  value: string;
  label: string;
}

interface SelectFieldProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'onChange' | 'value' | 'id'> {
  label: string;
  value: string;
  options: readonly SelectOption[];
  onValueChange: (value: string) => void;
  error?: string;
  hint?: string;
}

export function SelectField({ label, value, options, onValueChange, error, hint, ...rest }: SelectFieldProps) {
  return (
    <Field label={label} error={error} hint={hint}>
      {(control) => (
        <select {...rest} {...control} value={value} onChange={(e) => onValueChange(e.target.value)} className={controlClass}>
          {options.map((option) => (
            <option key={option.value} value={option.value}>
              {option.label}
            </option>
          ))}
        </select>
      )}
    </Field>
  );
}
