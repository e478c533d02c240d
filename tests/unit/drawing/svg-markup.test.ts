import { beforeAll, describe, expect, it } from 'vitest';
import type { Molecule } from '../../../src/shared/chem';
import { parseMolecule } from '../../../server/chem';
import { BOND, layoutMolecule } from '../../../src/shared/drawing/layout';
import { moleculeSvg } from '../../../src/shared/drawing/svg-markup';
import { placeBeadTags, TAG_HEIGHT } from '../../../src/shared/drawing/bead-labels';
import { sketchOf } from '../../../server/molecules/molecule-view';
import { sketchToMolecule } from '../../../src/shared/drawing/sketch';

// The one renderer (src/shared/drawing/svg-markup.ts): what issue 13 found missing on the molecule
// page and in the exports — aromatic rings, charges, attachment points — and tags off atom symbols.

let dye: Molecule;
beforeAll(async () => {
  // A disulfonated azo dye with two Na+ (our own example molecule).
  dye = await parseMolecule({ smiles: 'Nc1ccc(cc1)N=Nc1ccc(cc1S(=O)(=O)[O-])S(=O)(=O)[O-].[Na+].[Na+]' });
}, 60_000); // the first parse loads RDKit's WebAssembly

describe('molecule pictures', () => {
  it('draw aromatic rings as rings with a circle and every formal charge', () => {
    const svg = moleculeSvg(dye);
    expect(svg.match(/<circle /g)).toHaveLength(2);
    const charges = [...svg.matchAll(/data-charge="(\d+)">([^<]+)</g)].map((m) => [dye.atoms[Number(m[1]) - 1].element, m[2]]);
    expect(charges.sort()).toEqual([['Na', '+'], ['Na', '+'], ['O', '−'], ['O', '−']]);
    expect(svg).toContain('NH<tspan baseline-shift="sub" font-size="75%">2</tspan>');
  });

  it('draw the same from the list sketch as from the full model (coordinates rounded to 0.01 bond)', () => {
    const shape = (svg: string) => svg.replace(/-?\d+(\.\d+)?/g, '#');
    expect(shape(moleculeSvg(sketchToMolecule(sketchOf(dye))))).toBe(shape(moleculeSvg(dye)));
  });

  it('mark attachment points instead of drawing an element', () => {
    const unit: Pick<Molecule, 'atoms' | 'bonds'> = {
      atoms: [
        { ...dye.atoms[1], index: 0, element: '*', charge: 0, hydrogens: 0, x: 0, y: 0 },
        { ...dye.atoms[1], index: 1, element: 'C', charge: 0, hydrogens: 2, aromatic: false, x: 1, y: 0 },
        { ...dye.atoms[1], index: 2, element: '*', charge: 0, hydrogens: 0, x: 1.5, y: 0.87 },
      ],
      bonds: [{ a: 0, b: 1, order: 1, aromatic: false }, { a: 1, b: 2, order: 1, aromatic: false }],
    };
    const svg = moleculeSvg(unit);
    // Each attachment point is a wavy mark (a path of three quadratic half-waves) and no `*` text.
    const marks = [...svg.matchAll(/<path d="([^"]+)"[^>]*data-attachment="(\d+)"/g)];
    expect(marks.map((m) => m[2])).toEqual(['1', '3']);
    for (const [, d] of marks) expect(d).toMatch(/^M[-\d. ]+(Q[-\d. ]+){3}$/);
    expect(svg).not.toContain('*');
    // The mark is square to its bond and centred on the point: atom 1 sits at (0, 0) with its bond
    // along x, so the wave runs along y from −0.3 to +0.3 bond lengths (attachment-mark.ts).
    const ends = /^M(-?[\d.]+) (-?[\d.]+).*?(-?[\d.]+) (-?[\d.]+)$/.exec(marks[0][1])!.slice(1).map(Number);
    expect(ends).toEqual([0, BOND * 0.3, 0, -BOND * 0.3]);
    // The bond runs right up to the attachment point (no gap as for a symbol).
    expect(svg).toContain(`<line x1="0" y1="0" x2="${BOND}" y2="0"/>`);
  });

  it('mark the attachment points of a parsed repeat unit (*CC(*)c1ccccc1) the same way', async () => {
    const unit = await parseMolecule({ smiles: '*CC(*)c1ccccc1' });
    const svg = moleculeSvg(unit);
    expect(svg.match(/<path [^>]*data-attachment=/g)).toHaveLength(2);
    expect(svg).not.toContain('*');
  });

  it('place bead tags off atom symbols', () => {
    const d = layoutMolecule(dye, false);
    const sulfonate = dye.atoms.filter((a) => a.element === 'S' || a.element === 'O').map((a) => ({ index: a.index }));
    const beads = [{ name: 'SO3', atoms: sulfonate }, { name: 'Na', atoms: dye.atoms.filter((a) => a.element === 'Na').map((a) => ({ index: a.index })) }];
    const tags = placeBeadTags(beads, d.atoms, (i) => d.atoms[i].label !== null, BOND * 0.42);
    for (const [k, tag] of tags.entries()) {
      expect(tag).not.toBeNull();
      for (const a of d.atoms) {
        if (!a.label) continue;
        // No symbol's centre inside a tag (with half a symbol's size to spare).
        const inside = Math.abs(a.x - tag!.x) < tag!.width / 2 + BOND * 0.15 && Math.abs(a.y - tag!.y) < TAG_HEIGHT / 2 + BOND * 0.15;
        expect(inside, `${beads[k].name} tag over atom ${a.index + 1} (${a.label})`).toBe(false);
      }
    }
  });
});
