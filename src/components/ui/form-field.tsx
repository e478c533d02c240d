import type { InputHTMLAttributes, SelectHTMLAttributes, TextareaHTMLAttributes } from 'react';
import { useFormContext } from 'react-hook-form';
import { cn } from '../../lib/cn';
import { checkboxClass, controlClass, Field } from './field';
import { useFieldError } from './form';

export interface SelectOption {
  value: string;
  label: string;
}

interface Common {
  /** The form value's name (dotted for nested values: `types.0.name`). */
  name: string;
  label: string;
  hint?: string;
  hideLabel?: boolean;
  /** Announce the error as it appears (see Field). */
  announce?: boolean;
  /** The label before a small control on one line (a checkbox always has its own layout). */
  inline?: boolean;
  /** Classes for the control (merged over the default look). */
  controlClassName?: string;
  /** Also receives the control element (react-hook-form keeps its own ref for focus). */
  controlRef?: (element: HTMLInputElement | HTMLTextAreaElement | HTMLSelectElement | null) => void;
  className?: string;
}

type Omitted = 'name' | 'id' | 'value' | 'defaultValue' | 'className' | 'children';
type InputFieldProps = Common & { as?: 'input' } & Omit<InputHTMLAttributes<HTMLInputElement>, Omitted>;
type TextAreaFieldProps = Common & { as: 'textarea' } & Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, Omitted>;
type SelectFieldProps = Common & { as: 'select'; options: readonly SelectOption[] } & Omit<SelectHTMLAttributes<HTMLSelectElement>, Omitted>;
export type FormFieldProps = InputFieldProps | TextAreaFieldProps | SelectFieldProps;

/** The attributes that go to the control itself (placeholder, autoComplete, rows, maxLength …). */
const OWN_KEYS = ['as', 'name', 'label', 'hint', 'hideLabel', 'announce', 'inline', 'controlClassName', 'controlRef', 'className', 'options', 'onChange', 'onBlur'] as const;
function controlAttributes(props: FormFieldProps): Record<string, unknown> {
  const rest: Record<string, unknown> = { ...props };
  for (const key of OWN_KEYS) delete rest[key];
  return rest;
}

/**
 * The one field of every form: label, control (input, checkbox, textarea or select), hint and error,
 * registered with the surrounding <Form>'s react-hook-form by name. The error is the schema's message
 * for this field, else the server's.
 */
export function FormField(props: FormFieldProps) {
  const { register } = useFormContext();
  const error = useFieldError(props.name);
  const { name, label, hint, hideLabel, announce, inline, controlClassName, controlRef, className, onChange, onBlur } = props;
  const checkbox = (props.as ?? 'input') === 'input' && (props as InputFieldProps).type === 'checkbox';
  const attributes = controlAttributes(props);
  // The caller's onChange / onBlur run after react-hook-form's own.
  const { ref: formRef, ...handlers } = register(name, { onChange, onBlur });
  const registered = {
    ...handlers,
    ref: (element: HTMLInputElement | HTMLTextAreaElement | HTMLSelectElement | null) => {
      formRef(element);
      controlRef?.(element);
    },
  };

  return (
    <Field label={label} hint={hint} error={error} hideLabel={hideLabel} announce={announce} layout={checkbox ? 'checkbox' : inline ? 'inline' : 'stacked'} className={className}>
      {(control) => {
        if (props.as === 'textarea') return <textarea rows={3} {...attributes} {...control} {...registered} className={cn(controlClass, controlClassName)} />;
        if (props.as === 'select') {
          return (
            <select {...attributes} {...control} {...registered} className={cn(controlClass, controlClassName)}>
              {props.options.map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </select>
          );
        }
        return <input type="text" {...attributes} {...control} {...registered} className={cn(checkbox ? checkboxClass : controlClass, controlClassName)} />;
      }}
    </Field>
  );
}
