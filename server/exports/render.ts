import { EXPORT_FILE, type ExportFormat } from '../../src/shared/exports';
import type { ExportSource } from './export-source';
import { stateLabel } from './export-source';
import { toCsv } from './csv';
import { toGroups } from './groups';
import { beadIndexGroups, writeNdx } from './ndx';
import { toJsonExport } from './json';
import { toPdb, type PdbOptions } from './pdb';
import { toPng } from './png';
import { toSvg, type SvgOptions } from './svg';

/** One export file: its bytes, type and a download name such as "c12e4-at-4-1-v2.csv". */
export interface ExportFile {
  name: string;
  mime: string;
  body: Buffer;
}

export const slug = (v: string) => v.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'mapping';

export function renderExport(s: ExportSource, format: ExportFormat, svg: SvgOptions = {}, pdb: PdbOptions = {}): ExportFile {
  const text = (t: string) => Buffer.from(t, 'utf8');
  const body =
    format === 'csv' ? text(toCsv(s))
    : format === 'json' ? text(JSON.stringify(toJsonExport(s), null, 2) + '\n')
    : format === 'pdb' ? text(toPdb(s, pdb))
    : format === 'groups' ? text(toGroups(s))
    : format === 'ndx' ? text(writeNdx(beadIndexGroups(s.model, s.draft.beads), ndxComments(s, 'atoms numbered as in the all-atom molecule (atoms, then hydrogens by parent)')))
    : format === 'svg' ? text(toSvg(s, svg))
    : toPng(s);
  const { extension, mime } = EXPORT_FILE[format];
  return { name: `${slug(s.mappingName)}-${stateLabel(s)}.${extension}`, mime, body };
}

/** The comment lines of an index file: what it indexes, and what .ndx cannot say (docs/exports.md). */
export function ndxComments(s: ExportSource, numbering: string): string[] {
  const shared = s.draft.beads.some((b) => b.atoms.some((a) => a.weight !== 1));
  return [
    `Beadloom: ${s.mappingName} (${s.moleculeName}), ${stateLabel(s)}, content SHA-256 ${s.sha256}`,
    `One group per bead; ${numbering}.`,
    ...(shared ? ['Shared atoms are listed in each of their beads; their weights cannot be expressed in .ndx, so a centre computed from these groups counts them whole.'] : []),
  ];
}
