import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { browserSession } from '../helpers/browser-session';
import { newMappingInPage } from '../helpers/page-mapping';

// Partition values in the browser, through the real client, server, collab socket and MariaDB: an
// ionic bead shows "n/a (ionic)" in the bead table, the table shows both ΔG estimates side by side,
// the partition basis is a live setting of the mapping, a measured value with its source is entered
// in the inspector and wins, and the molecule page warns that a charged species' logP is not a
// partition value. The bead type library shows its "illustrative only" note once, above the table.

const session = browserSession();
beforeAll(() => session.open());
afterAll(() => session.close());

describe('partition values in the editor', () => {
  it('ionic bead, both ΔG columns, basis setting, measured value, molecule warning', async () => {
    const page = await session.signedIn('modeller@example.org', 'beadloom-demo');
    // Sodium butanoate: C1–C4, O5, O6⁻ (1-based), Na7⁺.
    const { moleculeId, mappingId, projectId } = await newMappingInPage(page, { molecule: 'Sodium butanoate', smiles: 'CCCC(=O)[O-].[Na+]', mapping: 'Salt', resolution: '3:1' });

    // The molecule page: the logP of a charged species carries its warning.
    await page.goto(`/molecules/${moleculeId}`);
    await page.getByRole('note').filter({ hasText: /charged species/ }).waitFor();

    await page.goto(`/mappings/${mappingId}`);
    await page.locator('[data-connection="live"]').waitFor();
    const table = page.getByRole('table', { name: 'Beads' });
    for (const header of ['ΔG from atom sum (kJ/mol)', 'ΔG from fragment (kJ/mol)', 'Measured ΔG (kJ/mol)', 'Size class (heavy atoms per bead)']) {
      await table.getByRole('columnheader', { name: header }).waitFor();
    }
    await page.getByText('logP is a 298 K quantity', { exact: false }).waitFor();

    // Na⁺ (index 6) as its own bead: ionic, no partition value.
    await page.locator('[data-atom="6"]').click();
    await page.keyboard.press('b');
    const na = page.getByRole('row', { name: 'Bead B1' });
    await expect.poll(async () => (await na.locator('[data-column="dg"]').textContent())?.trim(), { timeout: 15_000 }).toBe('n/a (ionic)');
    expect((await na.locator('[data-column="dg-fragment"]').textContent())?.trim()).toBe('n/a (ionic)');

    // The first three carbons as a neutral bead: both estimates are numbers.
    await page.locator('[data-atom="0"]').click();
    await page.locator('[data-atom="1"]').click({ modifiers: ['Shift'] });
    await page.locator('[data-atom="2"]').click({ modifiers: ['Shift'] });
    await page.keyboard.press('b');
    const tail = page.getByRole('row', { name: 'Bead B2' });
    await expect.poll(async () => (await tail.locator('[data-column="dg"]').textContent())?.trim(), { timeout: 15_000 }).toMatch(/^[+−]?\d+\.\d$/);
    await expect.poll(async () => (await tail.locator('[data-column="dg-fragment"]').textContent())?.trim(), { timeout: 15_000 }).toMatch(/^[+−]?\d+\.\d$/);
    await expect.poll(async () => (await tail.locator('[data-column="dg-used"]').textContent())?.trim(), { timeout: 15_000 }).toBe('fragment');

    // The basis setting: atom sum.
    await page.getByLabel('Partition basis of suggestions').selectOption('atoms');
    await expect.poll(async () => (await tail.locator('[data-column="dg-used"]').textContent())?.trim(), { timeout: 15_000 }).toBe('atom sum');

    // A measured value for the tail bead (active after it was made); a missing source is refused first.
    await tail.click();
    await page.getByLabel('Measured value', { exact: true }).fill('1.25');
    await page.getByRole('button', { name: 'Save measured value' }).click();
    await page.getByRole('alert').filter({ hasText: /source/ }).waitFor();
    await page.getByLabel('Source of the measured value').fill('invented for this test');
    await page.getByRole('button', { name: 'Save measured value' }).click();
    // 1.25 × 5.70803 kJ/mol = 7.135 (hand arithmetic; ln10 · R · 298.15 K).
    await expect.poll(async () => (await tail.locator('[data-column="dg-measured"]').textContent())?.trim(), { timeout: 15_000 }).toMatch(/^\+7\.1/);
    await expect.poll(async () => (await tail.locator('[data-column="dg-used"]').textContent())?.trim(), { timeout: 15_000 }).toBe('measured');

    // The demo library's note appears once, above its table, and no row repeats it.
    await page.goto(`/projects/${projectId}`);
    const note = page.getByRole('note').filter({ hasText: /Illustrative only/ });
    await note.waitFor();
    expect(await note.count()).toBe(1);
    expect(await page.getByRole('table', { name: 'Bead types' }).getByText(/Illustrative only/).count()).toBe(0);
    await page.getByRole('table', { name: 'Bead types' }).getByRole('columnheader', { name: 'Heavy atoms per bead' }).waitFor();
    expect(session.errors).toEqual([]);
  });
});
