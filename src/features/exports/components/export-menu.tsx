import { EXPORT_FORMATS, exportUrl, projectZipUrl, type ExportFormat } from '../../../shared/exports';
import type { VersionRef } from '../../../shared/versions';

const LABELS: Record<ExportFormat, string> = {
  csv: 'Mapping table (CSV)',
  json: 'Mapping (JSON)',
  pdb: 'CG structure (PDB)',
  groups: 'Atom groups (text)',
  svg: 'Picture (SVG)',
  png: 'Picture (PNG)',
};

interface ExportMenuProps {
  mappingId: number;
  projectId: number;
  /** The states offered: the draft, the production version when there is one, and any chosen version. */
  states: { ref: VersionRef; label: string }[];
}

/** Download links for every export format of each offered state, and the project's production zip. */
export function ExportMenu({ mappingId, projectId, states }: ExportMenuProps) {
  return (
    <details className="rounded-md border border-paper-300 bg-paper-50 px-3 py-2 text-sm">
      <summary className="cursor-pointer font-semibold text-ink-800">Export</summary>
      <div className="mt-2 flex flex-col gap-3">
        {states.map((s) => (
          <div key={String(s.ref)}>
            <p className="font-semibold text-ink-700">{s.label}</p>
            <ul className="mt-1 flex flex-wrap gap-x-3 gap-y-1" aria-label={`Export ${s.label}`}>
              {EXPORT_FORMATS.map((f) => (
                <li key={f}>
                  <a className="text-ink-700 underline hover:text-ink-900" href={exportUrl(mappingId, f, s.ref)} download>
                    {LABELS[f]}
                  </a>
                </li>
              ))}
            </ul>
          </div>
        ))}
        <a className="text-ink-700 underline hover:text-ink-900" href={projectZipUrl(projectId)} download>
          Every production version in this project (zip)
        </a>
      </div>
    </details>
  );
}
