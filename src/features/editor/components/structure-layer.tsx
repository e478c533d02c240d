import { memo } from 'react';
import { BOND, type Drawing } from '../model/layout';

// The molecule itself: bonds, aromatic circles, hydrogens and atom labels. It depends only on
// the drawing, so selections and bead edits never repaint it.

export const StructureLayer = memo(function StructureLayer({ drawing }: { drawing: Drawing }) {
  return (
    <g aria-hidden="true" pointerEvents="none">
      <g className="stroke-ink-900" strokeWidth={2} strokeLinecap="round">
        {drawing.lines.map((l, i) => (
          <line key={i} x1={l.x1} y1={l.y1} x2={l.x2} y2={l.y2} />
        ))}
        {drawing.hydrogens.map((h, i) => (
          <line key={`h${i}`} x1={h.from.x} y1={h.from.y} x2={h.x - (h.x - h.from.x) * 0.3} y2={h.y - (h.y - h.from.y) * 0.3} className="stroke-ink-400" strokeWidth={1.4} />
        ))}
      </g>
      <g fill="none" className="stroke-ink-900" strokeWidth={1.6}>
        {drawing.aromaticRings.map((r, i) => (
          <circle key={i} cx={r.x} cy={r.y} r={r.r} />
        ))}
      </g>
      <g className="fill-ink-400" fontSize={BOND * 0.3} textAnchor="middle" dominantBaseline="central">
        {drawing.hydrogens.map((h, i) => (
          <text key={i} x={h.x} y={h.y}>H</text>
        ))}
      </g>
      <g fontSize={BOND * 0.42} fontWeight={600} textAnchor="middle" dominantBaseline="central">
        {drawing.atoms.map((a) =>
          a.label || a.charge ? (
            <g key={a.index}>
              {a.label && (
                <text x={a.x} y={a.y} className="fill-ink-900 stroke-paper-50" strokeWidth={5} paintOrder="stroke" strokeLinejoin="round">
                  {a.label}
                </text>
              )}
              {a.charge && (
                <text x={a.x + BOND * 0.34} y={a.y - BOND * 0.3} fontSize={BOND * 0.3} className="fill-ink-900 stroke-paper-50" strokeWidth={4} paintOrder="stroke">
                  {a.charge}
                </text>
              )}
            </g>
          ) : null,
        )}
      </g>
    </g>
  );
});

/**
 * Invisible click targets, one per heavy atom; clicks are read from `data-atom` by the canvas. They
 * have no fill at all (pointer-events="all" still hit-tests their area), so the browser paints
 * nothing for them: with a transparent fill it would record two thousand empty discs every frame.
 */
export const AtomTargets = memo(function AtomTargets({ drawing }: { drawing: Drawing }) {
  return (
    <g fill="none" pointerEvents="all">
      {drawing.atoms.map((a) => (
        <circle key={a.index} data-atom={a.index} cx={a.x} cy={a.y} r={BOND * 0.38} className="cursor-pointer" />
      ))}
    </g>
  );
});
