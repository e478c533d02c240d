import { lazy, Suspense, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { useCan } from '../../../lib/authorization';
import { useCurrentUser } from '../../../lib/auth';
import { isApiError } from '../../../lib/api-client';
import type { AnalysisView, ReferenceView } from '../../../shared/references';
import type { Molecule } from '../../../shared/chem';
import { useAnalyses } from '../api/get-analyses';
import { useStartAnalysis } from '../api/start-analysis';
import { useCancelAnalysis } from '../api/cancel-analysis';
import { ProgressBar } from './progress-bar';

// uPlot and the charts load only when someone opens an analysis.
const AnalysisCharts = lazy(() => import('./analysis-charts'));

interface Props {
  projectId: number;
  /** The molecule's atoms and bonds: where a picked term's beads are drawn. */
  molecule: Pick<Molecule, 'atoms' | 'bonds'>;
  mappings: { id: number; name: string }[];
  references: ReferenceView[];
}

const label = (a: AnalysisView) => `#${a.id} ${a.versionNumber === null ? 'draft' : `v${a.versionNumber}`}, ${a.temperature} K`;

/** Analyses of one mapping: start one, watch its progress, cancel, and look at the distributions. */
export function AnalysesPanel({ projectId, molecule, mappings, references }: Props) {
  const [mappingId, setMappingId] = useState<number | null>(mappings[0]?.id ?? null);
  const analyses = useAnalyses(mappingId);
  const canStart = useCan('analysis:start', projectId);
  const canManage = useCan('analysis:manage', projectId);
  const me = useCurrentUser();
  const ready = references.filter((r) => r.status === 'ready');
  const [shown, setShown] = useState<number[]>([]);
  const toggle = (id: number) => setShown((s) => (s.includes(id) ? s.filter((x) => x !== id) : [...s.slice(-1), id]));

  return (
    <div className="flex flex-col gap-4 text-sm">
      <label className="flex items-center gap-2">
        <span className="font-semibold">Mapping</span>
        <select className="rounded border border-ink-300 px-2 py-1" value={mappingId ?? ''} onChange={(e) => { setMappingId(Number(e.target.value)); setShown([]); }}>
          {mappings.map((m) => <option key={m.id} value={m.id}>{m.name}</option>)}
        </select>
      </label>
      {mappingId !== null && canStart && ready.length > 0 && <StartForm mappingId={mappingId} references={ready} />}
      {analyses.data && analyses.data.length === 0 && <p className="text-ink-600">No analysis of this mapping yet.</p>}
      <ul className="flex flex-col gap-2" aria-label="Analyses">
        {analyses.data?.map((a) => (
          <AnalysisRow key={a.id} a={a} mappingId={mappingId!} shown={shown.includes(a.id)} onToggle={() => toggle(a.id)} canCancel={canManage || (canStart && a.createdBy === me?.id)} referenceName={references.find((r) => r.id === a.referenceId)?.name ?? `reference ${a.referenceId}`} />
        ))}
      </ul>
      {shown.length > 0 && (
        <Suspense fallback={<p className="text-ink-600">Loading the charts…</p>}>
          <AnalysisCharts ids={shown} molecule={molecule} />
        </Suspense>
      )}
    </div>
  );
}

function AnalysisRow({ a, mappingId, shown, onToggle, canCancel, referenceName }: { a: AnalysisView; mappingId: number; shown: boolean; onToggle: () => void; canCancel: boolean; referenceName: string }) {
  const cancel = useCancelAnalysis(mappingId);
  const running = a.status === 'queued' || a.status === 'running';
  return (
    <li className="rounded border border-paper-300 p-2">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <span className="font-semibold text-ink-900">{label(a)} on {referenceName}</span>
        <span className="text-ink-700">{a.status}</span>
      </div>
      {running && <ProgressBar progress={a.progress} label={`Analysis ${a.id}: frames done`} startedAt={a.startedAt} />}
      {a.error && a.status === 'failed' && <p role="alert" className="text-alert-700">{a.error.message}</p>}
      <div className="mt-1 flex flex-wrap gap-2">
        {a.status === 'done' && (
          <>
            <Button size="sm" variant="secondary" aria-pressed={shown} onClick={onToggle}>{shown ? 'Hide distributions' : 'Show distributions'}</Button>
            <a className="underline" href={`/api/analyses/${a.id}/terms.csv`} download>terms.csv</a>
            {(['gro', 'pdb', 'trr'] as const).map((f) => <a key={f} className="underline" href={`/api/analyses/${a.id}/cg-trajectory?format=${f}`} download>CG trajectory (.{f})</a>)}
            <a className="underline" href={`/api/mappings/${a.mappingId}/export?format=ndx&version=${a.versionNumber ?? 'draft'}&reference=${a.referenceId}`} download>index (.ndx)</a>
          </>
        )}
        {canCancel && (
          <Button size="sm" variant={running ? 'danger' : 'ghost'} onClick={() => cancel.mutate(a.id)}>{running ? 'Cancel' : 'Remove'}</Button>
        )}
      </div>
    </li>
  );
}

function StartForm({ mappingId, references }: { mappingId: number; references: ReferenceView[] }) {
  const start = useStartAnalysis(mappingId);
  const [referenceId, setReferenceId] = useState(references[0].id);
  const [version, setVersion] = useState('draft');
  const [temperature, setTemperature] = useState('298.15');
  const [bins, setBins] = useState('100');
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const v = version === 'draft' || version === 'production' ? version : Number(version);
    start.mutate({ referenceId, version: v, temperature: Number(temperature), bins: Number(bins) });
  };
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-3" aria-label="Start an analysis">
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Reference</span>
        <select className="rounded border border-ink-300 px-2 py-1" value={referenceId} onChange={(e) => setReferenceId(Number(e.target.value))}>
          {references.map((r) => <option key={r.id} value={r.id}>{r.name}</option>)}
        </select>
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Version</span>
        <input className="w-28 rounded border border-ink-300 px-2 py-1" value={version} onChange={(e) => setVersion(e.target.value.trim())} aria-describedby="version-hint" />
        <span id="version-hint" className="text-xs text-ink-600">a number, draft or production</span>
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Temperature (K)</span>
        <input className="w-24 rounded border border-ink-300 px-2 py-1" inputMode="decimal" value={temperature} onChange={(e) => setTemperature(e.target.value)} />
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Bins</span>
        <input className="w-20 rounded border border-ink-300 px-2 py-1" inputMode="numeric" value={bins} onChange={(e) => setBins(e.target.value)} />
      </label>
      <Button type="submit" size="sm" disabled={start.isPending}>Start analysis</Button>
      {start.error && <p role="alert" className="w-full text-alert-700">{isApiError(start.error) ? start.error.message : 'The analysis could not start.'}</p>}
    </form>
  );
}
