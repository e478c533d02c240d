import { memo, useEffect, useRef, useState } from 'react';
import type { BeadEvaluation, CentreRule } from '../../../shared/chem';
import type { BeadTypeRow } from '../../../shared/bead-types';
import { BEAD_NAME_MAX, CENTRE_RULES, renameBead, setCentre, setType } from '../../../shared/mapping-doc';
import type { EditorContext } from '../commands/registry';
import type { BeadView } from '../model/bead-view';
import { AtomWeights } from './atom-weights';
import { MeasuredValue } from './measured-value';

const CENTRE_LABEL: Record<CentreRule, string> = { mass: 'Centre of mass', geometry: 'Centre of geometry', 'geometry-heavy': 'Geometry of heavy atoms' };
const control = 'w-full rounded-md border border-paper-400 bg-paper-50 px-2 py-1 text-sm text-ink-900 focus:border-ink-500 disabled:opacity-60';

interface BeadInspectorProps {
  ctx: EditorContext;
  bead: BeadView;
  evaluation: BeadEvaluation | undefined;
  library: readonly BeadTypeRow[];
  renaming: boolean;
  onRenamed(): void;
}

/** The active bead: name, type (with the suggestion one press away), centre rule and atom weights. */
export const BeadInspector = memo(function BeadInspector({ ctx, bead, evaluation, library, renaming, onRenamed }: BeadInspectorProps) {
  const [name, setName] = useState(bead.name);
  const nameInput = useRef<HTMLInputElement>(null);
  useEffect(() => setName(bead.name), [bead.name, bead.id]);
  useEffect(() => {
    if (renaming) {
      nameInput.current?.focus();
      nameInput.current?.select();
    }
  }, [renaming]);

  const commitName = () => {
    const trimmed = name.trim().slice(0, BEAD_NAME_MAX);
    if (trimmed && trimmed !== bead.name) renameBead(ctx.doc, bead.id, trimmed, ctx.origin);
    else setName(bead.name);
    onRenamed();
  };
  const suggestion = evaluation?.suggestedType ?? null;
  const types = library.some((t) => t.name === bead.type) || !bead.type ? library : [...library, { name: bead.type } as BeadTypeRow];

  return (
    <section aria-label={`Bead ${bead.name}`} className="flex flex-col gap-3">
      <div className="flex items-center gap-2">
        <span aria-hidden="true" className="size-4 rounded-full" style={{ background: bead.colour }} />
        <label className="sr-only" htmlFor="bead-name">Bead name</label>
        <input
          id="bead-name"
          ref={nameInput}
          value={name}
          disabled={ctx.readOnly}
          maxLength={BEAD_NAME_MAX}
          onChange={(e) => setName(e.target.value)}
          onBlur={commitName}
          onKeyDown={(e) => {
            if (e.key === 'Enter') e.currentTarget.blur();
            if (e.key === 'Escape') {
              setName(bead.name);
              e.currentTarget.blur();
            }
          }}
          className={`${control} font-bold`}
        />
      </div>
      <div className="grid grid-cols-2 gap-2">
        <label className="flex flex-col gap-1 text-xs font-semibold text-ink-700">
          Bead type
          <select value={bead.type ?? ''} disabled={ctx.readOnly} onChange={(e) => setType(ctx.doc, bead.id, e.target.value || null, ctx.origin)} className={control}>
            <option value="">No type</option>
            {types.map((t) => (
              <option key={t.name} value={t.name}>{t.name}</option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-xs font-semibold text-ink-700">
          Centre rule
          <select value={bead.centre} disabled={ctx.readOnly} onChange={(e) => setCentre(ctx.doc, bead.id, e.target.value as CentreRule, ctx.origin)} className={control}>
            {CENTRE_RULES.map((c) => <option key={c} value={c}>{CENTRE_LABEL[c]}</option>)}
          </select>
        </label>
      </div>
      {suggestion && (
        <p className="flex flex-wrap items-center gap-2 text-sm text-ink-700">
          Suggested: <strong>{suggestion}</strong>
          {evaluation?.ionic && <span className="text-xs">(from charge and size: a charged bead has no partition value)</span>}
          {evaluation?.suggestedTypeFits === false && <span className="text-xs">(nearest; ΔG outside every range)</span>}
          {!ctx.readOnly && bead.type !== suggestion && (
            <button type="button" onClick={() => setType(ctx.doc, bead.id, suggestion, ctx.origin)} className="rounded-md bg-ink-700 px-2 py-0.5 text-xs font-semibold text-paper-50 hover:bg-ink-800">
              Use {suggestion}
            </button>
          )}
        </p>
      )}
      <MeasuredValue ctx={ctx} bead={bead} evaluation={evaluation} />
      <AtomWeights ctx={ctx} bead={bead} />
    </section>
  );
});
