import { useMemo } from 'react';
import { BOND, layoutMolecule } from '../../../shared/drawing/layout';
import { assignBeadColours, atomBeadsOf, beadLinks } from '../../../shared/drawing/palette';
import { sketchToMolecule } from '../../../shared/drawing/sketch';
import { moleculeSvg, type PictureBead } from '../../../shared/drawing/svg-markup';
import type { PlacedBead } from '../../../shared/exports';
import type { MoleculeSketch } from '../../../shared/molecules';

const r = (v: number) => String(Math.round(v * 10) / 10);

/**
 * Where an import would put its beads, drawn by the app's one renderer (src/shared/drawing:
 * aromatic rings, charges, the editor's bead colours and tag placement), so the preview looks like
 * the editor will. Over it, one transparent mark per atom carries its number from 1 (hover title,
 * as in the file) and the colour of the bead that takes it.
 */
export function ImportPreviewPicture({ sketch, beads, label }: { sketch: MoleculeSketch; beads: readonly PlacedBead[]; label: string }) {
  const markup = useMemo(() => {
    const molecule = sketchToMolecule(sketch);
    const placed = beads.map((b) => ({ id: b.id, name: b.name, atoms: b.atoms.map(([n]) => ({ index: n - 1 })) }));
    const colours = assignBeadColours(placed.map((b) => b.id), beadLinks(atomBeadsOf(placed), molecule.bonds));
    const pictureBeads: PictureBead[] = placed.map((b) => ({ ...b, colour: colours.get(b.id)! }));
    const colourOf = new Map<number, string>();
    for (const b of pictureBeads) for (const a of b.atoms) if (!colourOf.has(a.index)) colourOf.set(a.index, b.colour);
    const marks = layoutMolecule(molecule, false).atoms.map((a) => {
      const colour = colourOf.get(a.index) ?? 'none';
      return `<circle cx="${r(a.x)}" cy="${r(a.y)}" r="${r(BOND * 0.3)}" fill="transparent" data-preview-atom="${a.index + 1}" data-bead-colour="${colour}"><title>${a.element} ${a.index + 1}</title></circle>`;
    });
    const svg = moleculeSvg(molecule, { beads: pictureBeads, attributes: { 'aria-hidden': 'true', class: 'block size-full' } });
    return { __html: svg.replace(/<\/svg>\s*$/, `<g>${marks.join('')}</g></svg>`) };
  }, [sketch, beads]);
  return <div role="img" aria-label={label} className="h-64 w-full overflow-hidden rounded-md border border-paper-300 bg-paper-50 p-1" dangerouslySetInnerHTML={markup} />;
}
