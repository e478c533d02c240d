import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { browserSession } from '../helpers/browser-session';
import { firstMappingId } from '../helpers/demo-ids';

// Issue 13, points 12 and 5, in Chromium: atom numbers (from 1) and "colour atoms by bead" toggle on
// the editor's drawing; the bead graph re-fits its panel as beads come, unless the person zoomed.

const session = browserSession();
beforeAll(() => session.open());
afterAll(() => session.close());

const tool = (page: Page, name: string) => page.getByRole('toolbar', { name: 'Mapping tools' }).getByRole('button', { name, exact: true });

/** A new, empty mapping of the demo's first molecule, made through the API in the page. */
async function emptyMapping(page: Page, moleculeId: number): Promise<number> {
  return page.evaluate(async (id) => {
    const { token } = await (await fetch('/api/auth/csrf')).json();
    const res = await fetch(`/api/molecules/${id}/mappings`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': token }, body: JSON.stringify({ name: 'Graph fit', resolution: '4:1' }) });
    return (await res.json()).id as number;
  }, moleculeId);
}

/** Whether every node of the bead graph lies inside its panel. */
const graphNodesInside = (page: Page) =>
  page.locator('div[aria-label="Bead graph"]').evaluate((region) => {
    const box = region.getBoundingClientRect();
    const nodes = [...region.querySelectorAll('[data-graph-bead]')].map((n) => n.getBoundingClientRect());
    return nodes.length > 0 && nodes.every((n) => n.left >= box.left && n.right <= box.right && n.top >= box.top && n.bottom <= box.bottom);
  });

describe('the editor drawing’s view options', () => {
  it('shows atom numbers from 1 and colours atoms by bead, on and off', async () => {
    const modeller = await session.signedIn('modeller@example.org', 'beadloom-demo');
    const mappingId = await firstMappingId(modeller);
    const mapping = await modeller.evaluate(async (id) => (await fetch(`/api/mappings/${id}`)).json(), mappingId);
    const molecule = await modeller.evaluate(async (id) => (await fetch(`/api/molecules/${id}`)).json(), mapping.moleculeId);
    const atomCount: number = molecule.model.atoms.length;
    await modeller.goto(`/mappings/${mappingId}`);
    await modeller.locator('[data-connection="live"]').waitFor();

    expect(await modeller.locator('[data-atom-number]').count()).toBe(0);
    await tool(modeller, 'Show or hide atom numbers').click();
    expect(await tool(modeller, 'Show or hide atom numbers').getAttribute('aria-pressed')).toBe('true');
    const numbers = await modeller.locator('[data-atom-number]').allTextContents();
    expect(numbers).toEqual(Array.from({ length: atomCount }, (_, i) => String(i + 1)));
    // Each number sits beside its own atom (within one bond length of the atom's click target).
    for (const i of [0, atomCount - 1]) {
      const label = (await modeller.locator(`[data-atom-number="${i + 1}"]`).boundingBox())!;
      const atom = (await modeller.locator(`[data-atom="${i}"]`).boundingBox())!;
      expect(Math.hypot(label.x + label.width / 2 - (atom.x + atom.width / 2), label.y + label.height / 2 - (atom.y + atom.height / 2))).toBeLessThan(atom.width * 1.5);
    }
    await modeller.screenshot({ path: '/tmp/beadloom-atom-numbers.png' });
    await modeller.locator('[data-atom="0"]').focus();
    await modeller.keyboard.press('i');
    await expect.poll(() => modeller.locator('[data-atom-number]').count()).toBe(0);

    // Colour by bead: every assigned atom gets its bead's colour (the colour its graph node has).
    await tool(modeller, 'Colour atoms by bead').click();
    const assigned = new Set(mapping.draft.beads.flatMap((b: { atoms: { index: number }[] }) => b.atoms.map((a) => a.index)));
    await expect.poll(() => modeller.locator('[data-atom-colour]').count()).toBe(assigned.size);
    const first = mapping.draft.beads.find((b: { atoms: { index: number; weight: number }[] }) => b.atoms.some((a) => a.weight === 1));
    const atom = first.atoms.find((a: { weight: number }) => a.weight === 1).index;
    const fill = await modeller.locator(`circle[data-atom-colour="${atom + 1}"]`).evaluate((c) => getComputedStyle(c).fill);
    const node = await modeller.locator(`[data-graph-bead="${first.name}"]`).evaluate((n) => getComputedStyle(n).backgroundColor);
    expect(fill).toBe(node);
    await modeller.screenshot({ path: '/tmp/beadloom-colour-atoms.png' });
    await tool(modeller, 'Colour atoms by bead').click();
    await expect.poll(() => modeller.locator('[data-atom-colour]').count()).toBe(0);

    // Point 13's pictures: ΔG per bead on the library's bands, and Σ bead mass against the weight.
    const chart = modeller.getByRole('img', { name: "Partition free energy of each bead against the library's type bands" });
    await chart.waitFor();
    expect(await chart.locator('[data-chart-bead]').count()).toBe(mapping.draft.beads.length);
    const sum = mapping.evaluation.beads.reduce((s: number, b: { mass: number }) => s + b.mass, 0);
    expect(await modeller.locator('[data-total="bead-mass"]').textContent()).toBe(sum.toFixed(2));
    const dots = await chart.locator('[data-delta-g]').evaluateAll((cs) => cs.map((c) => Number(c.getAttribute('data-delta-g'))));
    expect(dots.sort()).toEqual(mapping.evaluation.beads.map((b: { partitionDeltaG: number | null }) => b.partitionDeltaG).filter((v: number | null) => v !== null).sort());
    await chart.scrollIntoViewIfNeeded();
    await modeller.getByRole('region', { name: 'Partition free energy per bead, and mass balance' }).screenshot({ path: '/tmp/beadloom-partition-chart.png' });
    expect(session.errors).toEqual([]);
  });

  it('re-fits the bead graph as beads are added, and keeps a view the person zoomed', async () => {
    const modeller = await session.signedIn('modeller@example.org', 'beadloom-demo');
    const demo = await modeller.evaluate(async (id) => (await fetch(`/api/mappings/${id}`)).json(), await firstMappingId(modeller));
    const molecule = await modeller.evaluate(async (id) => (await fetch(`/api/molecules/${id}`)).json(), demo.moleculeId);
    const n: number = molecule.model.atoms.length;
    const mappingId = await emptyMapping(modeller, demo.moleculeId);
    await modeller.goto(`/mappings/${mappingId}`);
    await modeller.locator('[data-connection="live"]').waitFor();

    // One-atom beads far apart: the first fit is zoomed onto one node; later ones must still fit.
    const picks = [0, n - 1, Math.floor(n / 2), Math.floor(n / 4), Math.floor((3 * n) / 4)];
    for (const [k, atom] of picks.entries()) {
      await modeller.locator(`[data-atom="${atom}"]`).click();
      await modeller.keyboard.press('b');
      await modeller.locator(`[data-graph-bead="B${k + 1}"]`).waitFor();
      await expect.poll(() => graphNodesInside(modeller)).toBe(true);
    }

    // The person zooms the graph: the next bead does not move their view.
    const viewport = modeller.locator('div[aria-label="Bead graph"] .react-flow__viewport');
    const graph = (await modeller.locator('div[aria-label="Bead graph"]').boundingBox())!;
    await modeller.mouse.move(graph.x + graph.width / 2, graph.y + graph.height / 2);
    await modeller.mouse.wheel(0, -400);
    await expect.poll(async () => (await viewport.getAttribute('style')) ?? '').not.toBe('');
    const zoomed = await viewport.getAttribute('style');
    await modeller.locator(`[data-atom="${Math.floor(n / 3)}"]`).click();
    await modeller.keyboard.press('b');
    await modeller.locator('[data-graph-bead="B6"]').waitFor();
    await new Promise((r) => setTimeout(r, 300)); // a fit, were one queued, would animate in this time
    expect(await viewport.getAttribute('style')).toBe(zoomed);
    expect(session.errors).toEqual([]);
  });
});
