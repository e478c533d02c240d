import type { MoleculeDetail } from '../../../shared/molecules';

const CONFORMER: Record<string, string> = {
  none: 'No 3D coordinates yet.',
  queued: 'A 3D conformer is queued; bead centres appear when it is ready.',
  running: 'A 3D conformer is being generated; bead centres appear when it is ready.',
  done: '',
  failed: 'The 3D conformer could not be generated; centres are not available.',
};

/** Formula, weight, logP and the other facts of a molecule, with the note on what they are. */
export function MoleculeFacts({ molecule }: { molecule: MoleculeDetail }) {
  const minus = (n: number, d: number) => (n < 0 ? `−${Math.abs(n).toFixed(d)}` : n.toFixed(d));
  const facts: [string, string][] = [
    ['Formula', molecule.formula],
    ['Molecular weight', `${molecule.molecularWeight.toFixed(2)} g/mol`],
    ['logP (Wildman–Crippen, 298 K)', molecule.logPWarning ? `${minus(molecule.logP, 2)} (charged species: not a partition value)` : minus(molecule.logP, 2)],
    ['Heavy atoms', String(molecule.heavyAtoms)],
    ['Net charge', String(molecule.netCharge)],
    ['Canonical SMILES', molecule.canonicalSmiles],
    ['3D coordinates', molecule.coordinates.status === 'done' ? (molecule.coordinates.source === 'upload' ? 'From the uploaded file' : 'Generated conformer') : CONFORMER[molecule.coordinates.status]],
  ];
  return (
    <div className="flex flex-col gap-3">
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 text-sm">
        {facts.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="text-ink-600">{k}</dt>
            <dd className={k === 'Canonical SMILES' ? 'font-mono text-xs break-all text-ink-900' : 'font-semibold text-ink-900'}>{v}</dd>
          </div>
        ))}
      </dl>
      {molecule.logPWarning && <p role="note" className="rounded-md border border-alert-600/30 bg-alert-50 px-3 py-2 text-sm text-ink-800">{molecule.logPWarning}</p>}
      {molecule.model.warnings.length > 0 && (
        <ul className="list-disc pl-5 text-sm text-ink-700">
          {molecule.model.warnings.map((w) => <li key={w}>{w}</li>)}
        </ul>
      )}
      <p className="text-xs text-ink-600">Computed values are modelling estimates, not safety or regulatory data.</p>
    </div>
  );
}
