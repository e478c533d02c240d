import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFile } from 'node:fs/promises';
import Papa from 'papaparse';
import type { Page } from 'playwright-core';
import { browserSession } from '../helpers/browser-session';
import { firstMappingId } from '../helpers/demo-ids';

// Issue 5's browser test through the real client, server, collab socket and MariaDB: a modeller saves
// two versions; the supervisor compares them (the moved atom is ringed and listed) and locks
// version 2; the modeller's live canvas turns read-only; the student downloads the production CSV
// and it holds exactly the locked version's beads.

const PASSWORD = 'beadloom-demo';
const session = browserSession();
const pageErrors = session.errors;
const signedIn = (email: string): Promise<Page> => session.signedIn(email, PASSWORD);

async function saveVersion(page: Page, message: string, number: number) {
  await page.getByLabel('Version message').fill(message);
  await page.getByRole('button', { name: 'Save version' }).click();
  await page.getByRole('listitem', { name: `Version ${number}` }).waitFor();
}

beforeAll(() => session.open());
afterAll(() => session.close());

describe('versions, compare, lock and export', () => {
  it('saves, compares, locks live and exports the production CSV', async () => {
    const modeller = await signedIn('modeller@example.org');
    const mappingId = await firstMappingId(modeller);
    await modeller.goto(`/mappings/${mappingId}`);
    await modeller.locator('[data-connection="live"]').waitFor();
    await saveVersion(modeller, 'As seeded', 1);

    // Atom 1 (index 0) leaves its bead and becomes a bead of its own, live; then version 2.
    await modeller.locator('[data-atom="0"]').click();
    await modeller.keyboard.press('r');
    await modeller.keyboard.press('b');
    await modeller.locator('[data-bead-tag="B1"]').waitFor();
    await saveVersion(modeller, 'Atom 1 on its own', 2);

    const supervisor = await signedIn('supervisor@example.org');
    await supervisor.goto(`/mappings/${mappingId}`);
    await supervisor.getByRole('listitem', { name: 'Version 2' }).waitFor();
    await supervisor.getByLabel('Compare from').selectOption('1');
    await supervisor.getByLabel('Compare to').selectOption('2');
    await supervisor.getByRole('button', { name: 'Compare', exact: true }).click();
    const compare = supervisor.getByRole('region', { name: 'Compare Version 1 with Version 2' });
    const v1 = await supervisor.evaluate(async (id) => (await fetch(`/api/mappings/${id}/versions/1`)).json(), mappingId);
    const before = v1.draft.beads.find((b: { atoms: { index: number }[] }) => b.atoms.some((a) => a.index === 0)).name;
    await expect.poll(() => compare.locator('[data-moved-atom]').allTextContents()).toEqual([`Atom 1 moved: ${before} → B1`]);
    // Both pictures ring the moved atom (the server draws the ring for highlight=1).
    for (const alt of ['Version 1, moved atoms ringed', 'Version 2, moved atoms ringed']) {
      const img = compare.getByRole('img', { name: alt });
      expect(await img.getAttribute('src')).toContain('highlight=1');
      await expect.poll(() => img.evaluate((el: HTMLImageElement) => el.complete && el.naturalWidth > 0)).toBe(true);
    }
    const ringed = await supervisor.evaluate(async (src) => (await fetch(src)).text(), (await compare.getByRole('img', { name: 'Version 2, moved atoms ringed' }).getAttribute('src'))!);
    expect(ringed).toContain('data-moved-atom="1"');

    await supervisor.getByLabel('Version to lock for production').selectOption('2');
    await supervisor.getByLabel('Note (optional)').fill('Reviewed for the production runs.');
    await supervisor.getByRole('button', { name: 'Lock for production' }).click();
    await supervisor.getByText('Production: version 2').waitFor();
    await supervisor.getByRole('list', { name: 'Audit trail' }).getByText(/locked version 2/).waitFor();

    // The modeller's canvas turns read-only live, without a reload.
    await modeller.locator('[data-connection="read-only"]').waitFor();
    await modeller.getByText('A production version is locked').waitFor();
    await modeller.locator('[data-atom="5"]').click();
    await modeller.keyboard.press('b');
    await expect.poll(() => modeller.locator('[data-bead-tag="B2"]').count()).toBe(0);

    const student = await signedIn('student@example.org');
    await student.goto(`/mappings/${mappingId}`);
    await student.getByText('Export', { exact: true }).click();
    const links = student.getByRole('list', { name: 'Export Production (version 2)' });
    const [download] = await Promise.all([student.waitForEvent('download'), links.getByRole('link', { name: 'Mapping table (CSV)' }).click()]);
    const csv = await readFile((await download.path())!, 'utf8');
    const rows = Papa.parse<Record<string, string>>(csv, { header: true, comments: '#', skipEmptyLines: true });
    expect(rows.errors).toEqual([]);
    const locked = await student.evaluate(async (id) => (await fetch(`/api/mappings/${id}/versions/2`)).json(), mappingId);
    expect(rows.data.map((r) => [r.bead, r.atoms])).toEqual(locked.draft.beads.map((b: { name: string; atoms: { index: number }[] }) => [b.name, b.atoms.map((a) => a.index + 1).join(' ')]));
    expect(rows.data.find((r) => r.bead === 'B1')?.atoms).toBe('1');
    expect(csv).toContain(`# sha256: ${locked.sha256}`);

    expect(pageErrors).toEqual([]);
  });
});
