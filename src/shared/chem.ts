/**
 * The chemistry core's data, as plain types shared by server and client.
 *
 * Atom-index contract (see docs/chemistry.md): `Molecule.atoms` lists every non-hydrogen atom in the
 * order openchemlib gives after parsing (not necessarily the order of the input string). Hydrogens are
 * not atoms of their own: each belongs to its heavy atom (`hydrogens`, with isotope labels in
 * `hydrogenIsotopes`). Anything that lists per-atom 3D data (coordinates) lists the heavy atoms first, in
 * index order, then each heavy atom's hydrogens, grouped by parent in parent order, unlabelled ones first.
 */

import type { BondedParams } from './bonded-terms';

export type CentreRule = 'mass' | 'geometry' | 'geometry-heavy';
export type Resolution = '4:1' | '3:1' | '2:1';
/** Size class of a bead: the heavy atoms a bead of that class stands for (common practice, no source). */
export type SizeClass = 4 | 3 | 2;
/** Which estimate bead type suggestions use when a bead has no measured value (per mapping). */
export type PartitionBasis = 'fragment' | 'atoms';
/** Where a bead's partition value comes from: a measured value, one of the estimates, or none (ionic). */
export type PartitionSource = 'measured' | 'fragment' | 'atoms' | 'ionic';
export type Severity = 'error' | 'warning' | 'info';
export type Vec3 = [number, number, number];

export interface Atom {
  index: number;
  /** Element symbol, or '*' for an attachment point (then `attachment` is true). */
  element: string;
  /**
   * An attachment point of a repeat unit or end group (`*` in the SMILES): where the next unit joins.
   * Massless, no hydrogens, not a heavy atom; drawn as an attachment mark. Absent on other atoms.
   */
  attachment?: true;
  /** Mass number when the atom is isotope-labelled ([13C]), else null. */
  isotope: number | null;
  charge: number;
  /** openchemlib's aromaticity (for drawing); typing uses RDKit's perception, see docs/chemistry.md. */
  aromatic: boolean;
  /** All hydrogens on this atom, labelled ones included. */
  hydrogens: number;
  /** Mass numbers of the labelled hydrogens among `hydrogens` (e.g. [2, 2, 2] for CD3). */
  hydrogenIsotopes: number[];
  radical: number;
  x: number;
  y: number;
}

export interface Bond {
  a: number;
  b: number;
  /** Kekulé order (1, 2, 3); 0 for a metal/dative link. */
  order: number;
  aromatic: boolean;
}

export interface Molecule {
  atoms: Atom[];
  bonds: Bond[];
  formula: string;
  molecularWeight: number;
  netCharge: number;
  canonicalSmiles: string;
  logP: number;
  /** Wildman–Crippen contribution per heavy atom, its hydrogens' contributions included. */
  atomLogP: number[];
  /** Wildman–Crippen type label per heavy atom (e.g. 'C18'), '' when no type applies. */
  atomTypes: string[];
  /** 3D coordinates (Å) in the contract's order when the input was a 3D molfile with every hydrogen. */
  coordinates: number[][] | null;
  warnings: string[];
  /** Atoms other than hydrogens and attachment points (models stored before this field: atoms.length). */
  heavyAtoms?: number;
  /** Indices of the attachment points (`*`), in index order. */
  attachmentPoints?: number[];
  /** True when the molecule has attachment points: it is a repeat unit (or an end group) of a polymer. */
  repeatUnit?: boolean;
  /** The disconnected parts (a salt's ions, a mixture's molecules), in order of their first atom. */
  components?: MoleculeComponent[];
}

export interface MoleculeComponent {
  atoms: number[];
  formula: string;
  charge: number;
  /** A single-atom ion (Na+, Cl-, Ca2+ …): its own bead, no size check, no merge advice. */
  freeIon: boolean;
}

/** Whether an atom counts as a heavy atom (not a hydrogen, not an attachment point). */
export function isHeavyAtom(atom: Pick<Atom, 'element'>): boolean {
  return atom.element !== 'H' && atom.element !== '*';
}

