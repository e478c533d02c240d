import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import type { Molecule } from '../../src/shared/chem';
import { browserSession } from '../helpers/browser-session';
import { addModeller } from '../helpers/second-modeller';

// Issue 4's browser test, through the real client, server, collab socket and MariaDB: two
// modellers (the demo's, and a second one the supervisor adds) edit one live mapping and each sees
// the other's bead appear with the server's numbers; a student watches live and cannot edit.

const PASSWORD = 'beadloom-demo';
const SECOND = { email: 'noor.halden@example.org', name: 'Noor Halden', password: 'second-modeller-pass-31' };
// IUPAC/CIAAW 2021 conventional atomic weights (from memory of the 2021 table).
const WEIGHT: Record<string, number> = { C: 12.011, H: 1.008, O: 15.999, N: 14.007 };

const session = browserSession();
const pageErrors = session.errors;
const signedIn = (email: string, password: string): Promise<Page> => session.signedIn(email, password);

const tag = (page: Page, name: string) => page.locator(`[data-bead-tag="${name}"]`);
const massOf = (page: Page, bead: string) => page.getByRole('row', { name: `Bead ${bead}` }).locator('[data-column="mass"]');

beforeAll(async () => {
  await session.open();
  await addModeller(session, SECOND);
});
afterAll(() => session.close());

describe('the live mapping editor', () => {
  it('lets two modellers co-edit while a student watches read-only', async () => {
    const first = await signedIn('modeller@example.org', PASSWORD);
    const second = await signedIn(SECOND.email, SECOND.password);
    const student = await signedIn('student@example.org', PASSWORD);

    const { mappingId, model } = await first.evaluate(async () => {
      const projects = await (await fetch('/api/projects')).json();
      const molecules = await (await fetch(`/api/projects/${projects[0].id}/molecules`)).json();
      const ibuprofen = molecules.find((m: { name: string }) => m.name === 'Ibuprofen');
      const mappings = await (await fetch(`/api/molecules/${ibuprofen.id}/mappings`)).json();
      const detail = await (await fetch(`/api/molecules/${ibuprofen.id}`)).json();
      return { mappingId: mappings[0].id as number, model: detail.model as Molecule };
    });

    for (const page of [first, second, student]) await page.goto(`/mappings/${mappingId}`);
    await first.locator('[data-connection="live"]').waitFor();
    await second.locator('[data-connection="live"]').waitFor();
    await student.locator('[data-connection="read-only"]').waitFor();
    const people = first.getByRole('list', { name: 'People in this mapping' });
    for (const name of [/Tomas Brenn \(you\)/, /Noor Halden/, /Lea Okafor/]) await people.getByRole('listitem', { name }).waitFor();

    // The first modeller takes atom 0 out of its bead and makes a bead of it alone.
    await first.locator('[data-atom="0"]').click();
    await first.keyboard.press('r');
    await first.keyboard.press('b');
    await tag(first, 'B1').waitFor();
    // The second modeller and the student see the bead appear, and the server's mass for it.
    const a0 = model.atoms[0];
    const expected = WEIGHT[a0.element] + a0.hydrogens * WEIGHT.H;
    for (const page of [second, student]) {
      await tag(page, 'B1').waitFor();
      await expect.poll(async () => Number(await massOf(page, 'B1').textContent()), { timeout: 10_000 }).toBeCloseTo(expected, 1);
    }

    // The second modeller does the same with atom 1; the first sees it.
    await second.locator('[data-atom="1"]').click();
    await second.keyboard.press('r');
    await second.keyboard.press('b');
    await tag(first, 'B2').waitFor();
    await expect.poll(async () => (await massOf(first, 'B2').textContent())?.trim(), { timeout: 10_000 }).toMatch(/^\d+\.\d\d$/);
    // Each sees the other's selection on the canvas.
    await first.locator('[data-peer-selected="1"]').waitFor();

    // The student sees all of it but cannot edit: no editing tools, and keys change nothing.
    await tag(student, 'B2').waitFor();
    await expect(student.getByRole('button', { name: /Make bead/ }).count()).resolves.toBe(0);
    const beadsBefore = await first.locator('[data-bead]').count();
    await student.locator('[data-atom="2"]').click();
    await student.keyboard.press('r');
    await student.keyboard.press('b');
    // Wait for an event, not for time: the student then selects atom 4. Keys and clicks are handled in
    // order, and the student's socket sends in order, so once the first modeller sees that selection,
    // any bead the keys had made would already be on both pages.
    await student.locator('[data-atom="4"]').click();
    await first.locator('[data-peer-selected="4"]').waitFor();
    expect(await student.locator('[data-bead]').count()).toBe(beadsBefore);
    expect(await first.locator('[data-bead]').count()).toBe(beadsBefore);

    // Undo is per person: the first modeller's undo removes B1 (its own), not B2.
    await first.locator('svg[role="application"]').focus();
    await first.keyboard.press('Control+z');
    await first.keyboard.press('Control+z');
    await tag(second, 'B1').waitFor({ state: 'detached' });
    await expect(tag(second, 'B2').count()).resolves.toBe(1);

    expect(pageErrors).toEqual([]);
  });
});
