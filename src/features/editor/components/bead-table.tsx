import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type Row as TableRow } from '@tanstack/react-table';
import { memo, useMemo } from 'react';
import type * as Y from 'yjs';
import type { BeadEvaluation, Evaluation, PartitionBasis, PartitionSource } from '../../../shared/chem';
import { PARTITION_BASES, setPartitionBasis, setType } from '../../../shared/mapping-doc';
import type { BeadView, MappingView } from '../model/bead-view';
import { formatFixed, formatMass, formatSigned } from '../model/number-format';
import { ThreadCountButton, type EditorThreads } from './thread-badges';

interface Row {
  bead: BeadView;
  ev: BeadEvaluation | undefined;
}

/** What the suggestion buttons need to write a type into the draft. */
interface Editing {
  doc: Y.Doc;
  origin: unknown;
  readOnly: boolean;
}

interface BeadTableProps extends Editing {
  view: MappingView;
  activeBead: string | null;
  evaluation: Evaluation | null;
  onSelectBead(id: string): void;
  threads?: EditorThreads;
}

const col = createColumnHelper<Row>();
const CENTRE_LABEL = { mass: 'Mass', geometry: 'Geometry', 'geometry-heavy': 'Geometry (heavy)' } as const;
export const IONIC_TEXT = 'n/a (ionic)';
const BASIS_LABEL: Record<PartitionBasis, string> = { fragment: 'fragment (bead cut out and capped)', atoms: 'atom sum (Σ atom contributions)' };
const SOURCE_LABEL: Record<PartitionSource, string> = { measured: 'measured', fragment: 'fragment', atoms: 'atom sum', ionic: IONIC_TEXT };

/** A partition estimate of a bead, or "n/a (ionic)" for a charged bead, which has none. */
const estimate = (ev: BeadEvaluation | undefined, v: number | null | undefined, digits: number) =>
  ev?.ionic ? <span className="text-ink-600">{IONIC_TEXT}</span> : formatSigned(v, digits);

/**
 * One row per bead with the server's live numbers; a row press selects the bead. The columns stay
 * the same objects between renders and each row is memoised on its bead and its numbers, so an edit
 * redraws the rows of the beads it changed, not every cell of the table.
 */
