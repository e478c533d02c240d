import type { ExportSource } from './export-source';
import { FILE_TITLES, headerLines } from './csv';

// Atom → bead groups as plain text, our own simple format (docs/exports.md): '#' lines are comments;
// every other line is one bead: its name (blanks replaced by '_'), then its atoms as 1-based numbers
// in the molecule's heavy-atom order, separated by single spaces. A shared atom is listed in each of
// its beads.
export function toGroups(s: ExportSource): string {
  const lines = headerLines(s, FILE_TITLES.groups).map((l) => `# ${l.replace(/[\r\n]+/g, ' ')}`);
  lines.push('# Each line: bead name (blanks as _), then its atoms; a shared atom is on each of its beads\' lines.');
  for (const b of s.draft.beads) lines.push([b.name.trim().replace(/\s+/g, '_'), ...b.atoms.map((a) => a.index + 1)].join(' '));
  return lines.join('\n') + '\n';
}
