import { useMemo } from 'react';
import { Link } from 'react-router';
import type { Molecule } from '../../../shared/chem';
import { exportUrl } from '../../../shared/exports';
import { paths } from '../../../lib/paths';
import { useAnalysedMapping } from '../api/get-analysed-mapping';
import { termBeads } from '../model/term-beads';

const INK = '#1f4e5a';
const PICK = '#c2762b';

export interface PickedTerm {
  kind: string;
  beads: string[];
  beadIds: string[];
}

interface Props {
  term: PickedTerm;
  mappingId: number;
  versionNumber: number | null;
  molecule: Pick<Molecule, 'atoms' | 'bonds'>;
}

/**
 * Where a picked term sits: the analysed state's drawing (the server's picture) with the term's atoms
 * ringed, and the bead graph with its beads and bonds marked; a link opens the editor with them.
 */
export function TermBeadsView({ term, mappingId, versionNumber, molecule }: Props) {
  const mapping = useAnalysedMapping(mappingId, versionNumber);
  const t = useMemo(() => (mapping.data ? termBeads(mapping.data, molecule, term.beadIds) : null), [mapping.data, molecule, term.beadIds]);
  const state = versionNumber === null ? 'the draft' : `version ${versionNumber}`;
  const label = `${term.kind} ${term.beads.join('–')}`;
  if (mapping.error) return <p role="alert" className="text-alert-700">The beads of {state} could not be loaded.</p>;
  if (!t) return <p className="text-ink-600">Loading the beads…</p>;
  const xs = t.nodes.map((n) => n.x);
  const ys = t.nodes.map((n) => n.y);
  const pad = 0.8;
  const box = xs.length ? [Math.min(...xs) - pad, Math.min(...ys) - pad, Math.max(...xs) - Math.min(...xs) + 2 * pad, Math.max(...ys) - Math.min(...ys) + 2 * pad] : [0, 0, 1, 1];
  const at = new Map(t.nodes.map((n) => [n.id, n]));
  const r = 0.32;
  return (
    <div role="region" aria-label={`Beads of the ${label}`} aria-live="polite" className="flex flex-col gap-2">
      <p className="font-semibold text-ink-900">
        {label} in {state}
      </p>
      {t.missing.length > 0 && <p className="text-alert-700">The draft no longer has {t.missing.length === 1 ? 'one of these beads' : 'some of these beads'} (edited since the analysis).</p>}
      <img
        src={exportUrl(mappingId, 'svg', versionNumber ?? 'draft', t.atoms.map((a) => a + 1))}
        alt={`Drawing of ${state} with the atoms of ${term.beads.join(', ')} ringed`}
        className="max-h-64 w-full rounded border border-paper-300 bg-paper-50 object-contain"
      />
      <svg viewBox={box.join(' ')} role="img" aria-label={`Bead graph with ${term.beads.join(', ')} marked`} className="max-h-48 w-full rounded border border-paper-300 bg-paper-50" data-term-graph="">
        {t.edges.map((e) => {
          const a = at.get(e.a)!;
          const b = at.get(e.b)!;
          return <line key={`${e.a}|${e.b}`} x1={a.x} y1={a.y} x2={b.x} y2={b.y} stroke={e.picked ? PICK : INK} strokeOpacity={e.picked ? 1 : 0.35} strokeWidth={e.picked ? 0.14 : 0.06} />;
        })}
        {t.nodes.map((n) => (
          <g key={n.id} data-term-bead={n.name} data-picked={n.picked ? 'true' : 'false'}>
            <circle cx={n.x} cy={n.y} r={r} fill={n.picked ? PICK : '#fdfbf6'} stroke={n.picked ? PICK : INK} strokeOpacity={n.picked ? 1 : 0.5} strokeWidth={0.06} />
            <text x={n.x} y={n.y} dy="0.1" fontSize={0.28} fontWeight={700} textAnchor="middle" fill={n.picked ? '#fff' : INK}>
              {n.name}
            </text>
          </g>
        ))}
      </svg>
      <Link className="self-start underline" to={paths.mapping(mappingId, { beads: term.beadIds.join(',') })}>
        Open in the editor with these beads selected
      </Link>
    </div>
  );
}
