import { shareAtom } from '../../../shared/mapping-doc';
import type { EditorContext } from '../commands/registry';
import type { BeadView } from '../model/bead-view';

/**
 * The bead's atoms; a shared atom shows its weight here and may be re-weighted. The other beads'
 * weights are scaled so the atom's total stays 1.
 */
export function AtomWeights({ ctx, bead }: { ctx: EditorContext; bead: BeadView }) {
  const shared = bead.atoms.filter((a) => (ctx.view.atomBeads.get(a.index)?.length ?? 0) > 1);
  return (
    <div className="text-sm">
      <p className="text-ink-700">
        {bead.atoms.length} atom{bead.atoms.length === 1 ? '' : 's'}: <span className="font-mono text-xs">{bead.atoms.map((a) => a.index + 1).join(', ')}</span>
      </p>
      {shared.length > 0 && (
        <ul aria-label="Shared atoms" className="mt-2 flex flex-col gap-1">
          {shared.map((a) => {
            const others = (ctx.view.atomBeads.get(a.index) ?? []).filter((id) => id !== bead.id);
            const change = (w: number) => {
              if (!(w > 0 && w < 1)) return;
              const rest = (1 - w) / others.length;
              shareAtom(ctx.doc, a.index, { [bead.id]: w, ...Object.fromEntries(others.map((id) => [id, rest])) }, ctx.origin);
            };
            return (
              <li key={a.index} className="flex items-center gap-2">
                <label htmlFor={`w-${a.index}`} className="text-ink-700">
                  Atom {a.index + 1} weight, shared with {others.map((id) => ctx.view.byId.get(id)?.name ?? id).join(', ')}
                </label>
                <input
                  id={`w-${a.index}`}
                  type="number"
                  min={0.05}
                  max={0.95}
                  step={0.05}
                  disabled={ctx.readOnly}
                  defaultValue={a.weight}
                  key={a.weight}
                  onBlur={(e) => change(Number(e.target.value))}
                  onKeyDown={(e) => e.key === 'Enter' && change(Number(e.currentTarget.value))}
                  className="w-20 rounded-md border border-paper-400 bg-paper-50 px-2 py-0.5 text-sm tabular-nums"
                />
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}
