import { memo, useMemo } from 'react';
import { BOND, type Drawing } from '../../../shared/drawing/layout';
import { structureMarkup } from '../../../shared/drawing/svg-markup';

// The molecule itself: bonds, aromatic circles, hydrogens, atom labels, charges and attachment
// points, drawn by the app's one renderer (src/shared/drawing/svg-markup.ts, also used by the
// molecule pages and the SVG/PNG exports). It depends only on the drawing, so selections and bead
// edits never repaint it.

export const StructureLayer = memo(function StructureLayer({ drawing }: { drawing: Drawing }) {
  const markup = useMemo(() => ({ __html: structureMarkup(drawing) }), [drawing]);
  return <g aria-hidden="true" pointerEvents="none" data-structure-layer="" dangerouslySetInnerHTML={markup} />;
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
