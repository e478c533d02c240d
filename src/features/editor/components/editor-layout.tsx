import { lazy, Suspense, type KeyboardEvent, type ReactNode } from 'react';
import type { BeadTypeRow } from '../../../shared/bead-types';
import type { Check, Evaluation, Molecule } from '../../../shared/chem';
import type { SessionSnapshot } from '../collab/mapping-session';
import type { useEditorState } from '../hooks/use-editor-state';
import type { MappingView } from '../model/bead-view';
import type { Peer } from '../model/presence';
import type { PeerGhosts } from '../model/proposal-ghosts';
import { BeadInspector } from './bead-inspector';
import { BeadTable } from './bead-table';
import { ChecksPanel } from './checks-panel';
import { EditorToolbar } from './editor-toolbar';
import { FontPrimer } from './font-primer';
import { MoleculeCanvas } from './molecule-canvas';
import { BondedTermsPanel } from './bonded-terms-panel';
import { Panel } from './panel';
import { MassBalance, PartitionChart } from './partition-chart';
import { ConnectionBadge, PresenceList } from './presence-bar';
import { ShortcutHelp } from './shortcut-help';
import { TotalsBar } from './totals-bar';
import type { EditorThreads } from './thread-badges';

interface EditorLayoutProps {
  mappingId: number;
  onKeyDown(e: KeyboardEvent): void;
  state: ReturnType<typeof useEditorState>;
  snapshot: SessionSnapshot;
  peers: readonly Peer[];
  ghosts: readonly PeerGhosts[];
  /** The proposal panel (propose, accept, dismiss). */
  proposals: ReactNode;
  molecule: Molecule;
  view: MappingView;
  evaluation: Evaluation | null;
  library: readonly BeadTypeRow[];
  unassigned: number;
  readOnlyReason: 'role' | 'locked' | null;
  activeCheck: Check | null;
  onShowCheck(check: Check | null): void;
  threads?: EditorThreads;
}

// The bead graph brings @xyflow/react and d3 (about a third of the editor's code): it loads beside
// the rest of the editor instead of holding it up.
const BeadGraph = lazy(() => import('./bead-graph').then((m) => ({ default: m.BeadGraph })));

const READ_ONLY_TEXT = { role: 'Students watch the draft live; editing is for modellers and supervisors.', locked: 'A production version is locked, so the draft is read-only until a supervisor unlocks it.' };

export function EditorLayout(p: EditorLayoutProps) {
  const { state, view } = p;
  const active = state.activeBead ? view.byId.get(state.activeBead) : undefined;
  const points = state.drawing.atoms;
  return (
    <div onKeyDown={p.onKeyDown} className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <TotalsBar molecule={p.molecule} beadCount={view.beads.length} unassigned={p.unassigned} />
        <div className="flex items-center gap-3">
          <PresenceList peers={p.peers} />
          <ConnectionBadge state={p.snapshot.connection} reason={p.snapshot.closedReason} />
        </div>
      </div>
      {p.readOnlyReason && <p className="rounded-md border border-ink-200 bg-ink-50 px-3 py-1.5 text-sm text-ink-800">{READ_ONLY_TEXT[p.readOnlyReason]}</p>}
      <EditorToolbar ctx={state.ctx} toggles={state.toggles} />
      <div className="grid gap-3 xl:grid-cols-[minmax(0,1fr)_22rem]">
        {/* Fixed size and strict containment: an edit relays out and repaints the drawing inside this box only. */}
        <div className="h-[34rem] overflow-hidden rounded-lg border border-paper-300 shadow-card [contain:strict]">
          <MoleculeCanvas
            drawing={state.drawing}
            neighbours={state.neighbours}
            view={view}
            selection={state.selection}
            highlight={state.highlight}
            peers={p.peers}
            ghosts={p.ghosts}
            activeBead={state.activeBead}
            cursor={state.cursor}
            setCursor={state.setCursor}
            viewport={state.viewport}
            setViewport={state.setViewport}
            onSize={state.onSize}
            gestures={state.gestures}
            readOnly={state.ctx.readOnly}
            threads={p.threads}
            showNumbers={state.showNumbers}
            colourAtoms={state.colourAtoms}
          />
        </div>
        <div className="flex flex-col gap-3">
          {p.threads?.panel(active ? { id: active.id, name: active.name } : null)}
          <Panel title="Proposal">{p.proposals}</Panel>
          <Panel title={active ? 'Active bead' : 'Selection'}>
            {active ? (
              <BeadInspector
                ctx={state.ctx}
                bead={active}
                evaluation={p.evaluation?.beads.find((b) => b.id === active.id)}
                library={p.library}
                renaming={state.renaming === active.id}
                onRenamed={state.endRename}
              />
            ) : (
              <p className="text-sm text-ink-700">
                {state.selection.size ? `${state.selection.size} atom${state.selection.size === 1 ? '' : 's'} selected.` : 'Nothing selected. Click atoms, drag a box, or press ? for shortcuts.'}
              </p>
            )}
          </Panel>
          <Panel title="Bead graph" className="h-64 p-0">
            <Suspense fallback={<p className="p-3 text-sm text-ink-600">Drawing the bead graph…</p>}>
              <BeadGraph view={view} points={points} activeBead={state.activeBead} marked={state.marked} onSelectBead={state.selectOnly} threads={p.threads} />
            </Suspense>
          </Panel>
          <Panel title="Checks">
            <ChecksPanel checks={p.evaluation?.checks ?? null} active={p.activeCheck} onShow={p.onShowCheck} />
          </Panel>
        </div>
      </div>
      <Panel title="Beads">
        <BeadTable
          view={view}
          activeBead={state.activeBead}
          evaluation={p.evaluation}
          onSelectBead={state.selectOnly}
          threads={p.threads}
          doc={state.ctx.doc}
          origin={state.ctx.origin}
          readOnly={state.ctx.readOnly}
        />
      </Panel>
      <Panel title="Partition free energy per bead, and mass balance">
        <div className="flex flex-col gap-3">
          <MassBalance evaluation={p.evaluation} molecularWeight={p.molecule.molecularWeight} />
          <PartitionChart view={view} evaluation={p.evaluation} library={p.library} />
        </div>
      </Panel>
      <Panel title="Bonded terms">
        <BondedTermsPanel mappingId={p.mappingId} doc={state.ctx.doc} origin={state.ctx.origin} readOnly={state.ctx.readOnly} topology={p.evaluation?.topology ?? null} molecule={p.molecule} />
      </Panel>
      {state.helpOpen && <ShortcutHelp onClose={() => state.setHelpOpen(false)} />}
      <FontPrimer />
    </div>
  );
}
