import { memo } from 'react';
import type { Point } from '../../../shared/drawing/hull';
import { BOND } from '../../../shared/drawing/layout';
import type { Peer } from '../model/presence';

interface HighlightLayerProps {
  points: readonly Point[];
  selection: ReadonlySet<number>;
  highlight: readonly number[];
  peers: readonly Peer[];
  cursor: number | null;
}

/**
 * Everything about atoms that changes often: my selection (filled ink discs), others' selections
 * (rings in their colour), atoms a check points at (warning rings) and the keyboard cursor. Only
 * the atoms concerned are drawn, so a selection change costs its size, not the molecule's.
 */
export const HighlightLayer = memo(function HighlightLayer({ points, selection, highlight, peers, cursor }: HighlightLayerProps) {
  return (
    <g pointerEvents="none">
      {peers.filter((p) => !p.isLocal).map((peer) =>
        peer.selection.map((a) =>
          points[a] ? (
            <circle key={`${peer.clientId}-${a}`} cx={points[a].x} cy={points[a].y} r={BOND * 0.4} fill="none" stroke={peer.user.colour} strokeWidth={2.5} strokeDasharray="5 3" data-peer-selected={a} />
          ) : null,
        ),
      )}
      {[...selection].map((a) =>
        points[a] ? <circle key={`s${a}`} cx={points[a].x} cy={points[a].y} r={BOND * 0.3} className="fill-ink-500/35 stroke-ink-700" strokeWidth={2} data-selected={a} /> : null,
      )}
      {highlight.map((a) =>
        points[a] ? <circle key={`c${a}`} cx={points[a].x} cy={points[a].y} r={BOND * 0.46} fill="none" className="stroke-alert-600" strokeWidth={3} data-flagged={a} /> : null,
      )}
      {cursor !== null && points[cursor] && (
        <rect x={points[cursor].x - BOND * 0.45} y={points[cursor].y - BOND * 0.45} width={BOND * 0.9} height={BOND * 0.9} rx={6} fill="none" className="stroke-ink-900" strokeWidth={2} strokeDasharray="3 3" />
      )}
    </g>
  );
});
