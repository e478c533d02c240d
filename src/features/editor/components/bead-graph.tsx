import { Background, Controls, Handle, Position, ReactFlow, type Edge, type Node, type NodeProps } from '@xyflow/react';
import '@xyflow/react/dist/style.css';
import { memo, useMemo } from 'react';
import type { MappingView } from '../model/bead-view';
import { textOn } from '../model/contrast';
import { centroid, type Point } from '../model/hull';
import { ThreadCountButton, type EditorThreads } from './thread-badges';

const CENTRE = { top: '50%', left: '50%', transform: 'translate(-50%, -50%)', opacity: 0, border: 0, minWidth: 1, minHeight: 1, width: 1, height: 1 } as const;

type BeadNode = Node<{ id: string; name: string; colour: string; active: boolean; threads?: EditorThreads }, 'bead'>;

const BeadNodeView = memo(function BeadNodeView({ data }: NodeProps<BeadNode>) {
  return (
    <div
      className="relative flex size-11 items-center justify-center rounded-full border-2 text-xs font-bold shadow-card"
      style={{ background: data.colour, color: textOn(data.colour), borderColor: data.active ? '#0e3030' : '#fdfbf6' }}
      data-graph-bead={data.name}
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
const NODE = 44;

/** The CG bead graph: one node per bead at its atoms' 2D centroid, an edge per bead–bead bond. */
export function BeadGraph({ view, points, activeBead, onSelectBead, threads }: { view: MappingView; points: readonly Point[]; activeBead: string | null; onSelectBead(id: string): void; threads?: EditorThreads }) {
  // Centroids are scaled so the whole graph spans a few hundred units: nodes stay legible for a
  // long chain and do not pile up for a compact ring system.
  const scale = useMemo(() => {
    const xs = points.map((p) => p.x);
    const ys = points.map((p) => p.y);
    const extent = Math.max(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys), 1);
    return Math.min(1.8, Math.max(0.5, 360 / extent));
  }, [points]);
  const nodes = useMemo<BeadNode[]>(
    () =>
      view.beads
        .filter((b) => b.atoms.length > 0)
        .map((b) => {
          const c = centroid(b.atoms.map((a) => points[a.index]).filter(Boolean));
          return {
            id: b.id,
            type: 'bead',
            position: { x: c.x * scale - NODE / 2, y: c.y * scale - NODE / 2 },
            data: { id: b.id, name: b.name, colour: b.colour, active: b.id === activeBead, threads },
            selected: b.id === activeBead,
            ariaLabel: `Bead ${b.name}`,
          };
        }),
    [view, points, activeBead, scale, threads],
  );
  const edges = useMemo<Edge[]>(
    () => view.links.map(([p, q]) => ({ id: `${p}-${q}`, source: p, target: q, type: 'straight', style: { stroke: '#174c4a', strokeWidth: 2.5 }, zIndex: -1 })),
    [view],
  );

  return (
    <div className="h-full min-h-56" aria-label="Bead graph" role="region">
      <ReactFlow
        nodes={nodes}
        edges={edges}
        nodeTypes={nodeTypes}
        nodesDraggable={false}
        nodesConnectable={false}
        edgesFocusable={false}
        fitView
        fitViewOptions={{ padding: 0.25 }}
        key={nodes.length === 0 ? 'empty' : 'beads'}
        minZoom={0.2}
        onNodeClick={(_e, node) => onSelectBead(node.id)}
        onNodesChange={(changes) => {
          for (const c of changes) if (c.type === 'select' && c.selected) onSelectBead(c.id);
        }}
      >
        <Background gap={24} color="#e2d7bf" />
        <Controls showInteractive={false} position="bottom-right" />
      </ReactFlow>
    </div>
  );
}
