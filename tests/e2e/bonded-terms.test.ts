import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { browserSession } from '../helpers/browser-session';
import { newMappingInPage } from '../helpers/page-mapping';

// The bonded-terms table in the editor, through the real client, server, collab socket and MariaDB:
// a bad value is refused in the row with a message and nothing is stored; a good one is stored in the
// draft and read back by the API; the missing-value check then names what is still unset.

const session = browserSession();
beforeAll(() => session.open());
afterAll(() => session.close());

describe('bonded terms in the editor', () => {
  it('refuses a negative force constant, stores a valid bond, and shows the missing-value checks', async () => {
    const page = await session.signedIn('modeller@example.org', 'beadloom-demo');
    const { mappingId } = await newMappingInPage(page, { molecule: 'Butane for bonded terms', smiles: 'CCCC', mapping: 'Two beads', resolution: '2:1' });
    await page.goto(`/mappings/${mappingId}`);
    await page.locator('[data-connection="live"]').waitFor();
    // Two beads joined by one bond: atoms 0–1 and 2–3 (butane's chain in openchemlib's order).
    for (const [a, b] of [[0, 1], [2, 3]]) {
      await page.locator(`[data-atom="${a}"]`).click();
      await page.locator(`[data-atom="${b}"]`).click({ modifiers: ['Shift'] });
      await page.keyboard.press('b');
    }
    // A row names its beads in the stored direction, which follows the (random) bead ids.
    const row = page.getByRole('form', { name: /^bond (B1–B2|B2–B1)$/ });
    await row.waitFor({ timeout: 15_000 });
    const label = (await row.getAttribute('aria-label'))!;
    await row.getByLabel(`Value of ${label} (nm)`).fill('0.41');
    await row.getByLabel(`Force constant of ${label} (kJ/mol/nm²)`).fill('-5');
    await row.getByRole('button', { name: 'Save' }).click();
    await row.getByRole('alert').filter({ hasText: /force constant lies from 0/ }).waitFor();
    const read = () => page.evaluate(async (id) => (await (await fetch(`/api/mappings/${id}/bonded-terms`)).json()) as { terms: { value: number | null; k: number | null }[]; exclusions: number | null }, mappingId);
    expect((await read()).terms[0]).toMatchObject({ value: null, k: null });

    await row.getByLabel(`Force constant of ${label} (kJ/mol/nm²)`).fill('1250');
    await row.getByRole('button', { name: 'Save' }).click();
    await expect.poll(async () => (await read()).terms[0], { timeout: 15_000 }).toMatchObject({ kind: 'bond', beads: label.slice('bond '.length).split('–'), value: 0.41, k: 1250 });
    // The table is started and the exclusion count is not set: an error-level check says so.
    await page.getByText('No exclusion count set.').waitFor({ timeout: 15_000 });
    await page.getByLabel('Exclusions (bonds apart, GROMACS nrexcl)').fill('1');
    await page.getByRole('form', { name: 'Exclusion count' }).getByRole('button', { name: 'Save' }).click();
    await expect.poll(async () => (await read()).exclusions, { timeout: 15_000 }).toBe(1);
  });
});
