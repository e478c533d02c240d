import { z } from 'zod';
import type * as Y from 'yjs';
import type { Molecule, Topology } from '../../../shared/chem';
import { TERM_FUNCTIONS, TERM_LIMITS, bondedParamsProblem, type BondedParams } from '../../../shared/bonded-terms';
import { docToMapping, setBonded } from '../../../shared/mapping-doc';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { editorBondedRows, useBondedRevision, type EditorBondedRow } from '../model/bonded-rows';
import { FillFromAnalysis } from './fill-from-analysis';
import { ImproperForm } from './improper-form';
import { RingControls } from './ring-controls';
import { ResidueForm } from './residue-form';

const compact = 'px-1 py-0.5 text-xs w-20';
const UNITS: Record<EditorBondedRow['kind'], { value: string; k: string }> = {
  bond: { value: 'nm', k: 'kJ/mol/nm²' },
  angle: { value: '°', k: 'kJ/mol/rad²' },
  dihedral: { value: 'phase °', k: 'kJ/mol' },
  improper: { value: '°', k: 'kJ/mol/rad²' },
};

interface PanelProps {
  mappingId: number;
  doc: Y.Doc;
  origin: unknown;
  readOnly: boolean;
  topology: Topology | null;
  molecule: Molecule;
}

/**
 * The bonded-terms table (docs/exports.md): one row per bond, angle and dihedral of the latest CG
 * topology, edited in the draft like everything else; a value the draft would refuse never leaves the
 * row's form (the same rule the server checks the document with), and an empty field stays unset.
 */
export function BondedTermsPanel({ mappingId, doc, origin, readOnly, topology, molecule }: PanelProps) {
  useBondedRevision(doc);
  if (!topology) return <p className="text-sm text-ink-700">The bonded terms appear once the draft has been evaluated.</p>;
  const { rows, exclusions } = editorBondedRows(doc, topology, molecule);
  if (rows.length === 0) return <p className="text-sm text-ink-700">No bonds between beads yet.</p>;
  const draft = docToMapping(doc);
  const names = new Map(draft.beads.map((b) => [b.id, b.name]));
  return (
    <div className="flex flex-col gap-2">
      {!readOnly && <FillFromAnalysis mappingId={mappingId} rows={rows} />}
      <div className="flex flex-wrap items-end gap-4">
        <ExclusionsForm doc={doc} origin={origin} readOnly={readOnly} exclusions={exclusions} />
        <ResidueForm doc={doc} origin={origin} readOnly={readOnly} residue={draft.residue ?? null} />
      </div>
      <RingControls doc={doc} origin={origin} readOnly={readOnly} topology={topology} stored={draft.bonded ?? {}} beadName={(id) => names.get(id) ?? id} />
      <ul className="flex flex-col gap-1" aria-label="Bonded terms">
        {rows.map((r) => <BondedRowForm key={r.key} row={r} doc={doc} origin={origin} readOnly={readOnly} />)}
      </ul>
      {!readOnly && <ImproperForm doc={doc} origin={origin} beads={draft.beads} />}
    </div>
  );
}

const exclusionsSchema = z
  .object({ exclusions: z.string() })
  .transform((v) => (v.exclusions.trim() === '' ? Number.NaN : Number(v.exclusions)))
  .pipe(z.number('The exclusion count is a whole number.').int('The exclusion count is a whole number.').min(TERM_LIMITS.exclusions.min).max(TERM_LIMITS.exclusions.max, `The exclusion count is 0 to ${TERM_LIMITS.exclusions.max}.`));

function ExclusionsForm({ doc, origin, readOnly, exclusions }: { doc: Y.Doc; origin: unknown; readOnly: boolean; exclusions: number | null }) {
  const form = useZodForm(exclusionsSchema, { exclusions: '' }, { values: { exclusions: exclusions === null ? '' : String(exclusions) } });
  return (
    <Form form={form} onSubmit={(n: number) => setBonded(doc, {}, n, origin)} aria-label="Exclusion count">
      <div className="flex items-end gap-2">
        <FormField name="exclusions" label="Exclusions (bonds apart, GROMACS nrexcl)" announce inputMode="numeric" disabled={readOnly} controlClassName={compact} />
        {!readOnly && <button type="submit" className="rounded-md bg-ink-700 px-2 py-0.5 text-xs font-semibold text-paper-50 hover:bg-ink-800">Save</button>}
      </div>
    </Form>
  );
}

