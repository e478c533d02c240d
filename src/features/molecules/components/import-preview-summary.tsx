import type { ImportPreview } from '../../../shared/exports';
import type { MoleculeDetail } from '../../../shared/molecules';
import { ImportPreviewPicture } from './import-preview-picture';

/** What an import would create: name, how the atoms were matched, the picture and the beads' atoms. */
export function ImportPreviewSummary({ preview, molecule }: { preview: ImportPreview; molecule: MoleculeDetail }) {
  const c = preview.correspondence;
  return (
    <div className="flex flex-col gap-2" aria-label="Import preview" role="region">
      <p>
        A new mapping <strong>{preview.mapping.name}</strong> ({preview.mapping.resolution}) with {preview.beads.length} {preview.beads.length === 1 ? 'bead' : 'beads'}.
        {' '}
        {c.method === 'structure' ? 'Its atoms were found on this molecule by structure' : 'Its atoms were taken number by number'}
        {c.renumbered ? `; ${c.renumbered} ${c.renumbered === 1 ? 'atom has' : 'atoms have'} another number here than in the file.` : '.'}
      </p>
      {c.choice && <p className="rounded-md bg-paper-100 px-3 py-2">The molecule is symmetric: {c.choice}</p>}
      {preview.modified && <p className="rounded-md bg-paper-100 px-3 py-2">The file was changed after export (its content no longer matches its SHA-256); importing will ask you to confirm.</p>}
      <ImportPreviewPicture sketch={molecule.sketch} beads={preview.beads} label={`Where the beads of ${preview.mapping.name} would go on ${molecule.name}`} />
      <table className="text-left text-sm">
        <caption className="sr-only">Beads to import</caption>
        <thead><tr className="text-ink-600"><th className="pr-3 font-semibold">Bead</th><th className="pr-3 font-semibold">Type</th><th className="font-semibold">Atoms (numbered from 1)</th></tr></thead>
        <tbody>
          {preview.beads.map((b) => (
            <tr key={b.id} className="border-t border-paper-300">
              <td className="pr-3 font-semibold">{b.name}</td>
              <td className="pr-3">{b.type ?? '—'}</td>
              <td>{b.atoms.map(([n, w]) => (w === 1 ? String(n) : `${n} (${w})`)).join(', ')}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
