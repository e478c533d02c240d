import { memo, useMemo } from 'react';
import type { MoleculeSketch } from '../../../shared/molecules';
import { moleculeSvg } from '../../../shared/drawing/svg-markup';
import { sketchToMolecule } from '../../../shared/drawing/sketch';

/**
 * The molecule drawn by the app's one renderer (src/shared/drawing/svg-markup.ts: aromatic rings,
 * charges, attachment points, as in the editor and the exports) from the server's sketch, for the
 * list and the molecule page.
 */
export const MoleculeThumbnail = memo(function MoleculeThumbnail({ sketch, label, size = 96 }: { sketch: MoleculeSketch; label: string; size?: number }) {
  const markup = useMemo(() => ({ __html: moleculeSvg(sketchToMolecule(sketch), { width: size, height: size, attributes: { 'aria-hidden': 'true', class: 'block size-full' } }) }), [sketch, size]);
  return (
    <span
      role="img"
      aria-label={`Structure of ${label}`}
      data-molecule-drawing=""
      style={{ width: size, height: size }}
      className="block shrink-0 overflow-hidden rounded-md border border-paper-300 bg-paper-50"
      dangerouslySetInnerHTML={markup}
    />
  );
});
