import { memo } from 'react';
import type { MoleculeSketch } from '../../../shared/molecules';

/** A small line drawing from the server's sketch (its 2D coordinates), for lists. */
export const MoleculeThumbnail = memo(function MoleculeThumbnail({ sketch, label, size = 96 }: { sketch: MoleculeSketch; label: string; size?: number }) {
  const xs = sketch.atoms.map((a) => a[1]);
  const ys = sketch.atoms.map((a) => a[2]);
  const minX = Math.min(...xs, 0);
  const minY = Math.min(...ys, 0);
  const w = Math.max(Math.max(...xs, 0) - minX, 1);
  const h = Math.max(Math.max(...ys, 0) - minY, 1);
  const pad = 0.8;
  return (
    <svg role="img" aria-label={`Structure of ${label}`} viewBox={`${minX - pad} ${minY - pad} ${w + 2 * pad} ${h + 2 * pad}`} width={size} height={size} className="shrink-0 rounded-md border border-paper-300 bg-paper-50">
      <g className="stroke-ink-800" strokeWidth={0.09} strokeLinecap="round">
        {sketch.bonds.map(([a, b, order], i) => {
          const [, x1, y1] = sketch.atoms[a];
          const [, x2, y2] = sketch.atoms[b];
          // Double and triple bonds as parallel lines, 0.14 bond lengths apart.
          const len = Math.hypot(x2 - x1, y2 - y1) || 1;
          const nx = (-(y2 - y1) / len) * 0.14;
          const ny = ((x2 - x1) / len) * 0.14;
          const offsets = order === 2 ? [-0.5, 0.5] : order === 3 ? [-1, 0, 1] : [0];
          return (
            <g key={i}>
              {offsets.map((o) => <line key={o} x1={x1 + nx * o} y1={y1 + ny * o} x2={x2 + nx * o} y2={y2 + ny * o} />)}
            </g>
          );
        })}
      </g>
      <g fontSize={0.55} fontWeight={700} textAnchor="middle" dominantBaseline="central">
        {sketch.atoms.map(([el, x, y], i) =>
          el === 'C' ? null : (
            <text key={i} x={x} y={y} className="fill-ink-900 stroke-paper-50" strokeWidth={0.25} paintOrder="stroke">{el}</text>
          ),
        )}
      </g>
    </svg>
  );
});
