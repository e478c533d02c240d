import { useEffect, useRef, useState, type PointerEvent as ReactPointerEvent, type RefObject } from 'react';
import type { Point } from '../../../shared/drawing/hull';
import type { Box } from '../model/selection';
import { panBy, toModel, zoomAt, type Viewport } from '../model/viewport';

/**
 * Pointer handling for the drawing. Left-drag on paper draws a selection box (Shift adds to the
 * selection), a press on an atom or a bead selects it, a middle-button or Alt drag pans, the wheel
 * zooms about the pointer. Targets are recognised by their `data-atom` / `data-bead` attributes.
 */
export interface GestureHandlers {
  onAtom(atom: number, additive: boolean): void;
  onBead(beadId: string, additive: boolean): void;
  onBox(box: Box, additive: boolean): void;
  onPaper(additive: boolean): void;
  onPointer(model: Point | null): void;
}

export function useCanvasGestures(ref: RefObject<SVGSVGElement | null>, viewport: Viewport, setViewport: (v: Viewport) => void, handlers: GestureHandlers) {
  const [box, setBox] = useState<Box | null>(null);
  const drag = useRef<{ mode: 'pan' | 'box'; start: Point; last: Point; additive: boolean } | null>(null);
  const live = useRef({ viewport, setViewport, handlers });
  live.current = { viewport, setViewport, handlers };

  const local = (e: { clientX: number; clientY: number }): Point => {
    const r = ref.current!.getBoundingClientRect();
    return { x: e.clientX - r.left, y: e.clientY - r.top };
  };

  useEffect(() => {
    const svg = ref.current;
    if (!svg) return;
    const wheel = (e: WheelEvent) => {
      e.preventDefault();
      const { viewport: v, setViewport: set } = live.current;
      set(zoomAt(v, local(e), Math.exp(-e.deltaY * 0.0015)));
    };
    svg.addEventListener('wheel', wheel, { passive: false });
    return () => svg.removeEventListener('wheel', wheel);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [ref]);

  const onPointerDown = (e: ReactPointerEvent<SVGSVGElement>) => {
    const p = local(e);
    const target = e.target as Element;
    const additive = e.shiftKey || e.ctrlKey || e.metaKey;
    if (e.button === 1 || e.altKey) {
      drag.current = { mode: 'pan', start: p, last: p, additive };
    } else if (e.button === 0) {
      const atom = target.getAttribute('data-atom');
      const bead = target.getAttribute('data-bead');
      if (atom !== null) return handlers.onAtom(Number(atom), additive);
      if (bead !== null) return handlers.onBead(bead, additive);
      drag.current = { mode: 'box', start: p, last: p, additive };
    } else return;
    e.currentTarget.setPointerCapture(e.pointerId);
  };

  const onPointerMove = (e: ReactPointerEvent<SVGSVGElement>) => {
    const p = local(e);
    handlers.onPointer(toModel(viewport, p));
    const d = drag.current;
    if (!d) return;
    if (d.mode === 'pan') setViewport(panBy(viewport, p.x - d.last.x, p.y - d.last.y));
    else setBox(boxIn(viewport, d.start, p));
    d.last = p;
  };

  const onPointerUp = (e: ReactPointerEvent<SVGSVGElement>) => {
    const d = drag.current;
    drag.current = null;
    setBox(null);
    if (!d || d.mode !== 'box') return;
    const p = local(e);
    if (Math.hypot(p.x - d.start.x, p.y - d.start.y) < 4) handlers.onPaper(d.additive);
    else handlers.onBox(boxIn(viewport, d.start, p), d.additive);
  };

  const onPointerLeave = () => handlers.onPointer(null);

  return { box, bind: { onPointerDown, onPointerMove, onPointerUp, onPointerLeave } };
}

function boxIn(viewport: Viewport, a: Point, b: Point): Box {
  const p = toModel(viewport, a);
  const q = toModel(viewport, b);
  return { x1: p.x, y1: p.y, x2: q.x, y2: q.y };
}
