import { useEffect, useEffectEvent, useMemo, useState, type KeyboardEvent } from 'react';
import type { BeadTypeRow } from '../../../shared/bead-types';
import type { Check, Molecule } from '../../../shared/chem';
import type { MappingDetail } from '../../../shared/mappings';
import type { MappingSession } from '../collab/mapping-session';
import { editorCommands } from '../commands';
import { commandForKey, run } from '../commands/registry';
import { useEditorState } from '../hooks/use-editor-state';
import { useSessionSnapshot } from '../hooks/use-mapping-session';
import { useMappingView } from '../hooks/use-mapping-view';
import { usePeers } from '../hooks/use-peers';
import { useGhosts } from '../hooks/use-ghosts';
import { ProposalPanel } from './proposal-panel';
import { unassignedAtoms } from '../model/bead-view';
import { markEditorReady, measureCommand } from '../model/perf-marks';
import { EditorLayout } from './editor-layout';
import type { EditorThreads } from './thread-badges';

interface MappingEditorProps {
  session: MappingSession;
  mapping: MappingDetail;
  molecule: Molecule;
  library: readonly BeadTypeRow[];
  threads?: EditorThreads;
  /** Beads a link asks to show (`?beads=id,id`, from an analysis term): ringed atoms, marked in the graph. */
  linkedBeads?: readonly string[];
}

const typing = (el: EventTarget) => el instanceof HTMLElement && (el.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(el.tagName));

/** The live mapping editor: wires the session, the document view and the editor state to the panels. */
export function MappingEditor({ session, mapping, molecule, library, threads, linkedBeads }: MappingEditorProps) {
  const snapshot = useSessionSnapshot(session);
  const view = useMappingView(session.doc, molecule.bonds);
  const peers = usePeers(session, molecule.atoms.length);
  const ghosts = useGhosts(session, molecule.atoms.length, snapshot.session?.userId ?? null);
  const evaluation = snapshot.evaluation ? snapshot.evaluation.evaluation : mapping.evaluation;
  const readOnly = !mapping.canEdit || snapshot.session === null || snapshot.session.readOnly || !snapshot.synced;
  const suggestions = useMemo(() => new Map(evaluation?.beads.map((b) => [b.id, b.suggestedType]) ?? []), [evaluation]);
  const state = useEditorState(session, molecule, view, readOnly, suggestions);
  const [activeCheck, setActiveCheck] = useState<Check | null>(null);
  useEffect(() => {
    if (snapshot.synced) markEditorReady();
  }, [snapshot.synced]);
  // A deep link (?bead=) selects its bead once the draft has it (once per link, not on every render).
  const linked = threads?.selectBead ?? null;
  const linkedPresent = !!linked && view.byId.has(linked);
  // An effect event: it reads the latest editor state without making every render re-select the bead.
  const selectLinked = useEffectEvent((beadId: string) => state.selectBead(beadId, false));
  useEffect(() => {
    if (linked && linkedPresent) selectLinked(linked);
  }, [linked, linkedPresent]);

  // A term's beads from a link: once the draft has any of them, ring their atoms and mark them.
  const linkedKey = linkedBeads?.filter((id) => view.byId.has(id)).join(',') ?? '';
  const showLinked = useEffectEvent((ids: string[]) => {
    state.setHighlight(ids.flatMap((id) => view.byId.get(id)?.atoms.map((a) => a.index) ?? []));
    state.setMarked(ids);
  });
  useEffect(() => {
    if (linkedKey) showLinked(linkedKey.split(','));
  }, [linkedKey]);

  const onKeyDown = (e: KeyboardEvent) => {
    if (typing(e.target) || state.helpOpen) return;
    const command = commandForKey(editorCommands, e);
    if (!command) return;
    e.preventDefault();
    if (run(command, state.ctx)) measureCommand(command.name);
  };

  const showCheck = (check: Check | null) => {
    setActiveCheck(check);
    state.setHighlight(check?.atoms ?? []);
  };

  return (
    <EditorLayout
      mappingId={mapping.id}
      onKeyDown={onKeyDown}
      state={state}
      snapshot={snapshot}
      peers={peers}
      ghosts={ghosts}
      proposals={<ProposalPanel session={session} mappingId={mapping.id} readOnly={readOnly} ghosts={ghosts} proposeRef={state.proposeRef} />}
      molecule={molecule}
      view={view}
      evaluation={evaluation}
      library={library}
      unassigned={unassignedAtoms(view, molecule.atoms.length).length}
      readOnlyReason={!mapping.canEdit ? (mapping.locked ? 'locked' : 'role') : (snapshot.session?.readOnlyReason ?? null)}
      activeCheck={activeCheck}
      onShowCheck={showCheck}
      threads={threads}
    />
  );
}