export interface MappingAtom {
  index: number;
  weight: number;
}

/**
 * A measured or literature partition value a modeller entered for a bead, with its source. A logP is
 * a 298.15 K quantity; a ΔG (kJ/mol) is read as ΔG_OW at 298.15 K and turned into logP the same way.
 */
export interface MeasuredPartition {
  kind: 'logP' | 'deltaG';
  value: number;
  source: string;
}

export interface MappingBead {
  id: string;
  name: string;
  type?: string;
  centre: CentreRule;
  atoms: MappingAtom[];
  measured?: MeasuredPartition;
}

export interface Mapping {
  beads: MappingBead[];
  /** Basis of type suggestions for beads without a measured value; 'fragment' when absent. */
  partitionBasis?: PartitionBasis;
  /** Bonded terms by term key (src/shared/bonded-terms.ts); absent when none is set. */
  bonded?: Record<string, BondedParams>;
  /** Non-bonded exclusion count (GROMACS nrexcl); absent when not set. */
  exclusions?: number;
  /** The molecule's residue name in PDB, GRO and ITP exports (RESIDUE_NAME in mapping-doc.ts); absent when not set. */
  residue?: string;
}

export interface BeadType {
  name: string;
  /** Heavy atoms per bead of this type (4, 3 or 2). */
  heavyAtomsPerBead: SizeClass;
  charge: number;
  /** kJ/mol, ΔG_OW range (positive = prefers octanol). */
  deltaGMin: number;
  deltaGMax: number;
}

export interface EvaluateOptions {
  temperature?: number;
  coordinates?: number[][];
  resolution?: Resolution;
  library?: BeadType[];
  /** Type each bead's fragment afresh (needs RDKit loaded); default true. */
  fragments?: boolean;
}

export interface BeadEvaluation {
  id: string;
  name: string;
  mass: number;
  heavyAtoms: number;
  /** Σ weight × formal charge, exact (rounded to 1e-9 only to drop floating-point noise). */
  charge: number;
  /** Net charge not zero: no partition value applies ("n/a (ionic)"); the type comes from charge and size. */
  ionic: boolean;
  /** Σ weighted atom contributions (Wildman–Crippen); null for an ionic bead. */
  logP: number | null;
  /** The same sum for an ionic bead, kept for reference only: it is not a partition value. Null otherwise. */
  additiveLogPIonic: number | null;
  /** The bead cut out and capped (fragments.ts); null for an ionic bead or when not computed. */
  fragmentLogP: number | null;
  /** kJ/mol from `logP`. */
  deltaG: number | null;
  /** kJ/mol from `fragmentLogP`. */
  fragmentDeltaG: number | null;
  /** The modeller's measured or literature value, as logP at 298.15 K and as ΔG at the evaluation temperature. */
  measuredLogP: number | null;
  measuredDeltaG: number | null;
  measuredSource: string | null;
  /** The value suggestions and exports use: measured, else the mapping's basis, else the other estimate. */
  partitionSource: PartitionSource | null;
  partitionLogP: number | null;
  partitionDeltaG: number | null;
  /** Heavy atoms per bead of the bead's size class (4, 3, 2), from its weighted heavy-atom count. */
  sizeClass: SizeClass | null;
  suggestedType: string | null;
  /** Whether the suggested type's ΔG range holds the bead's ΔG (false: nearest type). */
  suggestedTypeFits: boolean | null;
  centre: Vec3 | null;
}

export interface Topology {
  bonds: [string, string][];
  angles: [string, string, string][];
  dihedrals: [string, string, string, string][];
  rings: string[][];
}

export interface Check {
  code: string;
  severity: Severity;
  message: string;
  atoms: number[];
  beads: string[];
  hint: string;
}

export interface Evaluation {
  /** K. logP is a 298.15 K quantity; ΔG at another temperature scales it linearly (ΔG = ln10·R·T·logP). */
  temperature: number;
  resolution: Resolution;
  partitionBasis: PartitionBasis;
  beads: BeadEvaluation[];
  topology: Topology;
  checks: Check[];
  warnings: string[];
}
