/**
 * Bonded terms of a CG model: one row per bond, angle and proper dihedral of the draft's topology
 * (server/chem/topology.ts), plus improper dihedrals the modeller adds to keep a planar ring system
 * planar. They live in the draft document (mapping-doc.ts, top-level map "bonded"), so they are edited
 * live, saved with every version and restored with it (docs/collaboration.md, docs/exports.md).
 *
 * A term is stored under its key: kind and bead ids, in one canonical direction (a bond's or angle's
 * ends, a dihedral's outer beads, in string order), so A–B–C and C–B–A are the same entry. Bead ids
 * (not names) keep a row through a rename; the API speaks bead names.
 *
 * Units (GROMACS conventions): a bond's value in nm and k in kJ mol⁻¹ nm⁻²; an angle's value in
 * degrees and k in kJ mol⁻¹ rad⁻² (harmonic) or kJ mol⁻¹ (cosine-harmonic); a proper dihedral's value
 * is its phase in degrees, k in kJ mol⁻¹, with a multiplicity; an improper's value in degrees and k in
 * kJ mol⁻¹ rad⁻². Energy forms, with their GROMACS function numbers (GROMACS reference manual,
 * "Bonded interactions") and LAMMPS styles:
 *   bond harmonic          E = ½k(r − r0)²                 gmx bonds 1, [ constraints ] 1 if constrained; lammps harmonic (K = k/2)
 *   angle harmonic         E = ½k(θ − θ0)²                 gmx angles 1;  lammps harmonic (K = k/2)
 *   angle cosine-harmonic  E = ½k(cos θ − cos θ0)²         gmx angles 2;  lammps cosine/squared (K = k/2)
 *   dihedral periodic      E = k(1 + cos(nφ − φs))         gmx dihedrals 1; lammps charmm, weight 0 (K = k)
 *   improper harmonic      E = ½k(ξ − ξ0)²                 gmx dihedrals 2; lammps harmonic (K = k/2)
 */
import { z } from 'zod';

export const TERM_KINDS = ['bond', 'angle', 'dihedral', 'improper'] as const;
export type TermKind = (typeof TERM_KINDS)[number];
export const TERM_FUNCTIONS = {
  bond: ['harmonic'],
  angle: ['harmonic', 'cosine-harmonic'],
  dihedral: ['periodic'],
  improper: ['harmonic'],
} as const satisfies Record<TermKind, readonly string[]>;
export type TermFunction = (typeof TERM_FUNCTIONS)[TermKind][number];
export const BEADS_PER_TERM: Record<TermKind, number> = { bond: 2, angle: 3, dihedral: 4, improper: 4 };

/** Bounds a value may take (typing mistakes, not physics): nm, degrees, kJ mol⁻¹ (rad⁻² | nm⁻²). */
export const TERM_LIMITS = {
  bondLength: { min: 0.01, max: 5 },
  angle: { min: 0, max: 180 },
  dihedral: { min: -360, max: 360 },
  k: { min: 0, max: 1e7 },
  multiplicity: { min: 1, max: 6 },
  exclusions: { min: 0, max: 6 },
} as const;

/** What the draft stores per term (one plain object, always replaced whole). */
export interface BondedParams {
  function: TermFunction;
  value: number | null;
  k: number | null;
  multiplicity?: number;
  /** Bonds only: a constraint of length `value` instead of a harmonic bond. */
  constraint?: boolean;
  /** Angles and dihedrals only: left out of the model (e.g. made redundant by a rigid ring). */
  omit?: boolean;
}

/** One row as the API and the editor see it (bead names). */
export interface BondedTerm extends BondedParams {
  kind: TermKind;
  beads: string[];
}

/** The key a term is stored under: kind and bead ids in canonical direction. */
export function termKey(kind: TermKind, ids: readonly string[]): string {
  const forward = ids[0] <= ids[ids.length - 1];
  return `${kind}:${(forward ? ids : [...ids].reverse()).join(',')}`;
}

export function parseTermKey(key: string): { kind: TermKind; ids: string[] } | null {
  const colon = key.indexOf(':');
  const kind = key.slice(0, colon) as TermKind;
  if (colon < 0 || !TERM_KINDS.includes(kind)) return null;
  const ids = key.slice(colon + 1).split(',');
  return ids.length === BEADS_PER_TERM[kind] && ids.every((id) => id.length > 0) ? { kind, ids } : null;
}

/** The default function of a kind, used only to label an empty row (its numbers stay null). */
export const defaultFunction = (kind: TermKind): TermFunction => TERM_FUNCTIONS[kind][0];

const inRange = (v: number, r: { min: number; max: number }) => Number.isFinite(v) && v >= r.min && v <= r.max;

