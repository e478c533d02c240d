import { memo } from 'react';
import { hullPath, type Point } from '../../../shared/drawing/hull';
import { BOND } from '../../../shared/drawing/layout';
import { HULL_MARGIN } from '../../../shared/drawing/svg-markup';
import type { PeerGhosts } from '../model/proposal-ghosts';

/**
 * Proposal ghosts over the drawing: dashed outlines in the proposer's colour with the proposed name,
 * for everyone in the mapping. They take no pointer events, so atoms stay clickable under them. A shared
 * atom lies inside the outline of each ghost that shares it.
 */
export const GhostLayer = memo(function GhostLayer({ ghosts, points }: { ghosts: readonly PeerGhosts[]; points: readonly Point[] }) {
  return (
    <g pointerEvents="none" data-ghosts="">
      {ghosts.map((g) =>
        g.proposal.beads.map((b) => {
          const at = b.atoms.map((a) => points[a]).filter(Boolean);
          if (!at.length) return null;
          // Ghosts that share atoms overlap there; the label sits over an atom the ghost holds wholly
          // when it has one, so two labels do not land on the same shared atom.
          const weights = b.weights;
          const whole = weights ? b.atoms.filter((_a, k) => weights[k] >= 1).map((a) => points[a]).filter(Boolean) : at;
          const top = (whole.length ? whole : at).reduce((p, q) => (q.y < p.y ? q : p));
          return (
            <g key={`${g.id}:${b.key}`} data-ghost={b.name} data-ghost-owner={g.isLocal ? 'you' : g.user.name}>
              <path d={hullPath(at, HULL_MARGIN * 1.15)} fill={g.user.colour} fillOpacity={0.08} stroke={g.user.colour} strokeWidth={1.6} strokeDasharray="5 4" />
              <text x={top.x} y={top.y - HULL_MARGIN * 1.6} fontSize={BOND * 0.26} fontWeight={600} textAnchor="middle" fill={g.user.colour}>
                {b.name}?
              </text>
            </g>
          );
        }),
      )}
    </g>
  );
});
