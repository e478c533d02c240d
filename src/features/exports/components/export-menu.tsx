import { useState } from 'react';
import { ENGINE_FORMATS, EXPORT_FORMATS, exportUrl, projectZipUrl, type EngineFormat, type ExportFormat } from '../../../shared/exports';
import type { VersionRef } from '../../../shared/versions';
import { AnalysisModels } from './analysis-models';

const LABELS: Record<ExportFormat | EngineFormat, string> = {
  csv: 'Mapping table (CSV)',
  json: 'Mapping (JSON)',
  pdb: 'CG structure (PDB)',
  groups: 'Atom groups (text)',
  ndx: 'GROMACS index (.ndx)',
  svg: 'Picture (SVG)',
  png: 'Picture (PNG)',
  gromacs: 'GROMACS model (zip)',
  lammps: 'LAMMPS model (zip)',
};

interface ExportMenuProps {
  mappingId: number;
  projectId: number;
  /** The states offered: the draft, the production version when there is one, and any chosen version. */
  states: { ref: VersionRef; label: string }[];
  /** Saved version numbers, newest first: one of them can be chosen for export too. */
  versions?: readonly number[];
}

/** Download links for every export format of each offered state and of a chosen version, and the project's production zip. */
export function ExportMenu({ mappingId, projectId, states, versions = [] }: ExportMenuProps) {
  const [chosen, setChosen] = useState<number | null>(null);
  const version = chosen !== null && versions.includes(chosen) ? chosen : (versions[0] ?? null);
  return (
    <details className="rounded-md border border-paper-300 bg-paper-50 px-3 py-2 text-sm">
      <summary className="cursor-pointer font-semibold text-ink-800">Export</summary>
      <div className="mt-2 flex flex-col gap-3">
        {states.map((s) => <FormatLinks key={String(s.ref)} mappingId={mappingId} state={s.ref} label={s.label} />)}
        {version !== null && (
          <div>
            <label className="flex items-center gap-2 font-semibold text-ink-700">
              A saved version
              <select className="rounded-md border border-ink-300 bg-paper-50 px-2 py-0.5 font-normal" value={version} onChange={(e) => setChosen(Number(e.target.value))}>
                {versions.map((n) => <option key={n} value={n}>Version {n}</option>)}
              </select>
            </label>
            <FormatLinks mappingId={mappingId} state={version} label={`Version ${version}`} hideTitle />
          </div>
        )}
        <AnalysisModels mappingId={mappingId} />
        <a className="text-ink-700 underline hover:text-ink-900" href={projectZipUrl(projectId)} download>
          Every production version in this project (zip)
        </a>
      </div>
    </details>
  );
}

function FormatLinks({ mappingId, state, label, hideTitle = false }: { mappingId: number; state: VersionRef; label: string; hideTitle?: boolean }) {
  return (
    <div>
      {!hideTitle && <p className="font-semibold text-ink-700">{label}</p>}
      <ul className="mt-1 flex flex-wrap gap-x-3 gap-y-1" aria-label={`Export ${label}`}>
        {[...EXPORT_FORMATS, ...ENGINE_FORMATS].map((f) => (
          <li key={f}>
            <a className="text-ink-700 underline hover:text-ink-900" href={exportUrl(mappingId, f, state)} download>
              {LABELS[f]}
            </a>
          </li>
        ))}
      </ul>
    </div>
  );
}
