/**
 * parseMolecule: input → the canonical Molecule (atoms, bonds, formula, weight, SMILES, Wildman–Crippen
 * logP per atom). Parsing and the atom order are openchemlib's (parse.ts, model.ts); masses are ours
 * (masses.ts); typing is RDKit SMARTS matching on a molfile written from the model (crippen.ts).
 */
import { isHeavyAtom, type Atom, type Bond, type Molecule, type MoleculeComponent } from '../../src/shared/chem';
import { typeAtoms } from './crippen';
import { hillFormula } from './formula';
import { componentsOf } from './graph';
import { molecularWeight } from './masses';
import { canonicalSmiles } from './canonical-smiles';
import { buildModel } from './model';
import { layout2d } from './ocl-build';
import { parseInput, type MoleculeInput, type OclMolecule } from './parse';
import { loadRdkit } from './rdkit';

export interface ParseOptions {
  /**
   * The canonical SMILES, computed elsewhere from the same input (canonical-smiles.ts) while this
   * parse lays out and types the atoms; when it fails, it is computed here after all.
   */
  canonicalSmiles?: Promise<string>;
}

export async function parseMolecule(input: MoleculeInput, options: ParseOptions = {}): Promise<Molecule> {
  const rd = await loadRdkit();
  const { mol, source, declared3D, warnings, attachments } = parseInput(input);
  const threeD = source === 'molfile' && (declared3D || hasDepth(mol));
  const model = buildModel(mol, threeD, attachments);
  const { atoms, bonds } = model;
  const molecularWeightValue = molecularWeight(atoms);
  // A SMILES has no coordinates and a 3D molfile's are not a drawing: lay out 2D for those; a 2D
  // molfile keeps its own drawing.
  if (source === 'smiles' || threeD || atoms.every((a) => a.x === 0 && a.y === 0)) {
    layout2d(model).forEach((p, i) => Object.assign(atoms[i], p));
  }
  if (source === 'molfile') {
    if (threeD && !model.coordinates3d) {
      warnings.push('The molfile is 3D but not every hydrogen is given, so its coordinates are not kept; generate a conformer instead.');
    }
  }
  if (model.foldedExplicitH > 0) {
    warnings.push(`${model.foldedExplicitH} explicit hydrogen atom(s) were folded into their heavy atoms.`);
  }
  const components = componentList(atoms, bonds);
  if (components.length > 1) warnings.push(`The structure has ${components.length} disconnected parts (a salt or mixture).`);
  for (const a of atoms) {
    if (a.radical > 0) warnings.push(`Atom ${a.index + 1} (${a.element}) carries ${a.radical} unpaired electron(s).`);
  }
  const typing = typeAtoms(rd, model);
  for (const el of typing.untypedElements) {
    warnings.push(`Wildman–Crippen has no atom type for ${el}; its logP contribution is taken as 0.`);
  }
  const attachmentPoints = atoms.filter((a) => a.attachment).map((a) => a.index);
  const smiles = options.canonicalSmiles ? await options.canonicalSmiles.catch(() => canonicalSmiles(mol)) : canonicalSmiles(mol);
  return {
    atoms,
    bonds,
    formula: hillFormula(atoms),
    molecularWeight: molecularWeightValue,
    netCharge: atoms.reduce((q, a) => q + a.charge, 0),
    canonicalSmiles: smiles,
    logP: typing.logP,
    atomLogP: typing.atomLogP,
    atomTypes: typing.atomTypes,
    coordinates: model.coordinates3d,
    warnings,
    heavyAtoms: atoms.filter(isHeavyAtom).length,
    attachmentPoints,
    repeatUnit: attachmentPoints.length > 0,
    components,
  };
}

/**
 * The disconnected parts. A free ion is a part of one atom (with its hydrogens, so NH4+ and H3O+
 * count) that carries a charge: in a CG model it is a bead of its own and nothing to merge with.
 */
function componentList(atoms: Atom[], bonds: Bond[]): MoleculeComponent[] {
  return componentsOf(atoms.length, bonds).map((members) => {
    const own = members.map((i) => atoms[i]);
    const charge = own.reduce((q, a) => q + a.charge, 0);
    return { atoms: members, formula: hillFormula(own), charge, freeIon: members.length === 1 && charge !== 0 && !own[0].attachment };
  });
}

function hasDepth(mol: OclMolecule): boolean {
  for (let i = 0; i < mol.getAllAtoms(); i++) if (Math.abs(mol.getAtomZ(i)) > 1e-4) return true;
  return false;
}
