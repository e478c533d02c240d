import { SIZE_CLASSES, type BeadTypeRow } from '../../../shared/bead-types';

const cell = 'w-full min-w-0 rounded border border-paper-400 bg-paper-50 px-1.5 py-0.5 text-sm text-ink-900 focus:border-ink-500';

interface RowProps {
  row: BeadTypeRow;
  index: number;
  canEdit: boolean;
  onChange(row: BeadTypeRow): void;
  onRemove(): void;
}

/** One bead type: plain text for readers, inputs (each labelled for screen readers) for editors. */
export function BeadTypeRowEditor({ row, index, canEdit, onChange, onRemove }: RowProps) {
  const label = (what: string) => `${what} of type ${row.name || index + 1}`;
  const num = (key: 'charge' | 'deltaGMin' | 'deltaGMax') => (
    <input type="number" step={key === 'charge' ? 1 : 0.5} aria-label={label(key === 'charge' ? 'Charge' : key === 'deltaGMin' ? 'Lowest ΔG' : 'Highest ΔG')} value={Number.isFinite(row[key]) ? row[key] : ''} onChange={(e) => onChange({ ...row, [key]: e.target.value === '' ? Number.NaN : Number(e.target.value) })} className={`${cell} w-20 tabular-nums`} />
  );
  if (!canEdit) {
    return (
      <tr className="border-b border-paper-200 tabular-nums">
        <td className="px-2 py-1.5 font-semibold">{row.name}</td>
        <td className="px-2 py-1.5">{row.heavyAtomsPerBead}</td>
        <td className="px-2 py-1.5">{row.charge}</td>
        <td className="px-2 py-1.5">{row.deltaGMin}</td>
        <td className="px-2 py-1.5">{row.deltaGMax}</td>
        <td className="px-2 py-1.5 text-ink-700">{row.description}</td>
      </tr>
    );
  }
  return (
    <tr className="border-b border-paper-200">
      <td className="px-1 py-1"><input aria-label={`Name of type ${index + 1}`} value={row.name} onChange={(e) => onChange({ ...row, name: e.target.value })} className={`${cell} w-24 font-semibold`} /></td>
      <td className="px-1 py-1">
        <select aria-label={label('Heavy atoms per bead')} value={row.heavyAtomsPerBead} onChange={(e) => onChange({ ...row, heavyAtomsPerBead: Number(e.target.value) as BeadTypeRow['heavyAtomsPerBead'] })} className={cell}>
          {SIZE_CLASSES.map((s) => <option key={s} value={s}>{s}</option>)}
        </select>
      </td>
      <td className="px-1 py-1">{num('charge')}</td>
      <td className="px-1 py-1">{num('deltaGMin')}</td>
      <td className="px-1 py-1">{num('deltaGMax')}</td>
      <td className="px-1 py-1"><input aria-label={label('Description')} value={row.description} onChange={(e) => onChange({ ...row, description: e.target.value })} className={cell} /></td>
      <td className="px-1 py-1">
        <button type="button" onClick={onRemove} aria-label={`Remove type ${row.name || index + 1}`} className="rounded px-2 py-0.5 text-xs font-semibold text-alert-700 hover:bg-alert-50">Remove</button>
      </td>
    </tr>
  );
}
