import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, type DefaultValues, type FieldValues, type Resolver, type UseFormProps } from 'react-hook-form';
import { useEffect, useState } from 'react';
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

/**
 * `useZodForm` with the schema's module imported on first use instead of with the page: zod and the
 * schema load as soon as the person changes a field (or, at the latest, on submit, when the
 * resolver first runs). For the sign-in page, whose first paint should not wait for the validator
 * (its gzipped JS budget: docs/benchmarks.md, Client bundle).
 */
export function useLazyZodForm<S extends z.ZodType<unknown, FieldValues>>(load: () => Promise<S>, defaultValues: z.input<S>) {
  const [lazy] = useState(() => {
    let resolver: Promise<Resolver<z.input<S>, unknown, z.output<S>>> | undefined;
    const ready = () => (resolver ??= load().then((schema) => zodResolver(schema) as unknown as Resolver<z.input<S>, unknown, z.output<S>>));
    const resolve: Resolver<z.input<S>, unknown, z.output<S>> = async (values, context, options) => (await ready())(values, context, options);
    return { ready, resolve };
  });
  const form = useForm<z.input<S>, unknown, z.output<S>>({ resolver: lazy.resolve, defaultValues: defaultValues as DefaultValues<z.input<S>> });
  useEffect(() => {
    const { unsubscribe } = form.watch(() => void lazy.ready());
    return unsubscribe;
  }, [form, lazy]);
  return form;
}
