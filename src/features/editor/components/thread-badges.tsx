import type { ReactNode } from 'react';
import { BOND } from '../../../shared/drawing/layout';
import type { MappingView } from '../model/bead-view';
import { centroid, type Point } from '../../../shared/drawing/hull';

/**
 * What the editor needs of comment threads; the app route fills it from the threads feature, so the
 * editor never imports it. Badges show a bead's open-thread count; pressing one opens the panel.
 */
export interface EditorThreads {
  counts: ReadonlyMap<string, number>;
  onOpen(beadId: string): void;
  /** The thread panel for beside the canvas, or null when closed. */
  panel(active: { id: string; name: string } | null): ReactNode;
  /** A bead to select once it is in the draft (the deep link's `?bead=`). */
  selectBead: string | null;
}

const label = (n: number, name: string) => `${n} open thread${n === 1 ? '' : 's'} on bead ${name}`;

/** The count badge as a button, for the bead table and the bead graph. */
export function ThreadCountButton({ threads, beadId, beadName, always = false }: { threads?: EditorThreads; beadId: string; beadName: string; always?: boolean }) {
  const n = threads?.counts.get(beadId) ?? 0;
  if (!threads || (!n && !always)) return null;
  return (
    <button
      type="button"
      data-thread-badge={beadId}
      aria-label={n ? label(n, beadName) : `Start a thread on bead ${beadName}`}
      onPointerDown={(e) => e.stopPropagation()}
      onClick={(e) => {
        e.stopPropagation();
        threads.onOpen(beadId);
      }}
      className={n ? 'nodrag rounded-full bg-alert-700 px-1.5 text-[0.7rem] leading-4 font-bold text-paper-50' : 'nodrag rounded-full border border-ink-300 px-1.5 text-[0.7rem] leading-4 text-ink-600 hover:bg-ink-50'}
    >
      {n ? n : '+'}
    </button>
  );
}

/** Badges on the drawing, at the top right of each bead with open threads. */
export function ThreadBadgeLayer({ view, points, threads }: { view: MappingView; points: readonly Point[]; threads?: EditorThreads }) {
  if (!threads) return null;
  const r = BOND * 0.2;
  return (
    <g fontSize={BOND * 0.26} fontWeight={700} textAnchor="middle" dominantBaseline="central">
      {view.beads.map((b) => {
        const n = threads.counts.get(b.id) ?? 0;
        const pts = b.atoms.map((a) => points[a.index]).filter(Boolean);
        if (!n || !pts.length) return null;
        const c = centroid(pts);
        const x = Math.max(...pts.map((p) => p.x)) + r;
        const y = Math.min(...pts.map((p) => p.y)) - r;
        return (
          <g
            key={b.id}
            role="button"
            tabIndex={0}
            aria-label={label(n, b.name)}
            data-thread-badge={b.id}
            transform={`translate(${Number.isFinite(x) ? x : c.x},${y})`}
            className="cursor-pointer"
            onPointerDown={(e) => e.stopPropagation()}
            onClick={(e) => {
              e.stopPropagation();
              threads.onOpen(b.id);
            }}
            onKeyDown={(e) => {
              if (e.key !== 'Enter' && e.key !== ' ') return;
              e.preventDefault();
              e.stopPropagation();
              threads.onOpen(b.id);
            }}
          >
            <circle r={r} fill="#8f330b" stroke="#fdfbf6" strokeWidth={r * 0.25} />
            <text fill="#fdfbf6">{n}</text>
          </g>
        );
      })}
    </g>
  );
}
