import { textOn } from '../../../shared/drawing/contrast';
import type { Peer } from '../model/presence';
import { toScreen, type Viewport } from '../model/viewport';

/** Other people's pointers, in screen space so they keep their size at any zoom. */
export function PeerPointers({ peers, viewport }: { peers: readonly Peer[]; viewport: Viewport }) {
  return (
    <g pointerEvents="none" aria-hidden="true">
      {peers
        .filter((p) => !p.isLocal && p.pointer)
        .map((p) => {
          const s = toScreen(viewport, p.pointer!);
          return (
            <g key={p.clientId} transform={`translate(${s.x},${s.y})`} data-pointer={p.user.name}>
              <path d="M0,0 L0,16 L4.5,12 L8,19 L10.5,18 L7,11 L12.5,11 Z" fill={p.user.colour} stroke="#fdfbf6" strokeWidth={1.2} />
              <g transform="translate(12,20)">
                <rect x={0} y={0} width={p.user.name.length * 6.6 + 10} height={17} rx={8.5} fill={p.user.colour} />
                <text x={5} y={12.5} fontSize={11} fontWeight={600} fill={textOn(p.user.colour)}>{p.user.name}</text>
              </g>
            </g>
          );
        })}
    </g>
  );
}
