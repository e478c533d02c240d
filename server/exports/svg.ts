import type { ExportSource } from './export-source';
import { stateLabel } from './export-source';
import { moleculeSvg, type PictureBead } from '../../src/shared/drawing/svg-markup';
import { assignBeadColours, atomBeadsOf, beadLinks } from '../../src/shared/drawing/palette';

// The mapping picture as standalone SVG, drawn by the app's one molecule renderer
// (src/shared/drawing/svg-markup.ts) from the molecule's 2D layout: the same hulls, bead colours
// (neighbour-aware, as the editor picks them), structure, charges, aromatic rings and tag placement
// as the editor. Optional highlighted atoms get a ring (the compare screen's "moved atoms").
// <title>, <desc> and <metadata> carry the mapping, version and SHA-256.

export interface SvgOptions {
  /** 0-based atom indices to ring. */
  highlight?: readonly number[];
}

/** The beads of an export with the colours the editor gives them. */
export function pictureBeads(s: ExportSource): PictureBead[] {
  const beads = s.draft.beads;
  const colours = assignBeadColours(beads.map((b) => b.id), beadLinks(atomBeadsOf(beads), s.model.bonds));
  return beads.map((b) => ({ id: b.id, name: b.name, atoms: b.atoms, colour: colours.get(b.id)! }));
}

export function toSvg(s: ExportSource, opts: SvgOptions = {}): string {
  return moleculeSvg(s.model, {
    beads: pictureBeads(s),
    highlight: opts.highlight,
    background: true,
    title: `${s.mappingName} · ${stateLabel(s)}${s.production ? ' (production)' : ''}`,
    desc: `Beadloom mapping picture of ${s.moleculeName}; sha256 ${s.sha256}`,
    metadata: { mapping: s.mappingName, version: s.version, production: s.production, sha256: s.sha256 },
    attributes: { role: 'img' },
  });
}
