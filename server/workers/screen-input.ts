import { ChemError, LIMITS } from '../chem/errors';
import type { MoleculeInput } from '../chem/parse';

/**
 * Cheap checks on a structure's text before it reaches openchemlib (whose work cannot be interrupted
 * except by ending its thread): how many atoms it names and how many ring bonds it closes. The limits
 * are far above real molecules — a molecule of a few thousand heavy atoms passes (C60 closes 31 ring
 * bonds, a cyclodextrin 14, a 2,000-atom polystyrene 250) — and refuse only text that would keep a
 * thread busy for nothing. Anything that passes is still bounded by the job time limit (chem-limits.ts).
 */
export const SCREEN_LIMITS = {
  /** Atoms named in a SMILES or declared by a molfile (the core refuses more heavy atoms anyway). */
  atoms: LIMITS.heavyAtoms,
  /** Ring-closure bonds of a SMILES; for a molfile, bonds − atoms + 1 (its ring count when connected). */
  ringBonds: 1000,
} as const;

/** Atoms of a SMILES: bracket atoms, organic-subset symbols (two-letter Cl/Br first) and `*`. */
const SMILES_ATOM = /\[[^\]]*\]|Cl|Br|[BCNOPSFIbcnops*]/g;
/** Ring-bond labels, outside brackets: `%nn` or a single digit (each pair of labels is one bond). */
const RING_LABEL = /%\d\d|\d/g;

export function screenInput(input: MoleculeInput): void {
  if ('smiles' in input && typeof input.smiles === 'string') screenSmiles(input.smiles);
  else if ('molfile' in input && typeof input.molfile === 'string') screenMolfile(input.molfile);
}

function screenSmiles(smiles: string): void {
  const atoms = smiles.match(SMILES_ATOM)?.length ?? 0;
  if (atoms > SCREEN_LIMITS.atoms) refuse(`The SMILES names ${atoms} atoms; the limit is ${SCREEN_LIMITS.atoms}.`, 'atoms', atoms);
  const labels = smiles.replace(/\[[^\]]*\]/g, '').match(RING_LABEL)?.length ?? 0;
  const ringBonds = Math.ceil(labels / 2);
  if (ringBonds > SCREEN_LIMITS.ringBonds) {
    refuse(`The SMILES closes ${ringBonds} ring bonds; the limit is ${SCREEN_LIMITS.ringBonds}.`, 'ringBonds', ringBonds);
  }
}

function screenMolfile(raw: string): void {
  const text = raw.replace(/\r\n?/g, '\n');
  const v3 = /^M {2}V30 COUNTS\s+(\d+)\s+(\d+)/m.exec(text);
  // V2000: fixed columns on line 4, atoms in 1–3 and bonds in 4–6.
  const counts = text.split('\n')[3] ?? '';
  const [atoms, bonds] = v3 ? [Number(v3[1]), Number(v3[2])] : [Number(counts.slice(0, 3)), Number(counts.slice(3, 6))];
  if (!Number.isInteger(atoms) || !Number.isInteger(bonds)) return; // the parser explains a bad counts line
  if (atoms > SCREEN_LIMITS.atoms) refuse(`The molfile declares ${atoms} atoms; the limit is ${SCREEN_LIMITS.atoms}.`, 'atoms', atoms);
  const ringBonds = bonds - atoms + 1;
  if (ringBonds > SCREEN_LIMITS.ringBonds) {
    refuse(`The molfile's ${bonds} bonds between ${atoms} atoms close ${ringBonds} rings; the limit is ${SCREEN_LIMITS.ringBonds}.`, 'ringBonds', ringBonds);
  }
}

function refuse(message: string, what: keyof typeof SCREEN_LIMITS, found: number): never {
  throw new ChemError('input_too_complex', message, { limit: SCREEN_LIMITS[what], found, what });
}
