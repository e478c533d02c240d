import { z } from 'zod';
import type { CentreRule, Mapping, MeasuredPartition, PartitionBasis } from './chem';
import { measuredSchema, partitionBasisSchema } from './mapping-schema';
import { BEAD_ID_MAX, BEAD_NAME_MAX, BEAD_TYPE_MAX, CENTRE_RULES, RESIDUE_NAME, TERM_KEY_MAX } from './mapping-doc';
import { bondedParamsProblem, exclusionsSchema, parseTermKey, type BondedParams } from './bonded-terms';
import { versionRef, type VersionRef } from './versions';

// Export formats of a mapping (docs/exports.md) and the JSON export's shape, which is also what
// POST /api/molecules/:id/mappings/import reads back. The JSON Schema of the JSON export is
// published at /schemas/beadloom-mapping-v1.json (public/schemas/).

export const EXPORT_FORMATS = ['csv', 'json', 'pdb', 'groups', 'ndx', 'svg', 'png'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

/** Engine downloads: a zip of GROMACS or LAMMPS files (docs/exports.md); not part of the project zip. */
export const ENGINE_FORMATS = ['gromacs', 'lammps'] as const;
export type EngineFormat = (typeof ENGINE_FORMATS)[number];
export const isEngineFormat = (f: string): f is EngineFormat => (ENGINE_FORMATS as readonly string[]).includes(f);
/** Repeat units a chain export may hold. */
export const UNITS_MAX = 200;

const ALL_FORMATS = [...EXPORT_FORMATS, ...ENGINE_FORMATS] as const;

export const exportQuery = z.strictObject({
  format: z.enum(ALL_FORMATS, `The format is one of ${ALL_FORMATS.join(', ')}.`),
  /** PDB only: the molecule's residue name (1–3 letters or digits; CGM when absent). */
  residue: z.string().regex(/^[A-Za-z0-9]{1,3}$/, 'residue is 1 to 3 letters or digits.').optional(),
  /** Engine formats: a reference analysis whose mean structure gives the coordinates. */
  analysis: z.string().regex(/^[1-9][0-9]{0,9}$/, 'analysis is an analysis id.').transform(Number).optional(),
  /** Engine formats, repeat units only: how many units the chain has. */
  units: z.string().regex(/^[0-9]{1,6}$/, 'units is a whole number.').transform(Number).optional(),
  version: versionRef.default('draft'),
  /** ndx only: a ready reference of the molecule; the groups then number its atoms, over all copies. */
  reference: z.string().regex(/^[1-9][0-9]{0,9}$/, 'reference is a reference id.').transform(Number).optional(),
  /** SVG only: 1-based atom numbers to ring, comma-separated (the compare screen's moved atoms). */
  highlight: z.string().regex(/^[1-9][0-9]{0,5}(,[1-9][0-9]{0,5}){0,999}$/, 'highlight lists 1-based atom numbers separated by commas.').optional(),
});
export type ExportQuery = z.infer<typeof exportQuery>;

export const EXPORT_FILE: Record<ExportFormat, { extension: string; mime: string }> = {
  csv: { extension: 'csv', mime: 'text/csv; charset=utf-8' },
  json: { extension: 'json', mime: 'application/json; charset=utf-8' },
  pdb: { extension: 'pdb', mime: 'chemical/x-pdb' },
  groups: { extension: 'groups.txt', mime: 'text/plain; charset=utf-8' },
  ndx: { extension: 'ndx', mime: 'text/plain; charset=utf-8' },
  svg: { extension: 'svg', mime: 'image/svg+xml' },
  png: { extension: 'png', mime: 'image/png' },
};

export const IMPORT_MAX_BYTES = 5 * 1024 * 1024;
export const JSON_SCHEMA_PATH = '/schemas/beadloom-mapping-v1.json';

/** One bead of the hashed content: atoms as [1-based atom number, weight] pairs, in number order. */
export interface ContentBead {
  id: string;
  name: string;
  type: string | null;
  centre: CentreRule;
  atoms: [number, number][];
  /** Present only when the bead has a measured or literature partition value (older hashes are unchanged). */
  measured?: MeasuredPartition;
}

/**
 * What a version's SHA-256 covers: the molecule (canonical SMILES), the beads and, when set, the
 * mapping's partition basis, its bonded terms (keys in string order), its exclusion count and its
 * residue name; nothing
 * else. A mapping without bonded terms hashes as it did before they existed.
 */
export interface VersionContent {
  canonicalSmiles: string;
  beads: ContentBead[];
  partitionBasis?: PartitionBasis;
  bonded?: Record<string, BondedParams>;
  exclusions?: number;
  residue?: string;
}

/** The content of a mapping, keys in the documented order (the hash depends on that order). */
export function versionContent(canonicalSmiles: string, mapping: Mapping): VersionContent {
  return {
    canonicalSmiles,
    beads: mapping.beads.map((b) => ({
      id: b.id,
      name: b.name,
      type: b.type ?? null,
      centre: b.centre,
      atoms: b.atoms.map((a): [number, number] => [a.index + 1, a.weight]),
      ...(b.measured ? { measured: { kind: b.measured.kind, value: b.measured.value, source: b.measured.source } } : {}),
    })),
    ...(mapping.partitionBasis ? { partitionBasis: mapping.partitionBasis } : {}),
    ...(mapping.bonded && Object.keys(mapping.bonded).length > 0 ? { bonded: sortedTerms(mapping.bonded) } : {}),
    ...(mapping.exclusions !== undefined ? { exclusions: mapping.exclusions } : {}),
    ...(mapping.residue !== undefined ? { residue: mapping.residue } : {}),
  };
}

/** Terms in key order, each params object in a fixed key order, so the hash does not depend on edit order. */
function sortedTerms(bonded: Record<string, BondedParams>): Record<string, BondedParams> {
  const out: Record<string, BondedParams> = {};
  for (const key of Object.keys(bonded).sort()) {
    const p = bonded[key];
    out[key] = {
      function: p.function,
      value: p.value,
      k: p.k,
      ...(p.multiplicity !== undefined ? { multiplicity: p.multiplicity } : {}),
      ...(p.constraint !== undefined ? { constraint: p.constraint } : {}),
      ...(p.omit !== undefined ? { omit: p.omit } : {}),
    };
  }
  return out;
}

/** The exact text whose UTF-8 bytes are hashed: compact JSON of the content (JSON.stringify). */
export const contentText = (content: VersionContent): string => JSON.stringify(content);

export function contentToMapping(content: VersionContent): Mapping {
  return {
    beads: content.beads.map((b) => ({ id: b.id, name: b.name, ...(b.type ? { type: b.type } : {}), centre: b.centre, atoms: b.atoms.map(([n, weight]) => ({ index: n - 1, weight })), ...(b.measured ? { measured: b.measured } : {}) })),
    ...(content.partitionBasis ? { partitionBasis: content.partitionBasis } : {}),
    ...(content.bonded ? { bonded: content.bonded } : {}),
    ...(content.exclusions !== undefined ? { exclusions: content.exclusions } : {}),
    ...(content.residue !== undefined ? { residue: content.residue } : {}),
  };
}

/** Stored bonded terms as a file carries them: valid term keys and params for each key's kind. */
export const contentBonded = z.record(z.string().max(TERM_KEY_MAX), z.any()).superRefine((terms, ctx) => {
  for (const [key, p] of Object.entries(terms)) {
    const parsed = parseTermKey(key);
    const why = parsed ? bondedParamsProblem(parsed.kind, p) : 'not a term key ("kind:id,id…")';
    if (why) ctx.addIssue({ code: 'custom', path: [key], message: why });
  }
}) as unknown as z.ZodType<Record<string, BondedParams>>;

const contentBead = z.strictObject({
  id: z.string().min(1).max(BEAD_ID_MAX),
  name: z.string().trim().min(1).max(BEAD_NAME_MAX),
  type: z.string().max(BEAD_TYPE_MAX).nullable(),
  centre: z.enum(CENTRE_RULES as [CentreRule, ...CentreRule[]]),
  atoms: z.array(z.tuple([z.number().int().min(1, 'Atom numbers start at 1.'), z.number().gt(0).lte(1)])).min(1),
  measured: measuredSchema.optional(),
});

/** One heavy atom of the exported molecule (the JSON export's `molecule.atoms`). */
export interface ExportAtom {
  number: number;
  element: string;
  isotope: number | null;
  charge: number;
  hydrogens: number;
}

/** One bond of the exported molecule, between 1-based atom numbers (`molecule.bonds`). */
export interface ExportBond {
  a: number;
  b: number;
  /** Kekulé order (1, 2, 3; 0 for a metal/dative link); compare `aromatic` first. */
  order: number;
  aromatic: boolean;
}

const exportAtom = z.looseObject({
  number: z.number().int().min(1),
  element: z.string().min(1).max(3),
  isotope: z.number().int().min(1).nullable().optional(),
  charge: z.number().int(),
  hydrogens: z.number().int().min(0),
});
const exportBond = z.strictObject({ a: z.number().int().min(1), b: z.number().int().min(1), order: z.number().int().min(0).max(4), aromatic: z.boolean() });

/** What an import needs of a JSON export; anything else in the file is ignored. */
export const importBody = z.looseObject({
  format: z.literal('beadloom-mapping', 'This is not a Beadloom mapping export (format must be "beadloom-mapping").'),
  formatVersion: z.literal(1, 'Only formatVersion 1 can be imported.'),
  mapping: z.looseObject({ name: z.string().trim().min(1).max(200), resolution: z.enum(['4:1', '3:1', '2:1']) }),
  /** The exported molecule's atoms and bonds: the beads are placed by matching this structure. */
  molecule: z.looseObject({ atoms: z.array(exportAtom).max(100_000), bonds: z.array(exportBond).max(200_000).optional() }).optional(),
  content: z.strictObject({ canonicalSmiles: z.string().min(1), beads: z.array(contentBead).max(10_000), partitionBasis: partitionBasisSchema.optional(), bonded: contentBonded.optional(), exclusions: exclusionsSchema.optional(), residue: z.string().regex(RESIDUE_NAME, 'The residue name is 1 to 3 upper-case letters or digits.').optional() }),
  sha256: z.string().regex(/^[0-9a-f]{64}$/, 'sha256 is 64 lower-case hex digits.'),
  /** Name for the new mapping; defaults to the exported mapping's name. */
  name: z.string().trim().min(1).max(200).optional(),
  /** Answer where the beads would go (ImportPreview) and write nothing. */
  preview: z.boolean().optional(),
  /** Import even though the content no longer matches its sha256 (edited by hand); the audit trail says so. */
  allowModified: z.boolean().optional(),
});
export type ImportBody = z.infer<typeof importBody>;

/** How the file's atoms were found on the target molecule. */
export interface ImportCorrespondence {
  /** 'structure': by graph matching of the file's atoms and bonds; 'atom-number': an older file without bonds whose atoms agree number by number. */
  method: 'structure' | 'atom-number';
  /** atoms[i] is the molecule's atom number for the file's atom number i + 1. */
  atoms: number[];
  /** How many atoms have another number on the molecule than in the file. */
  renumbered: number;
  /** More than one correspondence fits the structure (the molecule has symmetric atoms). */
  symmetric: boolean;
  /** When symmetric: whether another correspondence would put some bead on other atoms. */
  choiceMatters: boolean;
  /** Groups of the molecule's atom numbers that the structure cannot tell apart. */
  equivalentAtoms: number[][];
  /** A sentence on the symmetric choice taken, or null when there was none to make. */
  choice: string | null;
}

/** A bead as it would land on the target molecule: atoms as [molecule atom number, weight]. */
export type PlacedBead = ContentBead;

/** `preview: true` answers 200 with this and writes nothing. */
export interface ImportPreview {
  preview: true;
  /** The name the new mapping would get, and its resolution. */
  mapping: { name: string; resolution: '4:1' | '3:1' | '2:1' };
  /** The content no longer matches its sha256: the import needs `allowModified: true`. */
  modified: boolean;
  correspondence: ImportCorrespondence;
  beads: PlacedBead[];
}

/** What the 201 of an import carries besides the new mapping's summary. */
export interface ImportOutcome {
  correspondence: ImportCorrespondence;
  modified: boolean;
}

/** The download (or picture) URL of one state of a mapping. */
export function exportUrl(mappingId: number, format: ExportFormat | EngineFormat, version: VersionRef = 'draft', highlight: readonly number[] = []): string {
  const q = new URLSearchParams({ format, version: String(version) });
  if (highlight.length) q.set('highlight', highlight.join(','));
  return `/api/mappings/${mappingId}/export?${q}`;
}

export const projectZipUrl = (projectId: number) => `/api/projects/${projectId}/export.zip`;
