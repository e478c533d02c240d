import { z } from 'zod';
import type * as Y from 'yjs';
import { bondedParamsProblem, termKey, type BondedParams } from '../../../shared/bonded-terms';
import { setBonded } from '../../../shared/mapping-doc';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';

const compact = 'px-1 py-0.5 text-xs w-20';
const SLOTS = ['first', 'second', 'third', 'fourth'] as const;

const improperSchema = z
  .object({ first: z.string(), second: z.string(), third: z.string(), fourth: z.string(), value: z.string(), k: z.string() })
  .transform((v) => ({ ids: SLOTS.map((s) => v[s]), params: { function: 'harmonic', value: v.value.trim() === '' ? Number.NaN : Number(v.value), k: v.k.trim() === '' ? Number.NaN : Number(v.k) } as BondedParams }))
  .superRefine(({ ids, params }, ctx) => {
    SLOTS.forEach((s, i) => {
      if (ids[i] === '') ctx.addIssue({ code: 'custom', path: [s], message: 'Pick a bead.' });
    });
    if (ids.every((id) => id !== '') && new Set(ids).size !== 4) ctx.addIssue({ code: 'custom', path: ['fourth'], message: 'An improper dihedral joins four different beads.' });
    if (Number.isNaN(params.value)) return void ctx.addIssue({ code: 'custom', path: ['value'], message: 'Give the equilibrium angle in degrees.' });
    if (Number.isNaN(params.k)) return void ctx.addIssue({ code: 'custom', path: ['k'], message: 'Give the force constant in kJ/mol/rad².' });
    const why = bondedParamsProblem('improper', params);
    if (why) ctx.addIssue({ code: 'custom', path: [/force constant/.test(why) ? 'k' : 'value'], message: why });
  });

const EMPTY = { first: '', second: '', third: '', fourth: '', value: '0', k: '' };

/**
 * Adding an improper dihedral (four beads, ξ0 in degrees, k in kJ mol⁻¹ rad⁻²) to keep a planar ring
 * system planar; stored in the draft like the other terms and listed in the table, where each has a Remove button.
 */
export function ImproperForm({ doc, origin, beads }: { doc: Y.Doc; origin: unknown; beads: readonly { id: string; name: string }[] }) {
  const form = useZodForm(improperSchema, EMPTY);
  const options = [{ value: '', label: '—' }, ...beads.map((b) => ({ value: b.id, label: b.name }))];
  const add = ({ ids, params }: { ids: string[]; params: BondedParams }) => {
    setBonded(doc, { [termKey('improper', ids)]: params }, undefined, origin);
    form.reset(EMPTY);
  };
  return (
    <Form form={form} onSubmit={add} aria-label="Add an improper dihedral">
      <div className="flex flex-wrap items-end gap-2 text-xs">
        <span className="w-32 font-semibold text-ink-800">New improper</span>
        {SLOTS.map((s, i) => <FormField key={s} name={s} label={`Bead ${i + 1} of the new improper`} as="select" options={options} announce controlClassName={compact} />)}
        <FormField name="value" label="Improper angle (°)" announce inputMode="decimal" controlClassName={compact} />
        <FormField name="k" label="Improper force constant (kJ/mol/rad²)" announce inputMode="decimal" controlClassName={compact} />
        <button type="submit" className="rounded-md bg-ink-700 px-2 py-0.5 font-semibold text-paper-50 hover:bg-ink-800">Add improper</button>
      </div>
    </Form>
  );
}
