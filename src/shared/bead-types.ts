import { z } from 'zod';
import { readCsv, unescapeFormulaCell, writeCsv } from './csv';

// A project's bead type library: the table bead type suggestions are drawn from. Edited as a whole
// (`PUT /api/projects/:id/bead-types` replaces it), imported and exported as CSV with BEAD_TYPE_CSV_COLUMNS.
// A type's size class is the number of heavy atoms a bead of the type stands for (4, 3 or 2).

export const SIZE_CLASSES = [4, 3, 2] as const;
/** The words an older CSV used for the size classes, still read on import. */
const LEGACY_SIZE_WORDS: Record<string, number> = { regular: 4, small: 3, tiny: 2 };
export const LIBRARY_NOTE_MAX = 500;
export const BEAD_TYPES_MAX = 500;
/** kJ/mol; open-ended ranges are written as ±1000 so the table survives JSON and CSV. */
export const DELTA_G_LIMIT = 1000;

const deltaG = z.number('ΔG is a number (kJ/mol).').min(-DELTA_G_LIMIT).max(DELTA_G_LIMIT);

export const beadTypeRow = z
  .strictObject({
    name: z.string().trim().min(1, 'A bead type needs a name.').max(40, 'A bead type name has at most 40 characters.'),
    heavyAtomsPerBead: z.union(SIZE_CLASSES.map((n) => z.literal(n)), 'Heavy atoms per bead is 4, 3 or 2.'),
    charge: z.number().int('The charge is a whole number.').min(-4).max(4),
    deltaGMin: deltaG,
    deltaGMax: deltaG,
    description: z.string().trim().max(500).default(''),
    /** Optional Lennard-Jones sigma (nm) and epsilon (kJ/mol) for the engine exports; absent or null: not set. */
    sigma: z.number('sigma is a number (nm).').finite().min(0, 'sigma must not be negative.').max(5, 'sigma is at most 5 nm.').nullable().optional(),
    epsilon: z.number('epsilon is a number (kJ/mol).').finite().min(0, 'epsilon must not be negative.').max(1000, 'epsilon is at most 1000 kJ/mol.').nullable().optional(),
  })
  .refine((r) => r.deltaGMin <= r.deltaGMax, { message: 'deltaGMin must not exceed deltaGMax.', path: ['deltaGMin'] });
export type BeadTypeRow = z.infer<typeof beadTypeRow>;

const note = z.string().trim().max(LIBRARY_NOTE_MAX, `A library note has at most ${LIBRARY_NOTE_MAX} characters.`);

/** `note` (shown once above the table) is kept when omitted. */
export const putBeadTypesBody = z
  .strictObject({ types: z.array(beadTypeRow).max(BEAD_TYPES_MAX, `A library holds at most ${BEAD_TYPES_MAX} types.`), note: note.optional() })
  .refine((b) => new Set(b.types.map((t) => t.name)).size === b.types.length, { message: 'Bead type names must be unique.', path: ['types'] });
export type PutBeadTypesBody = z.infer<typeof putBeadTypesBody>;

/** CSV import: `PUT /api/projects/:id/bead-types` with `{ csv }` instead of `{ types }` (same columns as export). */
export const importBeadTypesCsvBody = z.strictObject({ csv: z.string().min(1, 'The CSV is empty.').max(1_000_000, 'A CSV file is at most 1 MB.'), note: note.optional() });
export type ImportBeadTypesCsvBody = z.infer<typeof importBeadTypesCsvBody>;

/** `GET /api/projects/:id/bead-types?format=csv` answers text/csv; JSON otherwise. */
export const beadTypesQuery = z.strictObject({ format: z.enum(['json', 'csv']).default('json') });

export interface BeadTypeLibrary {
  projectId: number;
  types: BeadTypeRow[];
  /** A note on the whole library, shown once above its table ('' for none). */
  note: string;
  updatedAt: string | null;
}

export const BEAD_TYPE_CSV_COLUMNS = ['name', 'heavy_atoms_per_bead', 'charge', 'delta_g_min', 'delta_g_max', 'description'] as const;
/** Optional columns: non-bonded parameters, written only when some type has them; empty cell = not set. */
export const NONBONDED_CSV_COLUMNS = ['sigma_nm', 'epsilon_kj_per_mol'] as const;

/** The library as CSV (LF line ends); numbers are written as numbers, text cells a spreadsheet would run are escaped. */
export function beadTypesToCsv(types: readonly BeadTypeRow[]): string {
  const nonbonded = types.some((t) => t.sigma != null || t.epsilon != null);
  const rows = types.map((t) => [t.name, t.heavyAtomsPerBead, t.charge, t.deltaGMin, t.deltaGMax, t.description, ...(nonbonded ? [t.sigma ?? '', t.epsilon ?? ''] : [])]);
  return writeCsv([nonbonded ? [...BEAD_TYPE_CSV_COLUMNS, ...NONBONDED_CSV_COLUMNS] : BEAD_TYPE_CSV_COLUMNS, ...rows], { newline: '\n' });
}

export type CsvResult = { ok: true; types: BeadTypeRow[] } | { ok: false; line: number; message: string };

/**
 * Parses the CSV written by `beadTypesToCsv` (header required, columns in any order). A file from
 * before the size class had its own meaning (a `size_class` column of regular / small / tiny) is read
 * as 4 / 3 / 2 heavy atoms per bead.
 */
export function beadTypesFromCsv(text: string): CsvResult {
  const { rows: lines, error } = readCsv(text);
  if (error) return { ok: false, line: 1, message: error };
  if (lines.length === 0) return { ok: false, line: 1, message: 'The file is empty.' };
  const header = lines[0].map((h) => h.trim().toLowerCase());
  const legacySize = !header.includes('heavy_atoms_per_bead') && header.includes('size_class');
  const missing = BEAD_TYPE_CSV_COLUMNS.filter((c) => c !== 'description' && !(legacySize && c === 'heavy_atoms_per_bead') && !header.includes(c));
  if (missing.length) return { ok: false, line: 1, message: `Missing column(s): ${missing.join(', ')}.` };
  const at = (cells: string[], col: string) => unescapeFormulaCell(cells[header.indexOf(col)]?.trim() ?? '');
  const num = (s: string) => (s === '' ? Number.NaN : Number(s));
  const types: BeadTypeRow[] = [];
  for (let i = 1; i < lines.length; i++) {
    const c = lines[i];
    const parsed = beadTypeRow.safeParse({
      name: at(c, 'name'),
      heavyAtomsPerBead: legacySize ? (LEGACY_SIZE_WORDS[at(c, 'size_class').toLowerCase()] ?? Number.NaN) : num(at(c, 'heavy_atoms_per_bead')),
      charge: num(at(c, 'charge')),
      deltaGMin: num(at(c, 'delta_g_min')),
      deltaGMax: num(at(c, 'delta_g_max')),
      description: at(c, 'description'),
      ...(header.includes('sigma_nm') && at(c, 'sigma_nm') !== '' ? { sigma: num(at(c, 'sigma_nm')) } : {}),
      ...(header.includes('epsilon_kj_per_mol') && at(c, 'epsilon_kj_per_mol') !== '' ? { epsilon: num(at(c, 'epsilon_kj_per_mol')) } : {}),
    });
    if (!parsed.success) return { ok: false, line: i + 1, message: `${parsed.error.issues[0].path.join('.')}: ${parsed.error.issues[0].message}` };
    types.push(parsed.data);
  }
  return { ok: true, types };
}
