import { FormField } from '../../../components/ui/form-field';
import { SIZE_CLASSES, type BeadTypeRow } from '../../../shared/bead-types';

const cell = 'min-w-0 rounded px-1.5 py-0.5 text-sm';
const sizeOptions = SIZE_CLASSES.map((s) => ({ value: String(s), label: String(s) }));

/** One bead type as plain text, for readers. */
export function BeadTypeRowView({ row }: { row: BeadTypeRow }) {
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

/** One bead type as fields of the library form (`types.<index>.*`), each labelled for screen readers. */
export function BeadTypeRowEditor({ index, onRemove }: { index: number; onRemove(): void }) {
  const name = (key: string) => `types.${index}.${key}`;
  const label = (what: string) => `${what} of type ${index + 1}`;
  const num = (key: 'charge' | 'deltaGMin' | 'deltaGMax', what: string) => (
    <FormField name={name(key)} label={label(what)} hideLabel type="number" step={key === 'charge' ? 1 : 0.5} controlClassName={`${cell} w-20 tabular-nums`} />
  );
  return (
    <tr className="border-b border-paper-200 align-top">
      <td className="px-1 py-1"><FormField name={name('name')} label={label('Name')} hideLabel controlClassName={`${cell} w-24 font-semibold`} /></td>
      <td className="px-1 py-1"><FormField name={name('heavyAtomsPerBead')} label={label('Heavy atoms per bead')} hideLabel as="select" options={sizeOptions} controlClassName={cell} /></td>
      <td className="px-1 py-1">{num('charge', 'Charge')}</td>
      <td className="px-1 py-1">{num('deltaGMin', 'Lowest ΔG')}</td>
      <td className="px-1 py-1">{num('deltaGMax', 'Highest ΔG')}</td>
      <td className="px-1 py-1"><FormField name={name('description')} label={label('Description')} hideLabel controlClassName={cell} /></td>
      <td className="px-1 py-1">
        <button type="button" onClick={onRemove} aria-label={`Remove type ${index + 1}`} className="rounded px-2 py-0.5 text-xs font-semibold text-alert-700 hover:bg-alert-50">Remove</button>
      </td>
    </tr>
  );
}
