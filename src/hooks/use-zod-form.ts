import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, type DefaultValues, type FieldValues, type Resolver, type UseFormProps } from 'react-hook-form';
import type { z } from 'zod';

/**
 * react-hook-form checked by a zod schema (the shared one, or a form-values schema that turns the
 * inputs' text into it): `form.handleSubmit` hands on the schema's parsed output. Checked on submit,
 * then again as fields change (react-hook-form's default modes).
 */
export function useZodForm<S extends z.ZodType<unknown, FieldValues>>(
  schema: S,
  defaultValues: z.input<S>,
  options: Omit<UseFormProps<z.input<S>, unknown, z.output<S>>, 'resolver' | 'defaultValues'> = {},
) {
  return useForm<z.input<S>, unknown, z.output<S>>({
    ...options,
    // The resolver's overloads cannot see through a generic schema; these are its types for a concrete one.
    resolver: zodResolver(schema) as unknown as Resolver<z.input<S>, unknown, z.output<S>>,
    defaultValues: defaultValues as DefaultValues<z.input<S>>,
  });
}
