import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { browserSession } from '../helpers/browser-session';
import { newMappingInPage } from '../helpers/page-mapping';
import type { BondedTerm } from '../../src/shared/bonded-terms';

// Ring handling in the bonded-terms panel through the real client, server, collab socket and MariaDB:
// one click makes a ring of beads rigid (its bonds constraints, the angle inside it left out) and back;
// an improper dihedral is added from labelled fields with the keyboard, a bad one is refused in the
// form with nothing stored, and a stored one is removed; the residue name the exports use is set.

const session = browserSession();
beforeAll(() => session.open());
afterAll(() => session.close());

describe('ring handling in the editor', () => {
  it('makes a ring rigid and flexible again, adds and removes an improper dihedral, stores the residue name', async () => {
    const page = await session.signedIn('modeller@example.org', 'beadloom-demo');
    const { mappingId, model } = await newMappingInPage(page, { molecule: 'Toluene for ring handling', smiles: 'Cc1ccccc1', mapping: 'Ring of three', resolution: '2:1' });
    const { atoms, bonds } = model;
    // Beads: the methyl carbon, then the ring in pairs of neighbours (read from the molecule's bonds).
    const aromatic = atoms.map((a, i) => (a.aromatic ? i : -1)).filter((i) => i >= 0);
    const methyl = atoms.findIndex((a) => !a.aromatic);
    const next = (a: number, seen: number[]) => bonds.map((b) => (b.a === a ? b.b : b.b === a ? b.a : -1)).find((n) => n >= 0 && aromatic.includes(n) && !seen.includes(n))!;
    const ring = [bonds.map((b) => (b.a === methyl ? b.b : b.b === methyl ? b.a : -1)).find((n) => n >= 0)!];
    while (ring.length < 6) ring.push(next(ring[ring.length - 1], ring));
    await page.goto(`/mappings/${mappingId}`);
    await page.locator('[data-connection="live"]').waitFor();
    for (const group of [[methyl], [ring[0], ring[1]], [ring[2], ring[3]], [ring[4], ring[5]]]) {
      await page.locator(`[data-atom="${group[0]}"]`).click();
      for (const a of group.slice(1)) await page.locator(`[data-atom="${a}"]`).click({ modifiers: ['Shift'] });
      await page.keyboard.press('b');
    }
    const read = () => page.evaluate(async (id) => (await (await fetch(`/api/mappings/${id}/bonded-terms`)).json()).terms as BondedTerm[], mappingId);
    const inRing = (x: BondedTerm) => x.beads.every((b) => ['B2', 'B3', 'B4'].includes(b));

    const rings = page.getByRole('list', { name: 'Rings of beads' });
    await rings.getByRole('button', { name: /^Make ring .* rigid$/ }).click({ timeout: 20_000 });
    await expect.poll(async () => (await read()).filter((x) => x.kind === 'bond' && inRing(x)).map((x) => x.constraint), { timeout: 15_000 }).toEqual([true, true, true]);
    expect((await read()).find((x) => x.kind === 'angle' && inRing(x))).toMatchObject({ omit: true });
    expect((await read()).find((x) => x.kind === 'bond' && !inRing(x))!.constraint).toBeUndefined();
    await rings.getByText(/^rigid/).waitFor();
    await rings.getByRole('button', { name: /^Make ring .* flexible$/ }).click();
    await expect.poll(async () => (await read()).filter((x) => inRing(x) && (x.constraint || x.omit)).length, { timeout: 15_000 }).toBe(0);

    // An improper keeping the methyl bead in the ring's plane, typed with the keyboard.
    const form = page.getByRole('form', { name: 'Add an improper dihedral' });
    const pick = async (slot: number, bead: string) => form.getByLabel(`Bead ${slot} of the new improper`).selectOption({ label: bead });
    for (const [slot, bead] of [[1, 'B1'], [2, 'B2'], [3, 'B3'], [4, 'B3']] as const) await pick(slot, bead);
    await form.getByLabel('Improper force constant (kJ/mol/rad²)').fill('100');
    await form.getByLabel('Improper force constant (kJ/mol/rad²)').press('Enter');
    await form.getByRole('alert').filter({ hasText: 'four different beads' }).waitFor();
    expect((await read()).filter((x) => x.kind === 'improper')).toEqual([]);
    await pick(4, 'B4');
    await form.getByLabel('Improper angle (°)').fill('0');
    await form.getByLabel('Improper force constant (kJ/mol/rad²)').press('Enter');
    await expect.poll(async () => (await read()).filter((x) => x.kind === 'improper'), { timeout: 15_000 }).toEqual([{ kind: 'improper', beads: expect.arrayContaining(['B1', 'B2', 'B3', 'B4']), function: 'harmonic', value: 0, k: 100 }]);
    const improper = (await read()).find((x) => x.kind === 'improper')!;
    await page.getByRole('button', { name: `Remove improper ${improper.beads.join('–')}` }).click();
    await expect.poll(async () => (await read()).filter((x) => x.kind === 'improper').length, { timeout: 15_000 }).toBe(0);

    // The residue name the exports use, stored with the mapping: a bad one is refused in the form.
    const residue = page.getByRole('form', { name: 'Residue name' });
    await residue.getByLabel('Residue name (PDB, GRO, ITP exports)').fill('a-b');
    await residue.getByRole('button', { name: 'Save' }).click();
    await residue.getByRole('alert').filter({ hasText: '1 to 3 letters or digits' }).waitFor();
    await residue.getByLabel('Residue name (PDB, GRO, ITP exports)').fill('tol');
    await residue.getByRole('button', { name: 'Save' }).click();
    const stored = () => page.evaluate(async (id) => (await (await fetch(`/api/mappings/${id}/export?format=json&version=draft`)).json()).content.residue as string | undefined, mappingId);
    await expect.poll(stored, { timeout: 15_000 }).toBe('TOL');
    expect(session.errors).toEqual([]);
  }, 120_000);
});
