import { THEME_COLOURS } from '../../../shared/drawing/theme-colours';
import type { PlacedBead } from '../../../shared/exports';
import type { MoleculeSketch } from '../../../shared/molecules';

const COLOURS = Object.values(THEME_COLOURS.bead);

/**
 * Where an import would put its beads: the molecule's line drawing with every atom a dot in its
 * bead's colour (grey when no bead takes it) and each bead's name at its atoms' centre. Atoms are
 * numbered from 1 on hover (title), as in the file.
 */
export function ImportPreviewPicture({ sketch, beads, label }: { sketch: MoleculeSketch; beads: readonly PlacedBead[]; label: string }) {
  const colourOf = new Map<number, string>();
  beads.forEach((b, k) => b.atoms.forEach(([n]) => colourOf.set(n - 1, COLOURS[k % COLOURS.length])));
  const xs = sketch.atoms.map((a) => a[1]);
  const ys = sketch.atoms.map((a) => a[2]);
  const [minX, minY] = [Math.min(...xs, 0), Math.min(...ys, 0)];
  const [w, h] = [Math.max(Math.max(...xs, 0) - minX, 1), Math.max(Math.max(...ys, 0) - minY, 1)];
  const pad = 1;
  return (
    <svg role="img" aria-label={label} viewBox={`${minX - pad} ${minY - pad} ${w + 2 * pad} ${h + 2 * pad}`} className="h-64 w-full rounded-md border border-paper-300 bg-paper-50">
      <g className="stroke-ink-700" strokeWidth={0.08} strokeLinecap="round">
        {sketch.bonds.map(([a, b], i) => <line key={i} x1={sketch.atoms[a][1]} y1={sketch.atoms[a][2]} x2={sketch.atoms[b][1]} y2={sketch.atoms[b][2]} />)}
      </g>
      {sketch.atoms.map(([el, x, y], i) => (
        <circle key={i} cx={x} cy={y} r={0.32} fill={colourOf.get(i) ?? '#d4d4d4'} stroke="#0e3030" strokeWidth={0.04} data-preview-atom={i + 1} data-bead-colour={colourOf.get(i) ?? 'none'}>
          <title>{`${el} ${i + 1}`}</title>
        </circle>
      ))}
      <g fontSize={0.5} fontWeight={700} textAnchor="middle" dominantBaseline="central">
        {beads.map((b) => {
          const pts = b.atoms.map(([n]) => sketch.atoms[n - 1]).filter(Boolean);
          if (!pts.length) return null;
          const cx = pts.reduce((s, p) => s + p[1], 0) / pts.length;
          const cy = pts.reduce((s, p) => s + p[2], 0) / pts.length;
          return <text key={b.id} x={cx} y={cy - 0.55} className="fill-ink-900 stroke-paper-50" strokeWidth={0.15} paintOrder="stroke">{b.name}</text>;
        })}
      </g>
    </svg>
  );
}
