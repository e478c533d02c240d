// The term table of an analysis as CSV: one row per CG bond, angle and dihedral with its mean, sd
// and harmonic constant (dihedrals: the cosine fit's terms and, when fewer than four, why), units in the header, and the settings
// that make it reproducible in '#' comment lines at the top.
import { csvCommentLine, writeCsv, type CsvCell } from '../../src/shared/csv';
import type { AnalysisView } from '../../src/shared/references';

export function termsCsv(a: AnalysisView & { mappingName: string; referenceName: string }): string {
  const r = a.result!;
  const head = [
    csvCommentLine(`Beadloom analysis ${a.id}: mapping "${a.mappingName}" ${a.versionNumber === null ? `draft (content SHA-256 ${a.contentSha256})` : `version ${a.versionNumber}`}, reference "${a.referenceName}"`),
    csvCommentLine(`${r.frames} frames × ${r.copies} copies, T = ${a.temperature} K, ${a.bins} bins; Boltzmann inversion (Tschöp et al. 1998; Reith, Pütz & Müller-Plathe 2003)`),
  ];
  const rows: CsvCell[][] = [['kind', 'beads', 'mean', 'sd', 'unit', 'k_harmonic', 'k_unit', 'fourier_n_k_phase', 'fourier_note']];
  for (const t of r.bonds) rows.push(['bond', t.beads.join('-'), t.mean, t.sd, 'nm', t.k, 'kJ mol-1 nm-2', '', '']);
  for (const t of r.angles) rows.push(['angle', t.beads.join('-'), t.mean, t.sd, 'deg', t.k, 'kJ mol-1 rad-2', '', '']);
  for (const t of r.dihedrals) rows.push(['dihedral', t.beads.join('-'), t.mean, t.sd, 'deg', '', '', (t.fourier ?? []).map((f) => `${f.n}:${f.k}:${f.phase}`).join(' '), t.fourierFit?.note ?? '']);
  return head.join('\n') + '\n' + writeCsv(rows, { newline: '\n' });
}
