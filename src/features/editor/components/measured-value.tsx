import { z } from 'zod';
import type { BeadEvaluation, MeasuredPartition } from '../../../shared/chem';
import { MEASURED_SOURCE_MAX, setMeasured } from '../../../shared/mapping-doc';
import { measuredSchema } from '../../../shared/mapping-schema';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import type { EditorContext } from '../commands/registry';
import type { BeadView } from '../model/bead-view';
import { formatSigned } from '../model/number-format';

const compact = 'px-2 py-1 text-sm';
const kindOptions = [
  { value: 'logP', label: 'logP (298 K)' },
  { value: 'deltaG', label: 'ΔG_OW (kJ/mol, 298 K)' },
];

// The value is typed as text; empty is "no number". Then the draft's own rule for a measured value
// (the one the server checks the document with), so a value it would refuse never leaves the form.
const schema = z
  .object({ kind: measuredSchema.shape.kind, value: z.string(), source: z.string() })
  .transform((v): z.input<typeof measuredSchema> => ({ ...v, value: v.value.trim() === '' ? Number.NaN : Number(v.value) }))
  .pipe(measuredSchema);

/**
 * A measured or literature logP or ΔG for the active bead, with its source. Stored in the draft (so it
 * is live and versioned) and used before both estimates in suggestions and exports.
 */
export function MeasuredValue({ ctx, bead, evaluation }: { ctx: EditorContext; bead: BeadView; evaluation: BeadEvaluation | undefined }) {
  // A new form per bead, so text typed for one bead never carries over to the next.
  return <MeasuredValueForm key={bead.id} ctx={ctx} bead={bead} evaluation={evaluation} />;
}

function MeasuredValueForm({ ctx, bead, evaluation }: { ctx: EditorContext; bead: BeadView; evaluation: BeadEvaluation | undefined }) {
  const stored = bead.measured ?? null;
  // `values` follows the stored value when someone (here or elsewhere) changes it.
  const form = useZodForm(schema, { kind: 'logP', value: '', source: '' }, {
    values: { kind: stored?.kind ?? 'logP', value: stored ? String(stored.value) : '', source: stored?.source ?? '' },
  });
  const save = (measured: MeasuredPartition) => setMeasured(ctx.doc, bead.id, measured, ctx.origin);

  return (
    <Form form={form} onSubmit={save} aria-label="Measured or literature value">
      <fieldset className="flex flex-col gap-2 rounded-md border border-paper-300 p-2">
        <legend className="px-1 text-xs font-semibold text-ink-700">Measured or literature value</legend>
        {stored && evaluation && typeof evaluation.measuredLogP === 'number' && (
          <p className="text-xs text-ink-700" data-testid="measured-in-use">
            In use: logP {formatSigned(evaluation.measuredLogP, 2)} (ΔG {formatSigned(evaluation.measuredDeltaG, 1)} kJ/mol), source: {stored.source}
          </p>
        )}
        <div className="grid grid-cols-[auto_1fr] gap-2">
          <FormField name="kind" label="Measured quantity" hideLabel as="select" options={kindOptions} disabled={ctx.readOnly} controlClassName={compact} />
          <FormField name="value" label="Measured value" hideLabel announce inputMode="decimal" disabled={ctx.readOnly} controlClassName={compact} />
        </div>
        <FormField
          name="source"
          label="Source of the measured value"
          hideLabel
          announce
          placeholder="Source (e.g. handbook, paper, own measurement)"
          maxLength={MEASURED_SOURCE_MAX}
          disabled={ctx.readOnly}
          controlClassName={compact}
        />
        {!ctx.readOnly && (
          <div className="flex gap-2">
            <button type="submit" className="rounded-md bg-ink-700 px-2 py-0.5 text-xs font-semibold text-paper-50 hover:bg-ink-800">Save measured value</button>
            {stored && <button type="button" onClick={() => setMeasured(ctx.doc, bead.id, null, ctx.origin)} className="rounded-md px-2 py-0.5 text-xs font-semibold text-alert-700 hover:bg-alert-50">Remove</button>}
          </div>
        )}
      </fieldset>
    </Form>
  );
}
