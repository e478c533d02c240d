import { memo, useMemo } from 'react';
import { hullPath, type Point } from '../../../shared/drawing/hull';
import { placeBeadTags, TAG_HEIGHT, type TagPlacement } from '../../../shared/drawing/bead-labels';
import { BOND } from '../../../shared/drawing/layout';
import type { BeadView, MappingView } from '../model/bead-view';
import { textOn } from '../../../shared/drawing/contrast';

import { HULL_MARGIN } from '../../../shared/drawing/svg-markup';

const MARGIN = HULL_MARGIN;

interface HullLayerProps {
  view: MappingView;
  points: readonly Point[];
  activeBead: string | null;
}

// One memoised element per bead: the view keeps unchanged beads' objects (model/stable-view.ts),
// so an edit recomputes the hulls and tags of the beads it touched and no others.

const beadPoints = (bead: BeadView, points: readonly Point[]) => bead.atoms.map((a) => points[a.index]).filter(Boolean);

// Each bead's outline is drawn twice (painted, and as a click target), so it is computed once per
// bead object: the view keeps an unchanged bead's object, so the cache holds until an edit touches it.
const outlines = new WeakMap<BeadView, { points: readonly Point[]; d: string }>();
function outline(bead: BeadView, points: readonly Point[]): string {
  const hit = outlines.get(bead);
  if (hit?.points === points) return hit.d;
  const d = hullPath(beadPoints(bead, points), MARGIN);
  outlines.set(bead, { points, d });
  return d;
}

/** Beads as soft translucent hulls round their atoms, each with its name on a tag above it. */
export const HullLayer = memo(function HullLayer({ view, points, activeBead }: HullLayerProps) {
  return (
    <g>
      {view.beads.map((b) => (
        <BeadHull key={b.id} bead={b} points={points} active={b.id === activeBead} />
      ))}
    </g>
  );
});

const BeadHull = memo(function BeadHull({ bead, points, active }: { bead: BeadView; points: readonly Point[]; active: boolean }) {
  return (
    <path
      d={outline(bead, points)}
      fill={bead.colour}
      fillOpacity={active ? 0.42 : 0.26}
      stroke={bead.colour}
      strokeOpacity={0.9}
      strokeWidth={active ? 3.5 : 1.5}
      strokeLinejoin="round"
    />
  );
});

/**
 * The hulls again, unpainted (pointer-events all still hit-tests their area), in the canvas's top
 * layer: the painted hulls sit under the structure drawing, in a layer that takes no pointer events.
 */
export const HullTargets = memo(function HullTargets({ view, points }: Omit<HullLayerProps, 'activeBead'>) {
  return (
    <g fill="none" pointerEvents="all">
      {view.beads.map((b) => (
        <HullTarget key={b.id} bead={b} points={points} />
      ))}
    </g>
  );
});

const HullTarget = memo(function HullTarget({ bead, points }: { bead: BeadView; points: readonly Point[] }) {
  return <path d={outline(bead, points)} data-bead={bead.id} />;
});

/** Bead names, drawn above the structure so labels are never hidden under bonds; placed off atom symbols (shared placement). */
export const BeadTags = memo(function BeadTags({ view, points, labelled }: Omit<HullLayerProps, 'activeBead'> & { labelled?: (i: number) => boolean }) {
  const tags = useMemo(() => placeBeadTags(view.beads, points, labelled ?? (() => false), MARGIN), [view.beads, points, labelled]);
  return (
    <g fontSize={BOND * 0.3} fontWeight={700} textAnchor="middle" dominantBaseline="central" pointerEvents="none">
      {view.beads.map((b, i) => (
        <BeadTag key={b.id} bead={b} tag={tags[i]} />
      ))}
    </g>
  );
});

const BeadTag = memo(function BeadTag({ bead, tag }: { bead: BeadView; tag: TagPlacement | null }) {
  if (!tag) return null;
  return (
    <g transform={`translate(${tag.x},${tag.y})`} data-bead-tag={bead.name}>
      <rect x={-tag.width / 2} y={-TAG_HEIGHT / 2} width={tag.width} height={TAG_HEIGHT} rx={TAG_HEIGHT / 2} fill={bead.colour} />
      <text fill={textOn(bead.colour)}>{bead.name}</text>
    </g>
  );
});
