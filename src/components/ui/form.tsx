import { createContext, useContext, type FormHTMLAttributes, type ReactNode } from 'react';
import { FormProvider, get, useFormContext, useFormState, type FieldValues, type SubmitHandler, type UseFormReturn } from 'react-hook-form';
import { ErrorAlert } from './alert';
import { serverFieldErrors, type FieldErrors } from '../../lib/server-field-errors';

const ServerErrors = createContext<FieldErrors>({});

interface FormProps<Values extends FieldValues, Output> extends Omit<FormHTMLAttributes<HTMLFormElement>, 'onSubmit'> {
  /** From `useZodForm` (react-hook-form with the zod resolver). */
  form: UseFormReturn<Values, unknown, Output>;
  /** Called with the schema's parsed output once every field is valid. */
  onSubmit: SubmitHandler<Output>;
  /** The last server error: the field messages of a `validation_failed` answer show beside their fields. */
  serverError?: unknown;
  children: ReactNode;
}

/**
 * A react-hook-form form checked by a shared zod schema, so the client shows the messages the server
 * would answer with. Fields are checked on submit and then as they change; the first invalid field
 * takes focus (react-hook-form's `shouldFocusError`).
 */
export function Form<Values extends FieldValues, Output>({ form, onSubmit, serverError, children, ...rest }: FormProps<Values, Output>) {
  return (
    <FormProvider {...form}>
      <ServerErrors value={serverFieldErrors(serverError)}>
        <form noValidate {...rest} onSubmit={form.handleSubmit(onSubmit)}>
          {children}
        </form>
      </ServerErrors>
    </FormProvider>
  );
}

/** The message about one field: the client's check first, else the server's answer. '' is the whole form. */
export function useFieldError(name: string): string | undefined {
  const { control } = useFormContext();
  const { errors } = useFormState({ control });
  const server = useContext(ServerErrors);
  // A rule across fields (zod issue path []) comes back from the resolver under ''.
  const own = (name === '' ? (errors as Record<string, unknown>)[''] : get(errors, name)) as { message?: string } | undefined;
  return own?.message ?? server[name];
}

/** A message about the whole form (a schema rule across fields, or the server's), as an alert. */
export function FormError() {
  const message = useFieldError('');
  return <ErrorAlert>{message}</ErrorAlert>;
}
