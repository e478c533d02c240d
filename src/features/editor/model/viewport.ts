import type { Point } from '../../../shared/drawing/hull';

/**
 * Zoom and pan of the drawing: screen = model × k + (x, y). Kept as plain numbers so the SVG
 * transform, pointer mapping and the remote pointers all use the same arithmetic.
 */
export interface Viewport {
  x: number;
  y: number;
  k: number;
}

export const MIN_ZOOM = 0.1;
export const MAX_ZOOM = 8;

export interface Bounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/** The viewport that shows `bounds` centred in a width × height screen with `margin` pixels round it. */
export function fitView(bounds: Bounds, width: number, height: number, margin = 40, maxZoom = 2): Viewport {
  const w = Math.max(bounds.maxX - bounds.minX, 1);
  const h = Math.max(bounds.maxY - bounds.minY, 1);
  const k = clampZoom(Math.min((width - 2 * margin) / w, (height - 2 * margin) / h, maxZoom));
  return {
    k,
    x: width / 2 - ((bounds.minX + bounds.maxX) / 2) * k,
    y: height / 2 - ((bounds.minY + bounds.maxY) / 2) * k,
  };
}

export const clampZoom = (k: number) => Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, k));

/** Zooms by `factor` keeping the model point under `screen` where it is. */
export function zoomAt(view: Viewport, screen: Point, factor: number): Viewport {
  const k = clampZoom(view.k * factor);
  const m = toModel(view, screen);
  return { k, x: screen.x - m.x * k, y: screen.y - m.y * k };
}

export const panBy = (view: Viewport, dx: number, dy: number): Viewport => ({ ...view, x: view.x + dx, y: view.y + dy });

export const toModel = (view: Viewport, p: Point): Point => ({ x: (p.x - view.x) / view.k, y: (p.y - view.y) / view.k });

export const toScreen = (view: Viewport, p: Point): Point => ({ x: p.x * view.k + view.x, y: p.y * view.k + view.y });
