import { z } from 'zod';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { parseWeight } from '../model/weight';

// What a typed weight means (a number strictly between 0 and 1), with parseWeight's messages.
const schema = z.object({
  weight: z.string().transform((text, ctx) => {
    const parsed = parseWeight(text);
    if ('error' in parsed) {
      ctx.addIssue({ code: 'custom', message: parsed.error });
      return z.NEVER;
    }
    return parsed.weight;
  }),
});

interface WeightInputProps {
  label: string;
  weight: number;
  disabled: boolean;
  onChange(weight: number): void;
}

/**
 * A shared atom's weight. It takes what the person types as text and refuses what it cannot use
 * with a message tied to the field (aria-invalid, aria-describedby) — it never quietly keeps the
 * old value while showing the new text. Enter or leaving the field applies it; Escape puts the
 * current weight back.
 */
export function WeightInput({ label, weight, disabled, onChange }: WeightInputProps) {
  // `values` follows the stored weight when it changes (here or from someone else).
  const form = useZodForm(schema, { weight: String(weight) }, { values: { weight: String(weight) } });
  const apply = (v: { weight: number }) => {
    if (v.weight !== weight) onChange(v.weight);
  };
  return (
    <Form form={form} onSubmit={apply}>
      <FormField
        name="weight"
        label={label}
        inline
        inputMode="decimal"
        disabled={disabled}
        onBlur={() => form.getFieldState('weight').isDirty && void form.handleSubmit(apply)()}
        onKeyDown={(e) => e.key === 'Escape' && form.reset()}
        controlClassName="w-20 px-2 py-0.5 text-sm tabular-nums"
      />
    </Form>
  );
}
