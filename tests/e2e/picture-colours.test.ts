import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import type { MappingBead } from '../../src/shared/chem';
import { assignBeadColours, atomBeadsOf, beadLinks } from '../../src/shared/drawing/palette';
import { browserSession } from '../helpers/browser-session';

// Issue 13, points 3 and 4: the exported picture shows a bead in the colour the editor shows it,
// measured in pixels: the most common hull colour inside the bead's outline in a screenshot of the
// editor and in the exported PNG (both translucent hulls over the same paper colour).

const session = browserSession();
let page: Page;
beforeAll(async () => {
  await session.open();
  page = await session.signedIn('modeller@example.org', 'beadloom-demo');
});
afterAll(() => session.close());

type Rgb = [number, number, number];
const PAPER: Rgb = [0xfd, 0xfb, 0xf6];
const hex = (h: string): Rgb => [1, 3, 5].map((i) => parseInt(h.slice(i, i + 2), 16)) as Rgb;
/** The hull's painted colour: the bead colour at fill-opacity 0.26 over paper (the renderer's hull). */
const over = (c: Rgb, alpha = 0.26): Rgb => c.map((v, i) => Math.round(alpha * v + (1 - alpha) * PAPER[i])) as Rgb;

/** The most common colour of a PNG crop that is neither paper nor ink, read back in the browser. */
async function hullColour(page: Page, png: Buffer, crop: { x: number; y: number; width: number; height: number }): Promise<Rgb> {
  return page.evaluate(
    async ({ b64, crop, paper }) => {
      const img = new Image();
      img.src = `data:image/png;base64,${b64}`;
      await img.decode();
      const canvas = document.createElement('canvas');
      canvas.width = Math.max(1, Math.round(crop.width));
      canvas.height = Math.max(1, Math.round(crop.height));
      const ctx = canvas.getContext('2d')!;
      ctx.drawImage(img, crop.x, crop.y, crop.width, crop.height, 0, 0, canvas.width, canvas.height);
      const { data } = ctx.getImageData(0, 0, canvas.width, canvas.height);
      const counts = new Map<string, number>();
      for (let i = 0; i < data.length; i += 4) {
        const [r, g, b] = [data[i], data[i + 1], data[i + 2]];
        if (Math.abs(r - paper[0]) + Math.abs(g - paper[1]) + Math.abs(b - paper[2]) < 12) continue;
        if (r + g + b < 300) continue; // bonds, symbols
        const key = `${r},${g},${b}`;
        counts.set(key, (counts.get(key) ?? 0) + 1);
      }
      const [best] = [...counts].sort((p, q) => q[1] - p[1])[0];
      return best.split(',').map(Number) as [number, number, number];
    },
    { b64: png.toString('base64'), crop, paper: PAPER },
  );
}

