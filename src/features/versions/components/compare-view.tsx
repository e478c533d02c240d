import { ErrorAlert } from '../../../components/ui/alert';
import { Loading } from '../../../components/ui/loading';
import { useCompare, type StateRef } from '../api/get-compare';
import { VersionPicture } from './version-picture';

const label = (r: StateRef) => (r === 'draft' ? 'Draft' : `Version ${r}`);
const beads = (m: Record<string, number>, names: Map<string, string>) => Object.keys(m).map((id) => names.get(id) ?? id).join(' + ') || 'no bead';
const signed = (v: number | null, digits: number) => (v === null ? '–' : `${v > 0 ? '+' : ''}${v.toFixed(digits)}`);

/** Two states side by side, moved atoms ringed on both pictures, and what changed bead by bead. */
export function CompareView({ mappingId, from, to, names }: { mappingId: number; from: StateRef; to: StateRef; names: Map<string, string> }) {
  const c = useCompare(mappingId, from, to);
  if (c.isError) return <ErrorAlert error={c.error} />;
  if (!c.data) return <Loading label="Comparing…" />;
  const moved = c.data.moved.map((m) => m.atom + 1);
  const nothing = !moved.length && !c.data.added.length && !c.data.removed.length && !c.data.renamed.length && !c.data.retyped.length && !c.data.recentred.length;
  return (
    <div className="flex flex-col gap-3" aria-label={`Compare ${label(from)} with ${label(to)}`} role="region">
      <div className="grid gap-3 md:grid-cols-2">
        {[from, to].map((s) => (
          <figure key={String(s)}>
            <VersionPicture mappingId={mappingId} state={s} highlight={moved} alt={`${label(s)}, moved atoms ringed`} />
            <figcaption className="mt-1 text-sm font-semibold text-ink-800">{label(s)}</figcaption>
          </figure>
        ))}
      </div>
      {nothing && <p className="text-sm text-ink-700">No beads or atoms differ.</p>}
      <ul className="flex flex-col gap-1 text-sm text-ink-800" aria-label="Changes">
        {c.data.moved.map((m) => (
          <li key={`m${m.atom}`} data-moved-atom={m.atom + 1}>
            Atom {m.atom + 1} moved: {beads(m.from, names)} → {beads(m.to, names)}
          </li>
        ))}
        {c.data.added.map((b) => <li key={`a${b.id}`}>Bead {b.name} added</li>)}
        {c.data.removed.map((b) => <li key={`r${b.id}`}>Bead {b.name} removed</li>)}
        {c.data.renamed.map((b) => <li key={`n${b.id}`}>Bead {b.from} renamed {b.to}</li>)}
        {c.data.retyped.map((b) => <li key={`t${b.id}`}>Bead {b.name}: type {b.from ?? 'none'} → {b.to ?? 'none'}</li>)}
        {c.data.recentred.map((b) => <li key={`c${b.id}`}>Bead {b.name}: centre {b.from} → {b.to}</li>)}
      </ul>
      {c.data.deltas.some((d) => d.mass) && (
        <table className="text-sm">
          <caption className="text-left font-semibold text-ink-800">Property changes ({label(to)} − {label(from)})</caption>
          <thead>
            <tr className="text-left text-ink-600"><th scope="col">Bead</th><th scope="col">Mass (g/mol)</th><th scope="col">logP</th><th scope="col">ΔG_OW (kJ/mol)</th></tr>
          </thead>
          <tbody>
            {c.data.deltas.filter((d) => d.mass).map((d) => (
              <tr key={d.id}><th scope="row" className="text-left">{d.name}</th><td>{signed(d.mass, 2)}</td><td>{signed(d.logP, 2)}</td><td>{signed(d.deltaG, 1)}</td></tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
