import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { throttle } from 'throttle-debounce';
import type { Molecule } from '../../../shared/chem';
import { freeIonAtoms } from '../../../shared/free-ions';
import type { MappingSession } from '../collab/mapping-session';
import type { EditorContext, EditorUi } from '../commands/registry';
import type { GestureHandlers } from './use-canvas-gestures';
import type { MappingView } from '../model/bead-view';
import { layoutMolecule } from '../../../shared/drawing/layout';
import { atomsInBox, clickAtom, EMPTY, selectMany, type Selection } from '../model/selection';
import { fitView, zoomAt, type Viewport } from '../model/viewport';

/**
 * The editor's own state (what I have selected, the active bead, zoom, panels) and the command
 * context built from it. The draft itself lives in the Yjs document, never here.
 */
export function useEditorState(session: MappingSession, molecule: Molecule, view: MappingView, readOnly: boolean, suggestions: ReadonlyMap<string, string | null>) {
  const [selection, setSelectionState] = useState<Selection>(EMPTY);
  const [activeBead, setActiveBead] = useState<string | null>(null);
  const [cursor, setCursor] = useState<number | null>(null);
  const [showHydrogens, setShowHydrogens] = useState(false);
  const [showNumbers, setShowNumbers] = useState(false);
  const [colourAtoms, setColourAtoms] = useState(false);
  const [helpOpen, setHelpOpen] = useState(false);
  const [renaming, setRenaming] = useState<string | null>(null);
  const [highlight, setHighlight] = useState<number[]>([]);
  // Beads a link marked (an analysis term's beads): ringed in the bead graph beside the active one.
  const [marked, setMarked] = useState<string[]>([]);
  const [viewport, setViewport] = useState<Viewport>({ x: 0, y: 0, k: 1 });
  const size = useRef<{ width: number; height: number } | null>(null);
  // The proposal panel puts its propose action here, so the P shortcut and the toolbar button run it.
  const proposeRef = useRef<() => void>(() => {});

  const drawing = useMemo(() => layoutMolecule(molecule, showHydrogens), [molecule, showHydrogens]);
  const neighbours = useMemo(() => {
    const n: number[][] = molecule.atoms.map(() => []);
    for (const b of molecule.bonds) {
      n[b.a].push(b.b);
      n[b.b].push(b.a);
    }
    return n;
  }, [molecule]);

  const setSelection = useCallback((next: Selection) => {
    setSelectionState(next);
    session.setPresence({ selection: [...next] });
  }, [session]);

  const fit = useCallback(() => {
    if (size.current) setViewport(fitView(drawing.bounds, size.current.width, size.current.height, 48, 2.2));
  }, [drawing]);
  const fitted = useRef(false);
  const onSize = useCallback((s: { width: number; height: number }) => {
    size.current = s;
    if (!fitted.current && s.width > 0) {
      fitted.current = true;
      setViewport(fitView(drawing.bounds, s.width, s.height, 48, 2.2));
    }
  }, [drawing]);

  // A bead deleted by anyone stops being active here.
  useEffect(() => {
    if (activeBead && !view.byId.has(activeBead)) setActiveBead(null);
  }, [view, activeBead]);
  useEffect(() => session.setPresence({ activeBead }), [session, activeBead]);

  // Memoised so that renders for other reasons (someone else's pointer moving) leave the toolbar
  // and the inspector alone: they re-render when the context they read changes.
  const ui = useMemo<EditorUi>(() => ({
    toggleHydrogens: () => setShowHydrogens((v) => !v),
    toggleAtomNumbers: () => setShowNumbers((v) => !v),
    toggleAtomColours: () => setColourAtoms((v) => !v),
    fit,
    zoom: (factor) => size.current && setViewport((v) => zoomAt(v, { x: size.current!.width / 2, y: size.current!.height / 2 }, factor)),
    openHelp: () => setHelpOpen(true),
    startRename: (id) => {
      setActiveBead(id);
      setRenaming(id);
    },
    propose: () => proposeRef.current(),
  }), [fit]);
  // What the toolbar's toggle buttons show as pressed (one stable object per state, for its memo).
  const toggles = useMemo(() => ({ 'toggle-hydrogens': showHydrogens, 'toggle-atom-numbers': showNumbers, 'toggle-atom-colours': colourAtoms }), [showHydrogens, showNumbers, colourAtoms]);
  const atomCount = molecule.atoms.length;
  const freeIons = useMemo(() => freeIonAtoms(molecule), [molecule]);
  const ctx = useMemo<EditorContext>(() => ({
    doc: session.doc,
    origin: session.origin,
    undo: session.undo,
    readOnly,
    view,
    atomCount,
    freeIons,
    selection,
    setSelection,
    activeBead,
    setActiveBead,
    suggestions,
    ui,
  }), [session, readOnly, view, atomCount, freeIons, selection, setSelection, activeBead, suggestions, ui]);
  const endRename = useCallback(() => setRenaming(null), []);

  // At most one pointer position every 40 ms; the last one (including `null` on leaving) always goes out.
  const sendPointer = useMemo(() => throttle(40, (p: { x: number; y: number } | null) => session.setPresence({ pointer: p })), [session]);
  useEffect(() => () => sendPointer.cancel(), [sendPointer]);

  // Stable for the memoised table and graph; it reads the latest view and selection when called.
  const latest = useRef({ view, selection });
  latest.current = { view, selection };
  const selectBead = useCallback((beadId: string, additive: boolean) => {
    const atoms = latest.current.view.byId.get(beadId)?.atoms.map((a) => a.index) ?? [];
    setSelection(selectMany(latest.current.selection, atoms, additive));
    setActiveBead(beadId);
  }, [setSelection]);
  const selectOnly = useCallback((beadId: string) => selectBead(beadId, false), [selectBead]);

  const gestures: GestureHandlers = {
    onAtom(atom, additive) {
      setCursor(atom);
      setSelection(clickAtom(selection, atom, additive));
      const holder = view.atomBeads.get(atom)?.[0] ?? null;
      if (!additive) setActiveBead(holder);
      else if (!activeBead && holder) setActiveBead(holder);
    },
    onBead: selectBead,
    onBox: (box, additive) => setSelection(selectMany(selection, atomsInBox(drawing.atoms, box), additive)),
    onPaper(additive) {
      if (additive) return;
      setSelection(EMPTY);
      setActiveBead(null);
    },
    onPointer: sendPointer,
  };

  return {
    ctx, proposeRef, drawing, neighbours, selection, activeBead, cursor, setCursor, showHydrogens, showNumbers, colourAtoms, toggles, viewport, setViewport, onSize, gestures,
    selectBead, selectOnly, highlight, setHighlight, marked, setMarked, helpOpen, setHelpOpen, renaming, endRename,
  };
}
