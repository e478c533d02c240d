import { memo } from 'react';
import { centroid, hullPath, type Point } from '../model/hull';
import { BOND } from '../model/layout';
import type { MappingView } from '../model/bead-view';
import { textOn } from '../model/contrast';

const MARGIN = BOND * 0.42;

interface HullLayerProps {
  view: MappingView;
  points: readonly Point[];
  activeBead: string | null;
}

/** Beads as soft translucent hulls round their atoms, each with its name on a tag above it. */
export const HullLayer = memo(function HullLayer({ view, points, activeBead }: HullLayerProps) {
  return (
    <g>
      {view.beads.map((b) => {
        const pts = b.atoms.map((a) => points[a.index]).filter(Boolean);
        return (
          <path
            key={b.id}
            d={hullPath(pts, MARGIN)}
            fill={b.colour}
            fillOpacity={b.id === activeBead ? 0.42 : 0.26}
            stroke={b.colour}
            strokeOpacity={0.9}
            strokeWidth={b.id === activeBead ? 3.5 : 1.5}
            strokeLinejoin="round"
            data-bead={b.id}
          />
        );
      })}
    </g>
  );
});

/** Bead names, drawn above the structure so labels are never hidden under bonds. */
export const BeadTags = memo(function BeadTags({ view, points }: Omit<HullLayerProps, 'activeBead'>) {
  return (
    <g fontSize={BOND * 0.3} fontWeight={700} textAnchor="middle" dominantBaseline="central" pointerEvents="none">
      {view.beads.map((b) => {
        const pts = b.atoms.map((a) => points[a.index]).filter(Boolean);
        if (pts.length === 0) return null;
        const c = centroid(pts);
        const top = Math.min(...pts.map((p) => p.y)) - MARGIN - BOND * 0.12;
        const width = Math.max(BOND * 0.7, b.name.length * BOND * 0.2 + BOND * 0.3);
        return (
          <g key={b.id} transform={`translate(${c.x},${top})`} data-bead-tag={b.name}>
            <rect x={-width / 2} y={-BOND * 0.2} width={width} height={BOND * 0.4} rx={BOND * 0.2} fill={b.colour} />
            <text fill={textOn(b.colour)}>{b.name}</text>
          </g>
        );
      })}
    </g>
  );
});
