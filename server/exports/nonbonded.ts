import type { CgModel } from './cg-model';

// Non-bonded parameters per bead type for the engine exports. Beadloom ships no published force
// field's numbers: a type whose library row carries σ and ε gets those; any other type gets the
// clearly marked placeholder below, and every file says so at its top. The placeholder is a soft
// Lennard-Jones sphere chosen only so the files are complete and a short test run is stable; it is not
// a parameter of any force field and must be replaced before production work.

export const PLACEHOLDER_SIGMA_NM = 0.5;
export const PLACEHOLDER_EPSILON_KJ = 2.0;

export interface NonbondedType {
  /** The engine's name for the type: letters, digits, _ + - only, unique. */
  engineName: string;
  /** The bead type as the mapping names it. */
  beadType: string;
  sigma: number;
  epsilon: number;
  placeholder: boolean;
}

export type LibraryNonbonded = ReadonlyMap<string, { sigma: number | null; epsilon: number | null }>;

/** One entry per bead type the model uses, in first-use order. */
export function nonbondedTypes(model: CgModel, library: LibraryNonbonded): NonbondedType[] {
  const out: NonbondedType[] = [];
  const used = new Set<string>();
  for (const t of model.types) {
    for (const b of t.beads) {
      if (out.some((x) => x.beadType === b.type)) continue;
      let engineName = b.type.replace(/[^A-Za-z0-9_+-]/g, '_').slice(0, 20) || 'T';
      for (let n = 2; used.has(engineName); n++) engineName = `${engineName.slice(0, 17)}_${n}`;
      used.add(engineName);
      const row = library.get(b.type);
      const known = row && row.sigma !== null && row.epsilon !== null;
      out.push({ engineName, beadType: b.type, sigma: known ? row.sigma! : PLACEHOLDER_SIGMA_NM, epsilon: known ? row.epsilon! : PLACEHOLDER_EPSILON_KJ, placeholder: !known });
    }
  }
  return out;
}

/** The header lines every engine file carries about non-bonded parameters. */
export function placeholderNote(types: readonly NonbondedType[]): string[] {
  const placeholders = types.filter((t) => t.placeholder);
  if (placeholders.length === 0) return ['Non-bonded sigma and epsilon: from the project bead-type library for every type.'];
  return [
    `PLACEHOLDER non-bonded parameters for ${placeholders.map((t) => t.engineName).join(', ')}: sigma = ${PLACEHOLDER_SIGMA_NM} nm, epsilon = ${PLACEHOLDER_EPSILON_KJ} kJ/mol.`,
    'These are NOT force-field values (Beadloom ships no published force field\'s numbers); they only make the file complete.',
    'Replace them with your force field\'s parameters, or set sigma/epsilon in the project\'s bead-type library.',
  ];
}
