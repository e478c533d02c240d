import { memo } from 'react';
import type { MappingView } from '../model/bead-view';
import { BOND, type Drawing } from '../../../shared/drawing/layout';

/**
 * Atom numbers on the drawing, counted from 1 as every export and message counts them, set beside
 * the atom (below right), small and haloed so they never hide an element symbol.
 */
export const AtomNumbers = memo(function AtomNumbers({ drawing }: { drawing: Drawing }) {
  return (
    <g aria-hidden="true" pointerEvents="none" fontSize={BOND * 0.26} fontWeight={600} className="fill-ink-600 stroke-paper-50" strokeWidth={3} paintOrder="stroke" strokeLinejoin="round">
      {drawing.atoms.map((a) => (
        <text key={a.index} x={a.x + BOND * 0.2} y={a.y + BOND * 0.36} data-atom-number={a.index + 1}>
          {a.index + 1}
        </text>
      ))}
    </g>
  );
});

/**
 * Every atom as a disc in its bead's colour, so in fused rings, where hulls overlap, each atom says
 * which bead it is in; a shared atom is split into its beads' colours (one sector each).
 */
export const AtomColours = memo(function AtomColours({ drawing, view }: { drawing: Drawing; view: MappingView }) {
  const r = BOND * 0.3;
  return (
    <g aria-hidden="true" pointerEvents="none" fillOpacity={0.85}>
      {drawing.atoms.map((a) => {
        const colours = (view.atomBeads.get(a.index) ?? []).map((id) => view.byId.get(id)?.colour).filter((c): c is string => !!c);
        if (!colours.length) return null;
        if (colours.length === 1) return <circle key={a.index} cx={a.x} cy={a.y} r={r} fill={colours[0]} data-atom-colour={a.index + 1} />;
        return (
          <g key={a.index} data-atom-colour={a.index + 1}>
            {colours.map((c, k) => <path key={k} d={sector(a.x, a.y, r, (2 * Math.PI * k) / colours.length, (2 * Math.PI * (k + 1)) / colours.length)} fill={c} />)}
          </g>
        );
      })}
    </g>
  );
});

function sector(x: number, y: number, r: number, from: number, to: number): string {
  const p = (t: number) => `${x + r * Math.cos(t - Math.PI / 2)} ${y + r * Math.sin(t - Math.PI / 2)}`;
  return `M${x} ${y} L${p(from)} A${r} ${r} 0 ${to - from > Math.PI ? 1 : 0} 1 ${p(to)} Z`;
}
