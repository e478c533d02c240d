import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { createBead, shareAtom } from '../../../src/shared/mapping-doc';
import { beadsTouching, mappingView, unassignedAtoms } from '../../../src/features/editor/model/bead-view';
import { atomsInBox, clickAtom, EMPTY, selectMany } from '../../../src/features/editor/model/selection';
import { fitView, toModel, toScreen, zoomAt } from '../../../src/features/editor/model/viewport';
import { chain } from './editor-fixture';

describe('selection', () => {
  it('replaces on click, toggles on shift-click, boxes with or without shift', () => {
    let s = clickAtom(EMPTY, 3, false);
    s = clickAtom(s, 5, true);
    expect([...s]).toEqual([3, 5]);
    s = clickAtom(s, 3, true);
    expect([...s]).toEqual([5]);
    expect([...clickAtom(s, 7, false)]).toEqual([7]);
    const pts = [{ index: 0, x: 0, y: 0 }, { index: 1, x: 10, y: 0 }, { index: 2, x: 20, y: 5 }];
    expect(atomsInBox(pts, { x1: 25, y1: 10, x2: 5, y2: -1 })).toEqual([1, 2]);
    expect([...selectMany(s, [1, 2], true)].sort()).toEqual([1, 2, 5]);
  });
});

describe('mappingView', () => {
  it('orders beads by lowest atom, records shared atoms, links bonded beads and colours neighbours apart', () => {
    const doc = new Y.Doc();
    const right = createBead(doc, [3, 4, 5], { name: 'R' });
    const left = createBead(doc, [0, 1, 2], { name: 'L' });
    shareAtom(doc, 2, { [left]: 0.5, [right]: 0.5 });
    const view = mappingView(doc, chain(7));
    expect(view.beads.map((b) => b.name)).toEqual(['L', 'R']);
    expect(view.atomBeads.get(2)?.sort()).toEqual([left, right].sort());
    expect(view.links).toHaveLength(1);
    expect(view.beads[0].colour).not.toBe(view.beads[1].colour);
    expect(unassignedAtoms(view, 7)).toEqual([6]);
    expect(beadsTouching(view, [2])).toEqual([left, right]);
  });

  it('gives every peer the same colours for the same document', () => {
    const a = new Y.Doc();
    createBead(a, [0, 1], { id: 'bx' });
    createBead(a, [2, 3], { id: 'by' });
    const b = new Y.Doc();
    Y.applyUpdate(b, Y.encodeStateAsUpdate(a));
    expect(mappingView(b, chain(4)).beads.map((x) => x.colour)).toEqual(mappingView(a, chain(4)).beads.map((x) => x.colour));
  });
});

describe('viewport', () => {
  it('fits bounds into the screen and zooms about the pointer', () => {
    const v = fitView({ minX: 0, minY: 0, maxX: 100, maxY: 50 }, 400, 300, 50, 4);
    expect(v.k).toBe(3);
    expect(toScreen(v, { x: 50, y: 25 })).toEqual({ x: 200, y: 150 });
    const z = zoomAt(v, { x: 120, y: 80 }, 2);
    expect(toModel(z, { x: 120, y: 80 })).toEqual(toModel(v, { x: 120, y: 80 }));
    expect(z.k).toBe(6);
  });
});

describe('atom cursor', () => {
  it('follows bonds in the arrow direction, else jumps to the nearest atom that way', async () => {
    const { nextAtom } = await import('../../../src/features/editor/model/atom-cursor');
    //   0 — 1 — 2        3 (unbonded, far right)
    //       |
    //       4
    const pts = [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 2, y: 0.2 }, { x: 5, y: 0 }, { x: 1, y: 1 }];
    const nb = [[1], [0, 2, 4], [1], [], [1]];
    expect(nextAtom(pts, nb, 1, 'right')).toBe(2);
    expect(nextAtom(pts, nb, 1, 'down')).toBe(4);
    expect(nextAtom(pts, nb, 2, 'right')).toBe(3);
    expect(nextAtom(pts, nb, 0, 'left')).toBe(0);
  });
});
