import { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { Form } from '../../../components/ui/form';
import { FormField, type SelectOption } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { compareRef } from '../../../shared/versions';
import type { StateRef } from '../api/get-compare';

// The same rule the compare route reads its query with: a version number or draft.
const schema = z.object({ from: compareRef, to: compareRef });

/** Choose two states of the mapping (versions or the draft) to compare. */
export function CompareForm({ options, from, onCompare }: { options: SelectOption[]; from: string; onCompare(from: StateRef, to: StateRef): void }) {
  const form = useZodForm(schema, { from, to: 'draft' });
  return (
    <Form form={form} onSubmit={(v) => onCompare(v.from, v.to)} className="flex flex-wrap items-end gap-2 text-sm">
      <FormField name="from" label="Compare from" as="select" options={options} controlClassName="px-2 py-1" />
      <FormField name="to" label="Compare to" as="select" options={options} controlClassName="px-2 py-1" />
      <Button type="submit" size="sm" variant="secondary">Compare</Button>
    </Form>
  );
}
