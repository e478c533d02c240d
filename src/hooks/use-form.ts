import { useState, type FormEvent } from 'react';
import type { z } from 'zod';
import { serverFieldErrors, zodFieldErrors, type FieldErrors } from '../lib/validation';

type Values = Record<string, string | boolean>;

interface Options<V extends Values> {
  /** Turns what the inputs hold into what the schema reads (e.g. '' → undefined). */
  toInput?: (values: V) => unknown;
  /** The last server error, whose field messages are shown beside the fields. */
  serverError?: unknown;
}

/**
 * Form state checked by one of the shared zod schemas, so the client shows the
 * same messages the server would answer with. Fields are checked on submit and
 * then again as they change, and the first invalid field takes focus.
 */
export function useForm<V extends Values, S extends z.ZodType>(schema: S, initial: V, options: Options<V> = {}) {
  const [values, setValues] = useState<V>(initial);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [checked, setChecked] = useState(false);
  const toInput = options.toInput ?? ((v: V) => v);

  const check = (next: V) => {
    const result = schema.safeParse(toInput(next));
    setErrors(result.success ? {} : zodFieldErrors(result.error));
    return result;
  };

  const set = <K extends keyof V>(name: K, value: V[K]) => {
    const next = { ...values, [name]: value };
    setValues(next);
    if (checked) check(next);
  };

  const handleSubmit = (onValid: (data: z.output<S>) => void) => (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    setChecked(true);
    const result = check(values);
    if (result.success) {
      onValid(result.data);
      return;
    }
    requestAnimationFrame(() => form.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus());
  };

  const fromServer = serverFieldErrors(options.serverError);
  const error = (name: keyof V & string): string | undefined => errors[name] ?? fromServer[name];

  /** Props for a text control: `<TextField label="E-mail" {...form.field('email')} />`. */
  const field = <K extends keyof V & string>(name: K) => ({
    value: String(values[name]),
    onValueChange: (value: string) => set(name, value as V[K]),
    error: error(name),
  });

  return { values, set, setValues, error, field, formError: errors[''] ?? fromServer[''], handleSubmit };
}
