import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { browserSession } from '../helpers/browser-session';
import { newMappingInPage } from '../helpers/page-mapping';
import { generateConformer } from '../../server/chem/index';
import { groText, makeSystem } from '../../seeds/invented-reference';
import type { BondedTerm } from '../../src/shared/bonded-terms';
import type { AnalysisView } from '../../src/shared/references';
import type { Molecule } from '../../src/shared/chem';

// "Fill from analysis" in the bonded-terms panel through the real client, server, background job,
// collab socket and MariaDB: a modeller maps an invented surfactant, a reference is uploaded and
// analysed, the panel lists the finished analysis with its version, the confirmation says what the
// fill replaces, and the table then holds the analysis's fitted values.

const session = browserSession();
beforeAll(() => session.open());
afterAll(() => session.close());

describe('fill from analysis in the editor', () => {
  it('lists the finished analysis, asks first, and fills the table with its fitted values', async () => {
    const page = await session.signedIn('modeller@example.org', 'beadloom-demo');
    const { mappingId, moleculeId, model } = await newMappingInPage(page, { molecule: 'Surfactant for filling', smiles: 'CCCCCCOCCOCCO', mapping: 'Four beads', resolution: '3:1' });
    await page.goto(`/mappings/${mappingId}`);
    await page.locator('[data-connection="live"]').waitFor();
    for (const group of [[0, 1, 2], [3, 4, 5], [6, 7, 8], [9, 10, 11, 12]]) {
      await page.locator(`[data-atom="${group[0]}"]`).click();
      for (const a of group.slice(1)) await page.locator(`[data-atom="${a}"]`).click({ modifiers: ['Shift'] });
      await page.keyboard.press('b');
    }
    // A row names its beads in the stored direction, which follows the (random) bead ids.
    await page.getByRole('form', { name: /^bond (B3–B4|B4–B3)$/ }).waitFor({ timeout: 20_000 });

    // A reference of the molecule and an analysis of the draft, through the API in the page.
    const mol = model as unknown as Molecule;
    const full = (await page.evaluate(async (id) => (await (await fetch(`/api/molecules/${id}`)).json()).model, moleculeId)) as Molecule;
    const sys = makeSystem(full, await generateConformer(full, { seed: 3 }), { copies: 4, frames: 20, boxA: 40, noiseA: 0.06, seed: 5 });
    expect(mol.atoms.length).toBe(13);
    const analysis = await page.evaluate(async ({ id, mapping, box, traj }) => {
      const { token } = await (await fetch('/api/auth/csrf')).json();
      const form = new FormData();
      form.append('name', 'Invented box');
      form.append('structure', new Blob([box]), 'box.gro');
      form.append('trajectory', new Blob([traj]), 'traj.gro');
      const up = await fetch(`/api/molecules/${id}/references`, { method: 'POST', headers: { 'x-csrf-token': token }, body: form });
      if (!up.ok) throw new Error(`upload: ${up.status} ${await up.text()}`);
      const ref = await up.json();
      const wait = async (url: string, done: (x: { status: string }) => boolean) => {
        for (let i = 0; i < 600; i++) {
          const x = await (await fetch(url)).json();
          if (done(x)) return x;
          await new Promise((r) => setTimeout(r, 100));
        }
        throw new Error(`timed out: ${url}`);
      };
      await wait(`/api/references/${ref.id}`, (x) => x.status === 'ready' || x.status === 'failed');
      const start = await fetch(`/api/mappings/${mapping}/analyses`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': token }, body: JSON.stringify({ referenceId: ref.id, version: 'draft' }) });
      if (!start.ok) throw new Error(`analysis: ${start.status} ${await start.text()}`);
      return wait(`/api/analyses/${(await start.json()).id}`, (x) => x.status !== 'queued' && x.status !== 'running');
    }, { id: moleculeId, mapping: mappingId, box: groText(sys, sys.frames.slice(0, 1)), traj: groText(sys) }) as AnalysisView;
    expect(analysis.status).toBe('done');

    // The panel lists it (the list is read when the panel first shows; reload to see the new one).
    await page.reload();
    await page.locator('[data-connection="live"]').waitFor();
    const picker = page.getByLabel('Analysis to fill from');
    await picker.waitFor({ timeout: 20_000 });
    expect(await picker.locator('option').allTextContents()).toEqual([`Analysis ${analysis.id} · draft · 298.15 K`]);
    await page.getByRole('button', { name: 'Fill from analysis' }).click();
    const dialog = page.getByRole('dialog');
    // What the analysis can fill: every bond and angle, and each dihedral whose distribution was wide enough for a cosine fit.
    const r = analysis.result!;
    const fillable = r.bonds.length + r.angles.length + r.dihedrals.filter((d) => (d.fourier ?? []).length > 0).length;
    await dialog.getByText(`This replaces the function, value and force constant of ${fillable} rows`).waitFor();
    if (fillable < 6) await dialog.getByText('Not used from the analysis: dihedral').waitFor();
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    const read = () => page.evaluate(async (id) => (await (await fetch(`/api/mappings/${id}/bonded-terms`)).json()).terms as BondedTerm[], mappingId);
    expect((await read()).every((x) => x.value === null)).toBe(true);

    await page.getByRole('button', { name: 'Fill from analysis' }).click();
    await dialog.getByRole('button', { name: 'Fill the table' }).click();
    await page.getByRole('status').filter({ hasText: `Filled ${fillable} terms from analysis ${analysis.id}.` }).waitFor({ timeout: 15_000 });
    const terms = await read();
    const same = (a: string[], b: string[]) => a.join() === b.join() || a.join() === [...b].reverse().join();
    const bond = terms.find((x) => x.kind === 'bond' && same(x.beads, r.bonds[0].beads))!;
    expect(bond).toMatchObject({ function: 'harmonic', value: r.bonds[0].mean, k: r.bonds[0].k });
    // The row's own fields show the stored values (the live document, not a reload).
    const row = page.getByRole('form', { name: `bond ${bond.beads.join('–')}` });
    await expect.poll(() => row.getByLabel(`Value of bond ${bond.beads.join('–')} (nm)`).inputValue()).toBe(String(r.bonds[0].mean));
    expect(terms.filter((x) => x.value !== null && x.k !== null)).toHaveLength(fillable);
    // The export menu offers the engine models at this analysis's mean structure.
    await page.getByText('Export', { exact: true }).click();
    const links = page.getByRole('list', { name: `Export at the mean structure of analysis ${analysis.id}` });
    expect(await links.getByRole('link', { name: 'GROMACS model (zip)' }).getAttribute('href')).toBe(`/api/mappings/${mappingId}/export?format=gromacs&version=draft&analysis=${analysis.id}`);
    expect(session.errors).toEqual([]);
  }, 180_000);
});
