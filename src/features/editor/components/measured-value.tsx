import { useEffect, useState } from 'react';
import type { BeadEvaluation, MeasuredPartition } from '../../../shared/chem';
import { MEASURED_SOURCE_MAX, measuredProblem, setMeasured } from '../../../shared/mapping-doc';
import type { EditorContext } from '../commands/registry';
import type { BeadView } from '../model/bead-view';
import { formatSigned } from '../model/number-format';

const control = 'w-full rounded-md border border-paper-400 bg-paper-50 px-2 py-1 text-sm text-ink-900 focus:border-ink-500 disabled:opacity-60';

/**
 * A measured or literature logP or ΔG for the active bead, with its source. Stored in the draft (so it
 * is live and versioned) and used before both estimates in suggestions and exports. Checked with the
 * draft's own rule before it is written, so a value the server would refuse never leaves the form.
 */
export function MeasuredValue({ ctx, bead, evaluation }: { ctx: EditorContext; bead: BeadView; evaluation: BeadEvaluation | undefined }) {
  const stored = bead.measured ?? null;
  const [kind, setKind] = useState<MeasuredPartition['kind']>(stored?.kind ?? 'logP');
  const [value, setValue] = useState(stored ? String(stored.value) : '');
  const [source, setSource] = useState(stored?.source ?? '');
  const [problem, setProblem] = useState<string | null>(null);
  // The form follows the stored value's fields (not the object, which is new on every draft change).
  const storedKind = stored?.kind;
  const storedValue = stored?.value;
  const storedSource = stored?.source;
  useEffect(() => {
    setKind(storedKind ?? 'logP');
    setValue(storedValue === undefined ? '' : String(storedValue));
    setSource(storedSource ?? '');
    setProblem(null);
  }, [storedKind, storedValue, storedSource, bead.id]);

  const save = () => {
    const candidate = { kind, value: value.trim() === '' ? Number.NaN : Number(value), source: source.trim() };
    const why = measuredProblem(candidate);
    if (why) return setProblem(why);
    setProblem(null);
    setMeasured(ctx.doc, bead.id, candidate, ctx.origin);
  };

  return (
    <fieldset className="flex flex-col gap-2 rounded-md border border-paper-300 p-2">
      <legend className="px-1 text-xs font-semibold text-ink-700">Measured or literature value</legend>
      {stored && evaluation && typeof evaluation.measuredLogP === 'number' && (
        <p className="text-xs text-ink-700" data-testid="measured-in-use">
          In use: logP {formatSigned(evaluation.measuredLogP, 2)} (ΔG {formatSigned(evaluation.measuredDeltaG, 1)} kJ/mol), source: {stored.source}
        </p>
      )}
      <div className="grid grid-cols-[auto_1fr] gap-2">
        <select aria-label="Measured quantity" value={kind} disabled={ctx.readOnly} onChange={(e) => setKind(e.target.value as MeasuredPartition['kind'])} className={control}>
          <option value="logP">logP (298 K)</option>
          <option value="deltaG">ΔG_OW (kJ/mol, 298 K)</option>
        </select>
        <input aria-label="Measured value" inputMode="decimal" value={value} disabled={ctx.readOnly} onChange={(e) => setValue(e.target.value)} className={control} />
      </div>
      <input aria-label="Source of the measured value" placeholder="Source (e.g. handbook, paper, own measurement)" maxLength={MEASURED_SOURCE_MAX} value={source} disabled={ctx.readOnly} onChange={(e) => setSource(e.target.value)} className={control} />
      {problem && <p role="alert" className="text-xs text-alert-700">{problem}</p>}
      {!ctx.readOnly && (
        <div className="flex gap-2">
          <button type="button" onClick={save} className="rounded-md bg-ink-700 px-2 py-0.5 text-xs font-semibold text-paper-50 hover:bg-ink-800">Save measured value</button>
          {stored && <button type="button" onClick={() => setMeasured(ctx.doc, bead.id, null, ctx.origin)} className="rounded-md px-2 py-0.5 text-xs font-semibold text-alert-700 hover:bg-alert-50">Remove</button>}
        </div>
      )}
    </fieldset>
  );
}
