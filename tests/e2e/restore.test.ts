import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { browserSession } from '../helpers/browser-session';
import { firstMappingId } from '../helpers/demo-ids';

// Issue 13, point 1, through the real client, server, collab socket and MariaDB: "Restore into
// draft" first asks (saying what is replaced), keeps the edited draft as a version "before restore of
// v1", and the restorer's Undo brings the edited draft back — for everyone.

const PASSWORD = 'beadloom-demo';
const session = browserSession();
const signedIn = (email: string): Promise<Page> => session.signedIn(email, PASSWORD);

beforeAll(() => session.open());
afterAll(() => session.close());

const draftOf = (page: Page, id: number) =>
  page.evaluate(async (mappingId) => {
    const m = await (await fetch(`/api/mappings/${mappingId}`)).json();
    return m.draft.beads.map((b: { name: string; atoms: { index: number }[] }) => `${b.name}:${b.atoms.map((a) => a.index).join(',')}`).sort().join(' ');
  }, id);

describe('restore into draft', () => {
  it('asks first, keeps the draft as a version and is one undoable step', async () => {
    const modeller = await signedIn('modeller@example.org');
    const mappingId = await firstMappingId(modeller);
    await modeller.goto(`/mappings/${mappingId}`);
    await modeller.locator('[data-connection="live"]').waitFor();
    await modeller.getByLabel('Version message').fill('As seeded');
    await modeller.getByRole('button', { name: 'Save version' }).click();
    const versions = modeller.getByRole('list', { name: 'Versions' });
    await versions.getByRole('listitem', { name: 'Version 1' }).waitFor();
    const seeded = await draftOf(modeller, mappingId);

    // An edit that is not saved: atom 1 (index 0) becomes a bead of its own.
    await modeller.locator('[data-atom="0"]').click();
    await modeller.keyboard.press('r');
    await modeller.keyboard.press('b');
    await modeller.locator('[data-bead-tag="B1"]').waitFor();
    await expect.poll(() => draftOf(modeller, mappingId)).not.toBe(seeded);
    const edited = await draftOf(modeller, mappingId);

    // The confirmation says what is replaced; Cancel changes nothing.
    const restoreV1 = () => versions.getByRole('listitem', { name: 'Version 1' }).getByRole('button', { name: 'Restore into draft' }).click();
    await restoreV1();
    const dialog = modeller.getByRole('dialog', { name: 'Restore version 1 into the draft?' });
    await dialog.waitFor();
    expect(await dialog.textContent()).toMatch(/The whole draft — its \d+ beads.*is replaced by version 1/);
    expect(await dialog.textContent()).toContain('before restore of v1');
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialog.waitFor({ state: 'detached' });
    expect(await draftOf(modeller, mappingId)).toBe(edited);

    await restoreV1();
    await dialog.getByRole('button', { name: 'Restore version 1' }).click();
    const snapshot = versions.getByRole('listitem', { name: 'Version 2' });
    await snapshot.getByText('before restore of v1').waitFor();
    await modeller.getByText('Restored version 1; the draft as it was is kept as version 2.').waitFor();
    await modeller.locator('[data-bead-tag="B1"]').waitFor({ state: 'detached' });
    await expect.poll(() => draftOf(modeller, mappingId)).toBe(seeded);
    const kept = await modeller.evaluate(async (id) => (await fetch(`/api/mappings/${id}/versions/2`)).json(), mappingId);
    expect(kept.draft.beads.find((b: { name: string }) => b.name === 'B1').atoms).toEqual([{ index: 0, weight: 1 }]);

    // A second person watching sees the undo too: it is an ordinary edit of the restorer's.
    const supervisor = await signedIn('supervisor@example.org');
    await supervisor.goto(`/mappings/${mappingId}`);
    await supervisor.locator('[data-connection="live"]').waitFor();
    await supervisor.locator('[data-bead-tag="B1"]').waitFor({ state: 'detached' });

    await modeller.getByRole('toolbar', { name: 'Mapping tools' }).getByRole('button', { name: 'Undo', exact: true }).click();
    await modeller.locator('[data-bead-tag="B1"]').waitFor();
    await supervisor.locator('[data-bead-tag="B1"]').waitFor();
    await expect.poll(() => draftOf(modeller, mappingId)).toBe(edited);

    expect(session.errors).toEqual([]);
  });
});
