import { memo } from 'react';
import type { BeadTypeRow } from '../../../shared/bead-types';
import type { Evaluation } from '../../../shared/chem';
import type { MappingView } from '../model/bead-view';
import { formatSigned } from '../model/number-format';

const ROW = 24;
const LEFT = 72;
const RIGHT = 230;
const WIDTH = 760;
/** The axis shows at most this far out (kJ/mol): a library's open-ended bands would otherwise squash every bead into one spot. */
const AXIS_LIMIT = 60;
const STEPS = [1, 2, 5, 10, 20, 50];

/**
 * ΔG_OW per bead against the bands of the project's bead-type library: one row per bead, the bands
 * of the neutral types of the bead's size class (all neutral types when it has none) shaded in turn,
 * the bead's partition value as a dot in its colour. Ionic beads have no partition value and say so.
 * Plain SVG: one small picture, no charting library.
 */
export const PartitionChart = memo(function PartitionChart({ view, evaluation, library }: { view: MappingView; evaluation: Evaluation | null; library: readonly BeadTypeRow[] }) {
  if (!evaluation || !view.beads.length) return <p className="text-sm text-ink-600">No beads evaluated yet.</p>;
  const byId = new Map(evaluation.beads.map((b) => [b.id, b]));
  const neutral = library.filter((t) => t.charge === 0);
  const values = evaluation.beads.map((b) => b.partitionDeltaG).filter((v): v is number => v !== null);
  const edges = neutral.flatMap((t) => [t.deltaGMin, t.deltaGMax]).filter((v) => Math.abs(v) <= AXIS_LIMIT);
  const lo = Math.floor(Math.min(...edges, ...values, -10) / 5) * 5;
  const hi = Math.ceil(Math.max(...edges, ...values, 10) / 5) * 5;
  const step = STEPS.find((st) => (hi - lo) / st <= 10) ?? 100;
  const x = (v: number) => LEFT + ((Math.min(Math.max(v, lo), hi) - lo) / (hi - lo || 1)) * (WIDTH - LEFT - RIGHT);
  const rows = view.beads.map((bead) => ({ bead, e: byId.get(bead.id) }));
  const height = rows.length * ROW + 28;
  const ticks = Array.from({ length: Math.floor((hi - lo) / step) + 1 }, (_, i) => Math.ceil(lo / step) * step + i * step).filter((t) => t <= hi);
  return (
    <figure className="flex flex-col gap-1">
      <svg role="img" aria-label="Partition free energy of each bead against the library's type bands" viewBox={`0 0 ${WIDTH} ${height}`} className="w-full max-w-3xl" fontSize={11}>
        {rows.map(({ bead, e }, i) => {
          const y = i * ROW;
          const bands = neutral.filter((t) => !e?.sizeClass || t.heavyAtomsPerBead === e.sizeClass).sort((a, b) => a.deltaGMin - b.deltaGMin);
          const v = e?.partitionDeltaG ?? null;
          return (
            <g key={bead.id} data-chart-bead={bead.name}>
              <text x={LEFT - 6} y={y + ROW / 2} textAnchor="end" dominantBaseline="central" className="fill-ink-900 font-semibold">{bead.name}</text>
              {bands.map((t, k) => (
                <rect key={t.name} x={x(t.deltaGMin)} y={y + 3} width={Math.max(x(t.deltaGMax) - x(t.deltaGMin), 1)} height={ROW - 6} className={k % 2 ? 'fill-ink-100' : 'fill-paper-200'}>
                  <title>{`${t.name}: ${formatSigned(t.deltaGMin, 1)} to ${formatSigned(t.deltaGMax, 1)} kJ/mol`}</title>
                </rect>
              ))}
              {v !== null ? (
                <circle cx={x(v)} cy={y + ROW / 2} r={6} fill={bead.colour} stroke="#0e3030" strokeWidth={1} data-delta-g={v}>
                  <title>{`${bead.name}: ΔG ${formatSigned(v, 1)} kJ/mol${e?.suggestedType ? `, suggested ${e.suggestedType}` : ''}`}</title>
                </circle>
              ) : null}
              <text x={WIDTH - RIGHT + 8} y={y + ROW / 2} dominantBaseline="central" className="fill-ink-700">
                {e?.ionic ? 'n/a (ionic)' : v !== null ? `${formatSigned(v, 1)}${e?.suggestedType ? ` · ${e.suggestedType}` : ''}` : '–'}
              </text>
            </g>
          );
        })}
        <g className="fill-ink-600">
          <line x1={LEFT} x2={WIDTH - RIGHT} y1={rows.length * ROW + 2} y2={rows.length * ROW + 2} className="stroke-ink-400" />
          {ticks.map((t) => (
            <text key={t} x={x(t)} y={rows.length * ROW + 16} textAnchor="middle">{formatSigned(t, 0)}</text>
          ))}
        </g>
      </svg>
      <figcaption className="text-xs text-ink-600">
        ΔG<sub>OW</sub> in kJ/mol (positive prefers octanol) at {evaluation.temperature} K; shaded: the library's neutral types of each bead's size class.
      </figcaption>
    </figure>
  );
});

/** Σ bead mass (shared atoms by weight, hydrogens with their atom) beside the molecule's weight: equal when every atom is mapped once. */
export function MassBalance({ evaluation, molecularWeight }: { evaluation: Evaluation | null; molecularWeight: number }) {
  if (!evaluation) return null;
  const sum = evaluation.beads.reduce((s, b) => s + b.mass, 0);
  const diff = sum - molecularWeight;
  const share = molecularWeight > 0 ? Math.min(sum / molecularWeight, 1.5) : 0;
  return (
    <div aria-label="Bead mass against molecular weight" role="group" className="flex flex-col gap-1 text-sm">
      <p>
        Σ bead mass <strong data-total="bead-mass">{sum.toFixed(2)}</strong> g/mol · molecular weight <strong>{molecularWeight.toFixed(2)}</strong> g/mol ·{' '}
        <span className={Math.abs(diff) > 0.005 ? 'font-semibold text-alert-700' : 'text-ok-700'} data-total="mass-difference">
          {Math.abs(diff) > 0.005 ? `differs by ${formatSigned(diff, 2)} g/mol` : 'equal'}
        </span>
      </p>
      <div className="relative h-2 w-full max-w-3xl rounded bg-paper-200" aria-hidden="true">
        <div className="absolute inset-y-0 left-0 rounded bg-ink-600" style={{ width: `${(share / 1.5) * 100}%` }} />
        <div className="absolute inset-y-[-2px] w-0.5 bg-ink-900" style={{ left: `${100 / 1.5}%` }} title="molecular weight" />
      </div>
    </div>
  );
}