describe('bead colours in the editor and in the exported PNG', () => {
  it('paint the same bead in the same colour', async () => {
    await page.setViewportSize({ width: 1400, height: 1000 });
    const { mappingId, beads, bonds } = await page.evaluate(async () => {
      const projects = await (await fetch('/api/projects')).json();
      const molecules = await (await fetch(`/api/projects/${projects[0].id}/molecules`)).json();
      const ibuprofen = molecules.find((m: { name: string }) => m.name === 'Ibuprofen');
      const mappings = await (await fetch(`/api/molecules/${ibuprofen.id}/mappings`)).json();
      const mapping = await (await fetch(`/api/mappings/${mappings[0].id}`)).json();
      const detail = await (await fetch(`/api/molecules/${ibuprofen.id}`)).json();
      return { mappingId: mappings[0].id as number, beads: mapping.draft.beads as MappingBead[], bonds: detail.model.bonds as { a: number; b: number }[] };
    });
    expect(beads.length).toBeGreaterThan(1);
    const colours = assignBeadColours(beads.map((b) => b.id), beadLinks(atomBeadsOf(beads), bonds));

    await page.goto(`/mappings/${mappingId}`);
    await page.locator('[data-connection="live"]').waitFor();
    const exported = await page.request.get(`/api/mappings/${mappingId}/export?format=png&version=draft`);
    expect(exported.ok()).toBe(true);
    const png = Buffer.from(await exported.body());
    const svg = await (await page.request.get(`/api/mappings/${mappingId}/export?format=svg&version=draft`)).text();

    for (const bead of beads.slice(0, 3)) {
      const target = page.locator(`path[data-bead="${bead.id}"]`).first();
      const box = (await target.boundingBox())!;
      const shot = await page.screenshot({ clip: box });
      const inEditor = await hullColour(page, shot, { x: 0, y: 0, width: Math.floor(box.width), height: Math.floor(box.height) });

      // The same hull in the PNG: its box in the SVG's user units, times the PNG's zoom of 2.
      const inFile = await page.evaluate(
        ({ svg, id }) => {
          const host = document.createElement('div');
          host.innerHTML = svg;
          document.body.append(host);
          const root = host.querySelector('svg')!;
          const [vx, vy] = root.getAttribute('viewBox')!.split(' ').map(Number);
          const b = (root.querySelector(`path[data-bead="${id}"]`) as SVGPathElement).getBBox();
          host.remove();
          return { x: (b.x - vx) * 2, y: (b.y - vy) * 2, width: b.width * 2, height: b.height * 2 };
        },
        { svg, id: bead.id },
      );
      const inPng = await hullColour(page, png, inFile);
      const expected = over(hex(colours.get(bead.id)!));
      for (let c = 0; c < 3; c++) {
        expect(Math.abs(inEditor[c] - inPng[c]), `bead ${bead.name}: editor ${inEditor} vs PNG ${inPng}`).toBeLessThanOrEqual(4);
        expect(Math.abs(inPng[c] - expected[c]), `bead ${bead.name}: PNG ${inPng} vs palette ${expected}`).toBeLessThanOrEqual(4);
      }
    }
    if (process.env.BEADLOOM_SCREENSHOTS) await page.screenshot({ path: `${process.env.BEADLOOM_SCREENSHOTS}/editor-colours.png` });
  });
});

describe('the molecule page and list', () => {
  // Adds a molecule to the first project through the API, as the signed-in page.
  const addMolecule = async (name: string, smiles: string) => {
    const projectId = await page.evaluate(async () => (await (await fetch('/api/projects')).json())[0].id as number);
    const { token } = await (await page.request.get('/api/auth/csrf')).json();
    const res = await page.request.post(`/api/projects/${projectId}/molecules`, {
      data: { name, smiles, allowDuplicate: true },
      headers: { 'x-csrf-token': token },
    });
    expect(res.ok(), await res.text()).toBe(true);
    return { projectId, id: (await res.json()).id as number };
  };

  it('draw aromatic rings and charges with the shared renderer', async () => {
    // A disulfonated azo dye with two Na+ (the example): two aromatic rings, four charges.
    const { projectId, id } = await addMolecule('Azo dye sodium salt', 'Nc1ccc(cc1)N=Nc1ccc(cc1S(=O)(=O)[O-])S(=O)(=O)[O-].[Na+].[Na+]');
    await page.goto(`/molecules/${id}`);
    const drawing = page.locator('[data-molecule-drawing]').first();
    await drawing.waitFor();
    expect(await drawing.locator('circle').count()).toBe(2); // one circle per aromatic ring
    expect(await drawing.locator('[data-charge]').count()).toBe(4); // O−, O−, Na+, Na+
    if (process.env.BEADLOOM_SCREENSHOTS) await page.screenshot({ path: `${process.env.BEADLOOM_SCREENSHOTS}/molecule-page.png` });
    await page.goto(`/projects/${projectId}`);
    const thumb = page.getByRole('img', { name: 'Structure of Azo dye sodium salt' });
    await thumb.waitFor();
    expect(await thumb.locator('[data-charge]').count()).toBe(4);
    if (process.env.BEADLOOM_SCREENSHOTS) await page.screenshot({ path: `${process.env.BEADLOOM_SCREENSHOTS}/molecule-list.png`, fullPage: true });
  });

  it('draw attachment points as attachment marks, not as a * label', async () => {
    const { id } = await addMolecule('Polystyrene repeat unit', '*CC(*)c1ccccc1');
    await page.goto(`/molecules/${id}`);
    const drawing = page.locator('[data-molecule-drawing]').first();
    await drawing.waitFor();
    expect(await drawing.locator('path[data-attachment]').count()).toBe(2);
    expect(await drawing.textContent()).not.toContain('*');
  });
});
