import { useEffect, useMemo, useRef, type KeyboardEvent } from 'react';
import { useCanvasGestures, type GestureHandlers } from '../hooks/use-canvas-gestures';
import { nextAtom, type Direction } from '../model/atom-cursor';
import type { MappingView } from '../model/bead-view';
import type { Drawing } from '../../../shared/drawing/layout';
import type { Peer } from '../model/presence';
import type { PeerGhosts } from '../model/proposal-ghosts';
import { GhostLayer } from './ghost-layer';
import type { Viewport } from '../model/viewport';
import { AtomColours, AtomNumbers } from './atom-marks-layer';
import { HighlightLayer } from './highlight-layer';
import { BeadTags, HullLayer, HullTargets } from './hull-layer';
import { PeerPointers } from './peer-pointers';
import { AtomTargets, StructureLayer } from './structure-layer';
import { ThreadBadgeLayer, type EditorThreads } from './thread-badges';

interface MoleculeCanvasProps {
  drawing: Drawing;
  neighbours: readonly (readonly number[])[];
  view: MappingView;
  selection: ReadonlySet<number>;
  highlight: readonly number[];
  peers: readonly Peer[];
  ghosts: readonly PeerGhosts[];
  activeBead: string | null;
  cursor: number | null;
  setCursor(atom: number): void;
  viewport: Viewport;
  setViewport(v: Viewport): void;
  onSize(size: { width: number; height: number }): void;
  gestures: GestureHandlers;
  readOnly: boolean;
  threads?: EditorThreads;
  /** Atom numbers (from 1) beside the atoms. */
  showNumbers: boolean;
  /** Each atom as a disc in its bead's colour. */
  colourAtoms: boolean;
}

const ARROWS: Record<string, Direction> = { ArrowLeft: 'left', ArrowRight: 'right', ArrowUp: 'up', ArrowDown: 'down' };

/** The shared drawing: structure, bead hulls, everyone's selections and pointers, zoom and pan. */
export function MoleculeCanvas(props: MoleculeCanvasProps) {
  const { drawing, view, viewport, setViewport, cursor, setCursor, gestures } = props;
  const svg = useRef<SVGSVGElement>(null);
  const { box, bind } = useCanvasGestures(svg, viewport, setViewport, gestures);
  const points = useMemo(() => drawing.atoms.map((a) => ({ x: a.x, y: a.y })), [drawing]);
  const labelled = useMemo(() => (i: number) => drawing.atoms[i]?.label !== null, [drawing]);
  const onSize = useRef(props.onSize);
  onSize.current = props.onSize;

  useEffect(() => {
    const el = svg.current;
    if (!el) return;
    const observer = new ResizeObserver(([entry]) => onSize.current({ width: entry.contentRect.width, height: entry.contentRect.height }));
    observer.observe(el);
    return () => observer.disconnect();
  }, []);

  // Arrow keys walk the atoms, Space selects the one under the cursor (Shift+Space adds it).
  const onKeyDown = (e: KeyboardEvent) => {
    const direction = ARROWS[e.key];
    if (direction && points.length) {
      e.preventDefault();
      e.stopPropagation();
      setCursor(cursor === null ? 0 : nextAtom(points, props.neighbours, cursor, direction));
    } else if ((e.key === ' ' || e.key === 'Enter') && cursor !== null) {
      e.preventDefault();
      e.stopPropagation();
      gestures.onAtom(cursor, e.shiftKey);
    }
  };

  const cursorAtom = cursor === null ? null : drawing.atoms[cursor];
  const transform = `translate(${viewport.x},${viewport.y}) scale(${viewport.k})`;
  // Three stacked drawings. The molecule's structure (thousands of bonds and labels) has an svg of
  // its own, which an edit never touches, so the browser keeps its layout and paint; hulls and
  // highlights are drawn under it, and the interactive layer on top holds the click targets, tags
  // and badges. The two lower layers take no pointer events: clicks reach the targets above.
  return (
    <div className="relative size-full rounded-md bg-paper-50">
      <svg aria-hidden="true" className="pointer-events-none absolute inset-0 size-full">
        <g transform={transform}>
          <HullLayer view={view} points={points} activeBead={props.activeBead} />
          {/* Highlights sit under the structure so element labels stay readable on selected atoms. */}
          <HighlightLayer points={points} selection={props.selection} highlight={props.highlight} peers={props.peers} cursor={cursor} />
          {props.colourAtoms && <AtomColours drawing={drawing} view={view} />}
        </g>
      </svg>
      {/* A compositor layer of its own: edits around it re-raster the layers above and below only. */}
      <svg aria-hidden="true" className="pointer-events-none absolute inset-0 size-full will-change-transform">
        <g transform={transform}>
          <StructureLayer drawing={drawing} />
          {props.showNumbers && <AtomNumbers drawing={drawing} />}
        </g>
      </svg>
      <svg
        ref={svg}
        role="application"
        aria-label={`Molecule drawing${props.readOnly ? ' (read-only)' : ''}. Arrow keys move between atoms, Space selects, Shift+Space adds.`}
        aria-describedby="canvas-cursor"
        tabIndex={0}
        onKeyDown={onKeyDown}
        className="absolute inset-0 block size-full touch-none select-none rounded-md focus-visible:outline-offset-[-3px]"
        {...bind}
      >
        <g transform={transform}>
          <GhostLayer ghosts={props.ghosts} points={points} />
          <HullTargets view={view} points={points} />
          <AtomTargets drawing={drawing} />
          <BeadTags view={view} points={points} labelled={labelled} />
          <ThreadBadgeLayer view={view} points={points} threads={props.threads} />
        </g>
        <PeerPointers peers={props.peers} viewport={viewport} />
        {box && (
          <rect
            x={Math.min(box.x1, box.x2) * viewport.k + viewport.x}
            y={Math.min(box.y1, box.y2) * viewport.k + viewport.y}
            width={Math.abs(box.x2 - box.x1) * viewport.k}
            height={Math.abs(box.y2 - box.y1) * viewport.k}
            className="fill-ink-300/15 stroke-ink-600"
            strokeDasharray="4 3"
            pointerEvents="none"
          />
        )}
        <desc id="canvas-cursor">{cursorAtom ? `Cursor on atom ${cursorAtom.index + 1}, ${cursorAtom.element}.` : 'No atom under the keyboard cursor.'}</desc>
      </svg>
    </div>
  );
}