const text = (v: number | null | undefined) => (v === null || v === undefined ? '' : String(v));
const numberOrNull = (s: string) => (s.trim() === '' ? null : Number(s));

function rowSchema(kind: EditorBondedRow['kind']) {
  return z
    .object({ function: z.string(), value: z.string(), k: z.string(), multiplicity: z.string(), constraint: z.boolean(), omit: z.boolean() })
    .transform((v): BondedParams => ({
      function: v.function as BondedParams['function'],
      value: numberOrNull(v.value),
      k: numberOrNull(v.k),
      ...(kind === 'dihedral' && v.multiplicity.trim() !== '' ? { multiplicity: Number(v.multiplicity) } : {}),
      ...(kind === 'bond' && v.constraint ? { constraint: true } : {}),
      ...(kind !== 'bond' && v.omit ? { omit: true } : {}),
    }))
    .superRefine((p, ctx) => {
      if ((p.value !== null && Number.isNaN(p.value)) || (p.k !== null && Number.isNaN(p.k))) return void ctx.addIssue({ code: 'custom', path: ['value'], message: 'Values are numbers (or empty for not set).' });
      const why = bondedParamsProblem(kind, p);
      if (why) ctx.addIssue({ code: 'custom', path: [/force constant/.test(why) ? 'k' : /multiplicity/.test(why) ? 'multiplicity' : 'value'], message: why });
    });
}

function BondedRowForm({ row, doc, origin, readOnly }: { row: EditorBondedRow; doc: Y.Doc; origin: unknown; readOnly: boolean }) {
  const label = `${row.kind} ${row.beads.join('–')}`;
  const values = { function: row.function, value: text(row.value), k: text(row.k), multiplicity: text(row.multiplicity), constraint: !!row.constraint, omit: !!row.omit };
  const form = useZodForm(rowSchema(row.kind), values, { values });
  const unit = UNITS[row.kind];
  return (
    <li>
      <Form form={form} onSubmit={(p: BondedParams) => setBonded(doc, { [row.key]: p }, undefined, origin)} aria-label={label}>
        <div className="flex flex-wrap items-end gap-2 text-xs">
          <span className="w-32 font-semibold text-ink-800">{label}</span>
          <FormField name="function" label={`Function of ${label}`} hideLabel as="select" options={TERM_FUNCTIONS[row.kind].map((f) => ({ value: f, label: f }))} disabled={readOnly} controlClassName={compact} />
          <FormField name="value" label={`Value of ${label} (${unit.value})`} hideLabel announce placeholder={unit.value} inputMode="decimal" disabled={readOnly} controlClassName={compact} />
          <FormField name="k" label={`Force constant of ${label} (${unit.k})`} hideLabel announce placeholder={unit.k} inputMode="decimal" disabled={readOnly} controlClassName={compact} />
          {row.kind === 'dihedral' && <FormField name="multiplicity" label={`Multiplicity of ${label}`} hideLabel announce placeholder="n" inputMode="numeric" disabled={readOnly} controlClassName={compact} />}
          {row.kind === 'bond' ? <FormField name="constraint" label="Constraint" type="checkbox" disabled={readOnly} /> : <FormField name="omit" label="Leave out" type="checkbox" disabled={readOnly} />}
          {!readOnly && <button type="submit" className="rounded-md bg-ink-700 px-2 py-0.5 font-semibold text-paper-50 hover:bg-ink-800">Save</button>}
          {!readOnly && row.kind === 'improper' && (
            <button type="button" aria-label={`Remove ${label}`} className="rounded-md border border-alert-600/40 px-2 py-0.5 font-semibold text-alert-700 hover:bg-alert-50" onClick={() => setBonded(doc, { [row.key]: null }, undefined, origin)}>Remove</button>
          )}
        </div>
      </Form>
    </li>
  );
}