/** Why stored params are not valid for `kind` (null when they are). Nulls are allowed: unset values. */
export function bondedParamsProblem(kind: TermKind, p: unknown): string | null {
  if (typeof p !== 'object' || p === null || Array.isArray(p)) return 'A bonded term is a plain object { function, value, k }.';
  const o = p as Record<string, unknown>;
  for (const key of Object.keys(o)) if (!['function', 'value', 'k', 'multiplicity', 'constraint', 'omit'].includes(key)) return `A bonded term has no "${key}".`;
  if (!(TERM_FUNCTIONS[kind] as readonly string[]).includes(o.function as string)) return `A ${kind}'s function is ${TERM_FUNCTIONS[kind].join(' or ')}.`;
  if (o.value !== null && typeof o.value !== 'number') return 'A value is a number or null (not set).';
  if (o.k !== null && typeof o.k !== 'number') return 'A force constant is a number or null (not set).';
  if (typeof o.value === 'number') {
    const r = kind === 'bond' ? TERM_LIMITS.bondLength : kind === 'angle' ? TERM_LIMITS.angle : TERM_LIMITS.dihedral;
    const unit = kind === 'bond' ? 'nm' : '°';
    if (!inRange(o.value, r)) return `A ${kind}'s value lies from ${r.min} to ${r.max} ${unit}; got ${o.value}.`;
  }
  if (typeof o.k === 'number' && !inRange(o.k, TERM_LIMITS.k)) return `A force constant lies from ${TERM_LIMITS.k.min} to ${TERM_LIMITS.k.max}; got ${o.k}.`;
  if (o.multiplicity !== undefined) {
    if (kind !== 'dihedral') return 'Only a proper dihedral has a multiplicity.';
    if (typeof o.multiplicity !== 'number' || !Number.isInteger(o.multiplicity) || !inRange(o.multiplicity, TERM_LIMITS.multiplicity)) return `A multiplicity is a whole number from 1 to ${TERM_LIMITS.multiplicity.max}.`;
  }
  if (o.constraint !== undefined && (kind !== 'bond' || typeof o.constraint !== 'boolean')) return 'Only a bond can be a constraint (true or false).';
  if (o.omit !== undefined && (kind === 'bond' || typeof o.omit !== 'boolean')) return 'Only an angle or dihedral can be left out (true or false); a bond can be a constraint instead.';
  return null;
}

/** What a term still needs before an engine can use it (empty when complete or left out). */
export function missingValues(t: Pick<BondedTerm, 'kind' | 'value' | 'k' | 'multiplicity' | 'constraint' | 'omit'>): string[] {
  if (t.omit) return [];
  const missing: string[] = [];
  if (t.value === null) missing.push(t.kind === 'bond' ? 'length' : t.kind === 'dihedral' ? 'phase' : 'angle');
  if (t.k === null && !t.constraint) missing.push('force constant');
  if (t.kind === 'dihedral' && t.multiplicity === undefined) missing.push('multiplicity');
  return missing;
}

/** The terms of a topology (bead ids), in the topology's order: what the table lists. */
export function topologyTermIds(topology: { bonds: string[][]; angles: string[][]; dihedrals: string[][] }): { kind: TermKind; ids: string[] }[] {
  const out: { kind: TermKind; ids: string[] }[] = [];
  for (const ids of topology.bonds) out.push({ kind: 'bond', ids });
  for (const ids of topology.angles) out.push({ kind: 'angle', ids });
  for (const ids of topology.dihedrals) out.push({ kind: 'dihedral', ids });
  return out;
}

/**
 * Every row of the table: the topology's terms with what the draft stores for them (nulls where
 * nothing is stored), then the stored impropers. Stored entries for terms the topology no longer has
 * (a bead was split or merged) are not listed; they stay in the draft and come back with the bonds.
 */
export function bondedRows(topology: { bonds: string[][]; angles: string[][]; dihedrals: string[][] }, stored: Readonly<Record<string, BondedParams>>, beadName: (id: string) => string, junction: readonly { kind: TermKind; ids: string[] }[] = []): BondedTerm[] {
  const rows: BondedTerm[] = [];
  for (const { kind, ids } of [...topologyTermIds(topology), ...junction]) {
    const p = stored[termKey(kind, ids)];
    const canonical = parseTermKey(termKey(kind, ids))!.ids;
    rows.push({ kind, beads: canonical.map(beadName), ...(p ?? { function: defaultFunction(kind), value: null, k: null }) });
  }
  for (const [key, p] of Object.entries(stored)) {
    const parsed = parseTermKey(key);
    if (parsed?.kind === 'improper') rows.push({ kind: 'improper', beads: parsed.ids.map(beadName), ...p });
  }
  return rows;
}

// --- the API's shapes -------------------------------------------------------------------------

const num = (what: string) => z.number(`${what} is a number or null.`).finite().nullable();
export const bondedTermSchema = z
  .strictObject({
    kind: z.enum(TERM_KINDS, 'A term kind is bond, angle, dihedral or improper.'),
    beads: z.array(z.string().trim().min(1, 'A bead name is not empty.')).min(2).max(4),
    function: z.string(),
    value: num('A value'),
    k: num('A force constant'),
    multiplicity: z.number().int().optional(),
    constraint: z.boolean().optional(),
    omit: z.boolean().optional(),
  })
  .superRefine((t, ctx) => {
    if (t.beads.length !== BEADS_PER_TERM[t.kind]) ctx.addIssue({ code: 'custom', path: ['beads'], message: `A ${t.kind} joins ${BEADS_PER_TERM[t.kind]} beads.` });
    const { kind, beads: _beads, ...params } = t;
    const why = bondedParamsProblem(kind, params);
    if (why) ctx.addIssue({ code: 'custom', path: ['value'], message: why });
  }) as unknown as z.ZodType<BondedTerm>; // the refinement checked `function` against the kind

export const exclusionsSchema = z.number('The exclusion count is a whole number.').int('The exclusion count is a whole number.').min(TERM_LIMITS.exclusions.min).max(TERM_LIMITS.exclusions.max, `The exclusion count is at most ${TERM_LIMITS.exclusions.max}.`);

export const bondedTermsPutBody = z.union(
  [
    z.strictObject({ terms: z.array(bondedTermSchema).max(20_000, 'At most 20000 terms.'), exclusions: exclusionsSchema.nullable().optional() }),
    z.strictObject({ fromAnalysis: z.number().int().positive('An analysis id is a positive whole number.') }),
  ],
  'Send { terms, exclusions } or { fromAnalysis: id }.',
);
export type BondedTermsPutBody = z.infer<typeof bondedTermsPutBody>;

export interface BondedTermsView {
  terms: BondedTerm[];
  /** GROMACS nrexcl: non-bonded pairs excluded up to this many bonds apart; null when not set. */
  exclusions: number | null;
}
