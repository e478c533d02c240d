import { Background, Controls, Handle, Position, ReactFlow, useReactFlow, type Edge, type Node, type NodeProps } from '@xyflow/react';
import '@xyflow/react/dist/style.css';
import { memo, useEffect, useMemo, useRef, type RefObject } from 'react';
import type { BeadView, MappingView } from '../model/bead-view';
import { textOn } from '../../../shared/drawing/contrast';
import { centroid, type Point } from '../../../shared/drawing/hull';
import { ThreadCountButton, type EditorThreads } from './thread-badges';

const CENTRE = { top: '50%', left: '50%', transform: 'translate(-50%, -50%)', opacity: 0, border: 0, minWidth: 1, minHeight: 1, width: 1, height: 1 } as const;

type BeadNode = Node<{ id: string; name: string; colour: string; active: boolean; threads?: EditorThreads }, 'bead'>;

const BeadNodeView = memo(function BeadNodeView({ data }: NodeProps<BeadNode>) {
  return (
    <div
      className="relative flex size-11 items-center justify-center rounded-full border-2 text-xs font-bold shadow-card"
      style={{ background: data.colour, color: textOn(data.colour), borderColor: data.active ? '#0e3030' : '#fdfbf6' }}
      data-graph-bead={data.name}
      data-active={data.active ? 'true' : undefined}
    >
      {data.name}
      <span className="absolute -top-1.5 -right-1.5">
        <ThreadCountButton threads={data.threads} beadId={data.id} beadName={data.name} />
      </span>
      {/* Both ends of every edge sit at the node's centre, so bonds read as centre-to-centre lines. */}
      <Handle type="target" position={Position.Top} style={CENTRE} isConnectable={false} />
      <Handle type="source" position={Position.Bottom} style={CENTRE} isConnectable={false} />
    </div>
  );
});

const nodeTypes = { bead: BeadNodeView };
const NONE: readonly string[] = [];
const NODE = 44;

interface BeadGraphProps {
  view: MappingView;
  points: readonly Point[];
  activeBead: string | null;
  /** Further beads to show as active (an analysis term's beads, from a link). */
  marked?: readonly string[];
  onSelectBead(id: string): void;
  threads?: EditorThreads;
}

/** A node with what it was built from: it is reused while all of that is the same. */
interface Cached {
  bead: BeadView;
  active: boolean;
  points: readonly Point[];
  threads: EditorThreads | undefined;
  node: BeadNode;
}

/**
 * The CG bead graph: one node per bead at its atoms' 2D centroid, an edge per bead–bead bond. Nodes
 * and edges of unchanged beads stay the same objects between renders, so React Flow re-measures and
 * redraws only the ones an edit touched.
 */
export const BeadGraph = memo(function BeadGraph({ view, points, activeBead, marked = NONE, onSelectBead, threads }: BeadGraphProps) {
  // Centroids are scaled so the whole graph spans a few hundred units: nodes stay legible for a
  // long chain and do not pile up for a compact ring system.
  const scale = useMemo(() => {
    const xs = points.map((p) => p.x);
    const ys = points.map((p) => p.y);
    const extent = Math.max(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys), 1);
    return Math.min(1.8, Math.max(0.5, 360 / extent));
  }, [points]);
  const nodeCache = useRef(new Map<string, Cached>());
  const nodes = useMemo<BeadNode[]>(() => {
    const next = new Map<string, Cached>();
    for (const b of view.beads) {
      if (b.atoms.length === 0) continue;
      const active = b.id === activeBead || marked.includes(b.id);
      const old = nodeCache.current.get(b.id);
      const same = old && old.bead === b && old.active === active && old.points === points && old.threads === threads;
      next.set(b.id, same ? old : { bead: b, active, points, threads, node: beadNode(b, active, points, scale, threads) });
    }
    nodeCache.current = next;
    return [...next.values()].map((c) => c.node);
  }, [view, activeBead, marked, points, scale, threads]);
  const edgeCache = useRef(new Map<string, Edge>());
  const edges = useMemo<Edge[]>(() => {
    const next = new Map<string, Edge>();
    for (const [p, q] of view.links) {
      const id = `${p}-${q}`;
      next.set(id, edgeCache.current.get(id) ?? { id, source: p, target: q, type: 'straight', style: EDGE_STYLE, zIndex: -1 });
    }
    edgeCache.current = next;
    return [...next.values()];
  }, [view.links]);
  // Which beads are drawn: the graph re-fits when this changes, unless the person moved the view.
  const membership = useMemo(() => nodes.map((n) => n.id).sort().join(' '), [nodes]);
  const userMoved = useRef(false);

  return (
    // Sized by its panel, never by its nodes: React Flow measuring a new node relays out this box only.
    <div className="h-full min-h-56 [contain:strict]" aria-label="Bead graph" role="region">
      <ReactFlow
        nodes={nodes}
        edges={edges}
        nodeTypes={nodeTypes}
        nodesDraggable={false}
        nodesConnectable={false}
        edgesFocusable={false}
        // Fits once there are beads, and again whenever the graph fills up after being emptied (the
        // prop going true queues a fit). Remounting the flow instead would force a layout of the page.
        fitView={nodes.length > 0}
        fitViewOptions={FIT}
        minZoom={0.2}
        // A move with a source event is the person's (wheel, drag, pinch); fitView's own moves have none.
        onMoveStart={(event) => void (event && (userMoved.current = true))}
        onNodeClick={(_e, node) => onSelectBead(node.id)}
        onNodesChange={(changes) => {
          for (const c of changes) if (c.type === 'select' && c.selected) onSelectBead(c.id);
        }}
      >
        <Background gap={24} color="#e2d7bf" />
        <Controls
          showInteractive={false}
          position="bottom-right"
          onZoomIn={() => void (userMoved.current = true)}
          onZoomOut={() => void (userMoved.current = true)}
          onFitView={() => void (userMoved.current = false)}
        />
        <RefitOnChange membership={membership} userMoved={userMoved} />
      </ReactFlow>
    </div>
  );
});

const FIT = { padding: 0.25 };

/**
 * Fits the graph to its panel whenever beads are added or removed, so no node ends up outside it —
 * unless the person zoomed or panned (then their view stays; the fit button hands it back).
 * React Flow queues the fit until the new nodes are measured.
 */
function RefitOnChange({ membership, userMoved }: { membership: string; userMoved: RefObject<boolean> }) {
  const flow = useReactFlow();
  const first = useRef(true);
  useEffect(() => {
    // The first fit is the fitView prop's.
    if (first.current) return void (first.current = false);
    if (membership && !userMoved.current) void flow.fitView(FIT);
  }, [membership, flow, userMoved]);
  return null;
}
const EDGE_STYLE = { stroke: '#174c4a', strokeWidth: 2.5 };

function beadNode(b: BeadView, active: boolean, points: readonly Point[], scale: number, threads: EditorThreads | undefined): BeadNode {
  const c = centroid(b.atoms.map((a) => points[a.index]).filter(Boolean));
  return {
    id: b.id,
    type: 'bead',
    position: { x: c.x * scale - NODE / 2, y: c.y * scale - NODE / 2 },
    data: { id: b.id, name: b.name, colour: b.colour, active, threads },
    selected: active,
    ariaLabel: `Bead ${b.name}`,
  };
}
