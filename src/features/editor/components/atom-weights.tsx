import { shareAtom } from '../../../shared/mapping-doc';
import type { EditorContext } from '../commands/registry';
import type { BeadView } from '../model/bead-view';
import { WeightInput } from './weight-input';

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
              const rest = (1 - w) / others.length;
              shareAtom(ctx.doc, a.index, { [bead.id]: w, ...Object.fromEntries(others.map((id) => [id, rest])) }, ctx.origin);
            };
            return (
              <li key={a.index}>
                <WeightInput
                  label={`Atom ${a.index + 1} weight, shared with ${others.map((id) => ctx.view.byId.get(id)?.name ?? id).join(', ')}`}
                  weight={a.weight}
                  disabled={ctx.readOnly}
                  onChange={change}
                />
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}