export const BeadTable = memo(function BeadTable({ view, activeBead, evaluation, onSelectBead, threads, doc, origin, readOnly }: BeadTableProps) {
  const rows = useMemo(() => {
    const byId = new Map(evaluation?.beads.map((b) => [b.id, b]));
    return view.beads.map((bead) => ({ bead, ev: byId.get(bead.id) }));
  }, [view, evaluation]);
  const editing = useMemo<Editing>(() => ({ doc, origin, readOnly }), [doc, origin, readOnly]);

  const columns = useMemo(
    () => [
      col.accessor((r) => r.bead.name, {
        id: 'name',
        header: 'Bead',
        cell: ({ row }) => (
          <span className="flex items-center gap-2 font-semibold">
            <span aria-hidden="true" className="size-3 shrink-0 rounded-full" style={{ background: row.original.bead.colour }} />
            {row.original.bead.name}
            <ThreadCountButton threads={threads} beadId={row.original.bead.id} beadName={row.original.bead.name} always />
          </span>
        ),
      }),
      col.accessor((r) => r.bead.type ?? '', { id: 'type', header: 'Type', cell: (c) => c.getValue() || <span className="text-ink-400">none</span> }),
      col.accessor((r) => r.ev?.heavyAtoms, { id: 'heavy', header: 'Heavy atoms', cell: (c) => formatFixed(c.getValue(), 2).replace(/\.00$/, '') }),
      col.accessor((r) => r.ev?.sizeClass ?? null, { id: 'size', header: 'Size class (heavy atoms per bead)', cell: (c) => c.getValue() ?? '–' }),
      col.accessor((r) => r.ev?.mass, { id: 'mass', header: 'Mass (g/mol)', cell: (c) => formatMass(c.getValue()) }),
      col.accessor((r) => r.ev?.charge, { id: 'charge', header: 'Charge', cell: (c) => formatSigned(c.getValue(), 2) }),
      col.accessor((r) => r.ev?.deltaG, { id: 'dg', header: 'ΔG from atom sum (kJ/mol)', cell: (c) => estimate(c.row.original.ev, c.getValue(), 1) }),
      col.accessor((r) => r.ev?.fragmentDeltaG, { id: 'dg-fragment', header: 'ΔG from fragment (kJ/mol)', cell: (c) => estimate(c.row.original.ev, c.getValue(), 1) }),
      col.display({
        id: 'dg-measured',
        header: 'Measured ΔG (kJ/mol)',
        cell: ({ row }) => {
          const ev = row.original.ev;
          if (typeof ev?.measuredDeltaG !== 'number') return <span className="text-ink-400">–</span>;
          return <span title={`Source: ${ev.measuredSource ?? ''}`}>{formatSigned(ev.measuredDeltaG, 1)} <span className="text-xs text-ink-600">(measured)</span></span>;
        },
      }),
      col.accessor((r) => r.ev?.partitionSource ?? null, { id: 'dg-used', header: 'Suggestion uses', cell: (c) => { const v = c.getValue(); return v ? SOURCE_LABEL[v] : '–'; } }),
      col.display({
        id: 'suggested',
        header: 'Suggested type',
        cell: ({ row }) => <Suggestion editing={editing} row={row.original} />,
      }),
      col.accessor((r) => r.bead.centre, { id: 'centre', header: 'Centre', cell: (c) => CENTRE_LABEL[c.getValue()] }),
      col.accessor((r) => r.ev?.centre ?? null, {
        id: 'centre-xyz',
        header: 'Centre x, y, z (Å)',
        // Null until the molecule has 3D coordinates (an uploaded structure or the background conformer).
        cell: (c) => {
          const xyz = c.getValue();
          return xyz ? <span className="font-mono whitespace-nowrap">{xyz.map((v) => v.toFixed(2)).join(', ')}</span> : <span className="text-ink-400">no 3D yet</span>;
        },
      }),
    ],
    [editing, threads],
  );

  const table = useReactTable({ data: rows, columns, getCoreRowModel: getCoreRowModel(), getRowId: (r) => r.bead.id });

  // The table and its header are there from the start (an empty draft shows one message row), so the
  // first bead adds a row instead of mounting the table, its column model and its header mid-command.
  return (
    <div className="flex flex-col gap-2">
      <PartitionBar evaluation={evaluation} editing={editing} />
    <div className="overflow-x-auto">
      <table aria-label="Beads" className="w-full border-collapse text-sm">
        <thead>
          {table.getHeaderGroups().map((g) => (
            <tr key={g.id} className="border-b border-paper-300 text-left text-xs text-ink-600">
              {g.headers.map((h) => (
                <th key={h.id} scope="col" className="px-2 py-1.5 font-semibold whitespace-nowrap">
                  {flexRender(h.column.columnDef.header, h.getContext())}
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.length === 0 && (
            <tr>
              <td colSpan={columns.length} className="py-6 text-center text-sm text-ink-600">
                No beads yet. Select atoms on the drawing and press <strong>Make bead</strong> (B).
              </td>
            </tr>
          )}
          {table.getRowModel().rows.map((r) => (
            <BeadRow key={r.id} row={r} bead={r.original.bead} ev={r.original.ev} active={activeBead === r.id} columns={columns} onSelectBead={onSelectBead} />
          ))}
        </tbody>
      </table>
    </div>
    </div>
  );
});

/** The mapping's partition basis (who may edit sets it) and what the ΔG numbers are. */
function PartitionBar({ evaluation, editing }: { evaluation: Evaluation | null; editing: Editing }) {
  const basis = evaluation?.partitionBasis ?? 'fragment';
  const t = evaluation?.temperature ?? 298.15;
  return (
    <div className="flex flex-wrap items-center gap-x-4 gap-y-1 text-xs text-ink-700">
      <label className="flex items-center gap-1.5 font-semibold">
        Type suggestions use
        <select
          aria-label="Partition basis of suggestions"
          value={basis}
          disabled={editing.readOnly}
          onChange={(e) => setPartitionBasis(editing.doc, e.target.value as PartitionBasis, editing.origin)}
          className="rounded border border-paper-400 bg-paper-50 px-1.5 py-0.5 text-xs text-ink-900 disabled:opacity-60"
        >
          {PARTITION_BASES.map((b) => <option key={b} value={b}>{BASIS_LABEL[b]}</option>)}
        </select>
      </label>
      <span>A measured value, where a bead has one, comes first. Charged beads have no partition value ({IONIC_TEXT}).</span>
      <span>logP is a 298 K quantity; ΔG_OW = ln10·R·T·logP at T = {t.toFixed(2)} K, so ΔG scales linearly with T.</span>
    </div>
  );
}

interface BeadRowProps {
  row: TableRow<Row>;
  // What the row shows; the memo compares these, not the table's freshly built row object.
  bead: BeadView;
  ev: BeadEvaluation | undefined;
  active: boolean;
  // Only compared: new column definitions mean every cell must render again.
  columns: readonly unknown[];
  onSelectBead(id: string): void;
}

const sameRow = (a: BeadRowProps, b: BeadRowProps) => a.bead === b.bead && a.ev === b.ev && a.active === b.active && a.columns === b.columns && a.onSelectBead === b.onSelectBead;

const BeadRow = memo(function BeadRow({ row, bead, active, onSelectBead }: BeadRowProps) {
  return (
    <tr
      tabIndex={0}
      aria-current={active || undefined}
      aria-label={`Bead ${bead.name}`}
      onClick={() => onSelectBead(bead.id)}
      onKeyDown={(e) => (e.key === 'Enter' || e.key === ' ') && (e.preventDefault(), onSelectBead(bead.id))}
      className="cursor-pointer border-b border-paper-200 tabular-nums hover:bg-ink-50 aria-[current=true]:bg-ink-100"
    >
      {row.getVisibleCells().map((c) => (
        <td key={c.id} className="px-2 py-1.5 whitespace-nowrap" data-column={c.column.id}>
          {flexRender(c.column.columnDef.cell, c.getContext())}
        </td>
      ))}
    </tr>
  );
}, sameRow);

function Suggestion({ editing, row }: { editing: Editing; row: Row }) {
  const s = row.ev?.suggestedType;
  if (!s) return <span className="text-ink-400">–</span>;
  const fits = row.ev?.suggestedTypeFits !== false;
  const label = fits ? s : `${s} (nearest)`;
  if (editing.readOnly || row.bead.type === s) return <span>{label}</span>;
  return (
    <button
      type="button"
      onClick={(e) => {
        e.stopPropagation();
        setType(editing.doc, row.bead.id, s, editing.origin);
      }}
      className="rounded border border-ink-300 bg-paper-50 px-1.5 py-0.5 text-xs font-semibold text-ink-800 hover:bg-ink-50"
      aria-label={`Use suggested type ${s} for bead ${row.bead.name}`}
    >
      Use {label}
    </button>
  );
}
