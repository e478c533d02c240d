import { useDeferredValue, useId, useState } from 'react';
import { Link } from 'react-router';
import { ErrorAlert } from '../../../components/ui/alert';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { controlClass } from '../../../components/ui/field';
import { plural } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { useMolecules } from '../api/get-molecules';
import { MoleculeThumbnail } from './molecule-thumbnail';

/** The project's molecules with a search over name, notes, formula and SMILES. */
export function MoleculeList({ projectId }: { projectId: number }) {
  const [q, setQ] = useState('');
  const deferred = useDeferredValue(q);
  const molecules = useMolecules(projectId, deferred);
  const searchId = useId();

  return (
    <div className="flex flex-col gap-3">
      <div role="search">
        <label htmlFor={searchId} className="sr-only">Search molecules</label>
        <input id={searchId} type="search" value={q} onChange={(e) => setQ(e.target.value)} placeholder="Search by name, formula or SMILES" className={controlClass} />
      </div>
      {molecules.isPending ? (
        <Loading label="Loading molecules…" />
      ) : molecules.isError ? (
        <ErrorAlert error={molecules.error} />
      ) : molecules.data.length === 0 ? (
        <EmptyState title={deferred ? 'No molecule matches' : 'No molecules yet'} />
      ) : (
        <ul aria-label="Molecules" className="divide-y divide-paper-200">
          {molecules.data.map((m) => (
            <li key={m.id}>
              <Link to={paths.molecule(m.id)} className="flex items-center gap-4 rounded-md py-3 hover:bg-ink-50/60">
                <MoleculeThumbnail sketch={m.sketch} label={m.name} size={72} />
                <div className="min-w-0 flex-1">
                  <p className="font-semibold text-ink-900">{m.name}</p>
                  <p className="text-sm text-ink-700">
                    {m.formula} · {m.molecularWeight.toFixed(2)} g/mol · {plural(m.mappingCount, 'mapping')}
                  </p>
                  <p className="truncate font-mono text-xs text-ink-600" title={m.smiles}>{m.smiles}</p>
                </div>
                {m.archived && <span className="rounded-full bg-paper-200 px-2 py-0.5 text-xs font-semibold text-ink-700">Archived</span>}
              </Link>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
