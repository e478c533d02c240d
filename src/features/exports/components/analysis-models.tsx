import { useId, useState } from 'react';
import { ENGINE_FORMATS, exportUrl } from '../../../shared/exports';
import { analysisLabel, useFinishedAnalyses } from '../../../hooks/use-finished-analyses';

const ENGINE_LABELS = { gromacs: 'GROMACS model (zip)', lammps: 'LAMMPS model (zip)' } as const;

/** GROMACS and LAMMPS models of the state an analysis applied, with the beads at its mean structure (docs/exports.md). */
export function AnalysisModels({ mappingId }: { mappingId: number }) {
  const id = useId();
  const analyses = useFinishedAnalyses(mappingId);
  const [chosen, setChosen] = useState<number | null>(null);
  const list = analyses.data ?? [];
  const a = list.find((x) => x.id === chosen) ?? list[0];
  if (!a) return null;
  const state = a.versionNumber ?? 'draft';
  return (
    <div>
      <label htmlFor={id} className="flex items-center gap-2 font-semibold text-ink-700">
        At an analysis's mean structure
        <select id={id} className="rounded-md border border-ink-300 bg-paper-50 px-2 py-0.5 font-normal" value={a.id} onChange={(e) => setChosen(Number(e.target.value))}>
          {list.map((x) => <option key={x.id} value={x.id}>{analysisLabel(x)}</option>)}
        </select>
      </label>
      <ul className="mt-1 flex flex-wrap gap-x-3 gap-y-1" aria-label={`Export at the mean structure of analysis ${a.id}`}>
        {ENGINE_FORMATS.map((f) => (
          <li key={f}>
            <a className="text-ink-700 underline hover:text-ink-900" href={`${exportUrl(mappingId, f, state)}&analysis=${a.id}`} download>
              {ENGINE_LABELS[f]}
            </a>
          </li>
        ))}
      </ul>
    </div>
  );
}
