import type { Molecule } from '../../../shared/chem';
import { formatMass, formatSigned } from '../model/number-format';

interface TotalsBarProps {
  molecule: Molecule;
  beadCount: number;
  unassigned: number;
}

/** The molecule's totals, always in view, and the reminder of what the numbers are. */
export function TotalsBar({ molecule, beadCount, unassigned }: TotalsBarProps) {
  const items: [string, string][] = [
    ['Formula', molecule.formula],
    ['Molecular weight', `${formatMass(molecule.molecularWeight)} g/mol`],
    ['logP', formatSigned(molecule.logP, 2)],
    ['Heavy atoms', String(molecule.atoms.length)],
    ['Net charge', formatSigned(molecule.netCharge, 0)],
    ['Beads', String(beadCount)],
    ['Unassigned atoms', String(unassigned)],
  ];
  return (
    <div className="flex flex-wrap items-center justify-between gap-x-6 gap-y-1 rounded-md border border-paper-300 bg-paper-50 px-4 py-2">
      <dl aria-label="Molecule totals" className="flex flex-wrap gap-x-5 gap-y-1 text-sm">
        {items.map(([label, value]) => (
          <div key={label} className="flex items-baseline gap-1.5">
            <dt className="text-ink-600">{label}</dt>
            <dd className={label === 'Unassigned atoms' && unassigned > 0 ? 'font-bold text-alert-700' : 'font-semibold text-ink-900'} data-total={label}>
              {value}
            </dd>
          </div>
        ))}
      </dl>
      <EstimateNote />
    </div>
  );
}

export function EstimateNote() {
  return (
    <p className="text-xs text-ink-600">
      Computed values are modelling estimates (group-contribution logP, standard atomic weights) — not safety or regulatory data.
    </p>
  );
}
