import { useId, useState } from 'react';
import type { AnalysisView } from '../../../shared/references';
import { planFill } from '../../../shared/bonded-fill';
import type { BondedTerm } from '../../../shared/bonded-terms';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { useAnalysisResult, useFillBondedTerms } from '../api/fill-bonded-terms';
import { analysisLabel as label, useFinishedAnalyses } from '../../../hooks/use-finished-analyses';


/**
 * "Fill from analysis": the mapping's finished analyses, and a confirmation that says which rows the
 * fill replaces (the same matching the server does, src/shared/bonded-fill.ts) before the PUT.
 */
export function FillFromAnalysis({ mappingId, rows }: { mappingId: number; rows: readonly BondedTerm[] }) {
  const selectId = useId();
  const analyses = useFinishedAnalyses(mappingId);
  const [chosen, setChosen] = useState<number | null>(null);
  const [asking, setAsking] = useState(false);
  const fill = useFillBondedTerms(mappingId);
  const list = analyses.data ?? [];
  const picked = chosen ?? list[0]?.id ?? null;
  if (analyses.isPending) return null;
  if (list.length === 0) return <p className="text-xs text-ink-700">No finished analysis of this mapping yet: run one on the molecule page to fill the table from a reference.</p>;
  const report = fill.data?.fill;
  return (
    <div className="flex flex-col gap-1">
      <div className="flex flex-wrap items-end gap-2 text-xs">
        <label htmlFor={selectId} className="flex flex-col gap-0.5 font-semibold text-ink-800">
          Analysis to fill from
          <select id={selectId} className="rounded-md border border-ink-300 bg-paper-50 px-1 py-0.5 font-normal" value={picked ?? ''} onChange={(e) => setChosen(Number(e.target.value))}>
            {list.map((a) => <option key={a.id} value={a.id}>{label(a)}</option>)}
          </select>
        </label>
        <Button size="sm" variant="secondary" onClick={() => setAsking(true)} disabled={picked === null}>Fill from analysis</Button>
      </div>
      {fill.isError && <ErrorAlert error={fill.error} />}
      {report && (
        <Notice>
          Filled {report.filled.length} term{report.filled.length === 1 ? '' : 's'} from analysis {report.analysisId}.
          {report.skipped.length > 0 && ` Not used: ${report.skipped.map((s) => `${s.kind} ${s.beads.join('–')} (${s.reason})`).join('; ')}.`}
          {report.missing.length > 0 && ` Left as they were (no value in the analysis): ${report.missing.map((m) => `${m.kind} ${m.beads.join('–')}`).join(', ')}.`}
        </Notice>
      )}
      {asking && picked !== null && (
        <FillConfirm
          analysis={list.find((a) => a.id === picked)!}
          rows={rows}
          pending={fill.isPending}
          onCancel={() => setAsking(false)}
          onConfirm={() => fill.mutate(picked, { onSettled: () => setAsking(false) })}
        />
      )}
    </div>
  );
}

function FillConfirm({ analysis, rows, pending, onCancel, onConfirm }: { analysis: AnalysisView; rows: readonly BondedTerm[]; pending: boolean; onCancel(): void; onConfirm(): void }) {
  const result = useAnalysisResult(analysis.id);
  const plan = result.data?.result ? planFill(rows, result.data.result) : null;
  const replaced = plan ? plan.updates.filter((u) => rows[u.row].value !== null || rows[u.row].k !== null).length : 0;
  return (
    <ConfirmDialog title={`Fill bonded terms from analysis ${analysis.id}?`} confirmLabel="Fill the table" pending={pending || !plan} onConfirm={onConfirm} onCancel={onCancel}>
      <div className="flex flex-col gap-2 text-sm text-ink-800">
        <p>{label(analysis)}. Each bond and angle the analysis has values for gets its mean and kT/σ² as a harmonic term; each dihedral gets the dominant term of its cosine fit.</p>
        {plan ? (
          <p>
            This replaces the function, value and force constant of {plan.updates.length} row{plan.updates.length === 1 ? '' : 's'}
            {replaced > 0 ? ` (${replaced} of them already set)` : ''}. {plan.missing.length > 0 ? `${plan.missing.length} row${plan.missing.length === 1 ? '' : 's'} the analysis does not cover stay as they are. ` : ''}
            Constraints, left-out terms, impropers and the exclusion count stay.
            {plan.skipped.length > 0 && ` Not used from the analysis: ${plan.skipped.map((x) => `${x.kind} ${x.beads.join('–')} (${x.reason})`).join('; ')}`}
          </p>
        ) : (
          <p>Reading the analysis…</p>
        )}
      </div>
    </ConfirmDialog>
  );
}
