import { z } from 'zod';
import type * as Y from 'yjs';
import { RESIDUE_NAME, setResidue } from '../../../shared/mapping-doc';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';

// The molecule's residue name in the PDB, GRO and ITP exports, a setting of the draft (versioned with
// it). Empty clears it (the exports then use CGM in PDB, the molecule's name in GROMACS files).
const upper = (v: { residue: string }) => v.residue.trim().toUpperCase();
const residueSchema = z
  .object({ residue: z.string() })
  .superRefine((v, ctx) => {
    if (upper(v) !== '' && !RESIDUE_NAME.test(upper(v))) ctx.addIssue({ code: 'custom', path: ['residue'], message: 'A residue name is 1 to 3 letters or digits.' });
  })
  .transform(upper);

export function ResidueForm({ doc, origin, readOnly, residue }: { doc: Y.Doc; origin: unknown; readOnly: boolean; residue: string | null }) {
  const form = useZodForm(residueSchema, { residue: '' }, { values: { residue: residue ?? '' } });
  return (
    <Form form={form} onSubmit={(r: string) => setResidue(doc, r === '' ? null : r, origin)} aria-label="Residue name">
      <div className="flex items-end gap-2">
        <FormField name="residue" label="Residue name (PDB, GRO, ITP exports)" announce disabled={readOnly} maxLength={3} controlClassName="px-1 py-0.5 text-xs w-20 uppercase" />
        {!readOnly && <button type="submit" className="rounded-md bg-ink-700 px-2 py-0.5 text-xs font-semibold text-paper-50 hover:bg-ink-800">Save</button>}
      </div>
    </Form>
  );
}
