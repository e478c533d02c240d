import type { ExportSource } from './export-source';
import { stateLabel } from './export-source';
import { csvCommentLine, writeCsv } from '../../src/shared/csv';

// The mapping table as RFC 4180 CSV written by papaparse (comma, CRLF, fields with a comma, quote, line
// break or a leading '#' quoted; text cells a spreadsheet would run as a formula escaped with ' — see
// src/shared/csv.ts). Lines starting with '#' before the header carry the mapping, version and
// SHA-256; standard readers skip them with a comment option (papaparse: `comments: '#'`).
// Partition columns: both estimates (atom sum, fragment), the modeller's measured value and its
// source, and the value suggestions use (`dG_OW_kJ_per_mol`, from `partition_source`: measured,
// fragment or atoms). An ionic bead has no partition value: its cells say "n/a (ionic)".

export const CSV_COLUMNS = [
  'bead', 'type', 'atoms', 'weights', 'mass', 'charge', 'ionic',
  'logP_atom_sum', 'logP_fragment', 'logP_measured', 'measured_source',
  'dG_atom_sum_kJ_per_mol', 'dG_fragment_kJ_per_mol', 'partition_source', 'dG_OW_kJ_per_mol',
  'centre_rule', 'centre_x', 'centre_y', 'centre_z',
] as const;

export const IONIC = 'n/a (ionic)';

const num = (v: number | null | undefined, digits: number) => (typeof v === 'number' && Number.isFinite(v) ? v.toFixed(digits) : '');

/** What each text export is, said in its first header line (docs/exports.md). */
export const FILE_TITLES = {
  csv: 'Beadloom mapping table: one row per bead (atoms, weights, mass, charge, logP, dG_OW, centre)',
  pdb: 'Beadloom CG (coarse-grained) structure, one pseudo-atom per bead',
  groups: 'Beadloom atom-to-bead groups: one line per bead, its atoms as 1-based numbers',
} as const;

/** The header lines every text export starts with: what the file is, then mapping, molecule, state and SHA-256. */
export function headerLines(s: ExportSource, title: string): string[] {
  return [title, `mapping: ${s.mappingName}`, `molecule: ${s.moleculeName}`, `version: ${stateLabel(s)}${s.production ? ' (production)' : ''}`, `sha256: ${s.sha256}`];
}

export function toCsv(s: ExportSource): string {
  const evals = new Map(s.evaluation?.beads.map((b) => [b.id, b]) ?? []);
  const rows = s.draft.beads.map((b) => {
    const e = evals.get(b.id);
    const estimate = (v: number | null | undefined, digits: number) => (e?.ionic ? IONIC : num(v, digits));
    return [
      b.name,
      b.type ?? '',
      b.atoms.map((a) => a.index + 1).join(' '),
      b.atoms.map((a) => String(a.weight)).join(' '),
      num(e?.mass, 4),
      e ? e.charge : '',
      e ? (e.ionic ? 'yes' : 'no') : '',
      estimate(e?.logP, 3),
      estimate(e?.fragmentLogP, 3),
      num(e?.measuredLogP, 3),
      e?.measuredSource ?? '',
      estimate(e?.deltaG, 2),
      estimate(e?.fragmentDeltaG, 2),
      e?.partitionSource ?? '',
      e?.partitionSource === 'ionic' ? IONIC : num(e?.partitionDeltaG, 2),
      b.centre,
      num(e?.centre?.[0], 3),
      num(e?.centre?.[1], 3),
      num(e?.centre?.[2], 3),
    ];
  });
  const comments = headerLines(s, FILE_TITLES.csv).map(csvCommentLine);
  return [...comments, ''].join('\r\n') + writeCsv([CSV_COLUMNS, ...rows], { newline: '\r\n', quoteLeadingHash: true });
}
