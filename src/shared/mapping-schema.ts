/**
 * zod schemas for the chemistry endpoints' inputs, shared by client and server:
 * POST /api/chem/molecule ({ smiles } or { molfile }) and POST /api/chem/evaluate
 * ({ smiles | molfile, mapping, options }). Shapes match src/shared/chem.ts; the chemistry core
 * re-checks what only it can know (atom indices against the molecule, valences …).
 */
import { z } from 'zod';
import { refineSmilesCharacters } from './smiles-text';
import { beadTypeRow } from './bead-types';
import { BEAD_ID_MAX, BEAD_NAME_MAX, BEAD_TYPE_MAX, RESIDUE_NAME } from './mapping-doc';
import { MEASURED_LIMITS, MEASURED_SOURCE_MAX, PARTITION_BASES } from './partition-input';

export const SMILES_MAX = 5000;
export const MOLFILE_MAX = 5_000_000;
export const BEADS_MAX = 5000;
export const COORDINATES_MAX = 30_000;

export const centreRuleSchema = z.enum(['mass', 'geometry', 'geometry-heavy'], 'The centre rule is mass, geometry or geometry-heavy.');
export const resolutionSchema = z.enum(['4:1', '3:1', '2:1'], 'The resolution is 4:1, 3:1 or 2:1.');

export const mappingAtomSchema = z.strictObject({
  index: z.number('An atom index is a number.').int('An atom index is a whole number.').min(0, 'An atom index is 0 or more.'),
  weight: z
    .number('A weight is a number.')
    .gt(0, 'A weight must be above 0.')
    .max(1, 'A weight must be at most 1.')
    .default(1),
});

/** A measured or literature partition value with its source (the draft's limits, mapping-doc.ts). */
export const measuredSchema = z
  .strictObject({
    kind: z.enum(['logP', 'deltaG'], 'A measured value is a logP or a deltaG (kJ/mol).'),
    value: z.number('A measured value is a number.').finite(),
    source: z.string().trim().min(1, 'Give the source of the measured value.').max(MEASURED_SOURCE_MAX, `A source has at most ${MEASURED_SOURCE_MAX} characters.`),
  })
  .refine((m) => Math.abs(m.value) <= MEASURED_LIMITS[m.kind], { message: `A measured logP lies within ±${MEASURED_LIMITS.logP}, a ΔG within ±${MEASURED_LIMITS.deltaG} kJ/mol.`, path: ['value'] });

export const partitionBasisSchema = z.enum(PARTITION_BASES as ['fragment', 'atoms'], 'The partition basis is fragment or atoms.');

export const mappingBeadSchema = z.strictObject({
  id: z.string().min(1, 'A bead needs an id.').max(BEAD_ID_MAX, `A bead id has at most ${BEAD_ID_MAX} characters.`),
  name: z.string().max(BEAD_NAME_MAX, `A bead name has at most ${BEAD_NAME_MAX} characters.`),
  type: z.string().max(BEAD_TYPE_MAX, `A bead type has at most ${BEAD_TYPE_MAX} characters.`).optional(),
  centre: centreRuleSchema,
  atoms: z.array(mappingAtomSchema).max(BEADS_MAX, `A bead holds at most ${BEADS_MAX} atoms.`),
  measured: measuredSchema.optional(),
});

export const mappingSchema = z
  .strictObject({
    beads: z.array(mappingBeadSchema).max(BEADS_MAX, `A mapping has at most ${BEADS_MAX} beads.`),
    partitionBasis: partitionBasisSchema.optional(),
    // Bonded terms are not evaluated by the chemistry core beyond the missing-value check; a caller may send them.
    bonded: z.record(z.string(), z.any()).optional(),
    exclusions: z.number().int().min(0).max(6).optional(),
    residue: z.string().regex(RESIDUE_NAME, 'The residue name is 1 to 3 upper-case letters or digits.').optional(),
  })
  .refine((m) => new Set(m.beads.map((b) => b.id)).size === m.beads.length, { message: 'Bead ids must be unique.', path: ['beads'] });

const point = z.tuple([z.number().finite(), z.number().finite(), z.number().finite()], 'A coordinate is [x, y, z] in Å.');

export const evaluateOptionsSchema = z.strictObject({
  temperature: z.number('The temperature is a number (K).').gt(0, 'The temperature must be above 0 K.').max(2000, 'The temperature is at most 2000 K.').optional(),
  coordinates: z.array(point).max(COORDINATES_MAX, `At most ${COORDINATES_MAX} coordinates.`).optional(),
  resolution: resolutionSchema.optional(),
  library: z.array(beadTypeRow).max(500, 'A bead type library holds at most 500 types.').optional(),
  fragments: z.boolean().optional(),
});

const smiles = z.string('SMILES is text.').trim().min(1, 'The SMILES string is empty.').max(SMILES_MAX, `A SMILES string has at most ${SMILES_MAX} characters.`).superRefine(refineSmilesCharacters);
const molfile = z.string('A molfile is text.').min(1, 'The molfile is empty.').max(MOLFILE_MAX, `A molfile has at most ${MOLFILE_MAX} characters.`);

export const moleculeBodySchema = z.union([z.strictObject({ smiles }), z.strictObject({ molfile })], 'Send either { smiles } or { molfile }.');

export const evaluateBodySchema = z.union(
  [
    z.strictObject({ smiles, mapping: mappingSchema, options: evaluateOptionsSchema.optional() }),
    z.strictObject({ molfile, mapping: mappingSchema, options: evaluateOptionsSchema.optional() }),
  ],
  'Send { smiles | molfile, mapping, options }.',
);

export type MoleculeBody = z.infer<typeof moleculeBodySchema>;
export type EvaluateBody = z.infer<typeof evaluateBodySchema>;
export type EvaluateOptionsInput = z.infer<typeof evaluateOptionsSchema>;
