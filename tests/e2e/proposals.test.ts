import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { browserSession } from '../helpers/browser-session';
import { addModeller } from '../helpers/second-modeller';
import { newMappingInPage } from '../helpers/page-mapping';

// Issue 17's browser test, through the real client, server, collab socket and MariaDB: one modeller
// asks for a proposal (the P shortcut), accepts two of its beads and dismisses one, while a second
// modeller sees the ghosts, then the accepted beads, live, and accepts a bead of the proposal too; each
// one's undo takes back their own last accept (one transaction, one undo step) for everyone; the
// proposal is the mapping's, so it survives the proposer's reload.

const PASSWORD = 'beadloom-demo';
const SECOND = { email: 'ines.varga@example.org', name: 'Ines Varga', password: 'second-modeller-pass-47' };

const session = browserSession();
const pageErrors = session.errors;

const tag = (page: Page, name: string) => page.locator(`[data-bead-tag="${name}"]`);
const ghost = (page: Page, name: string) => page.locator(`[data-ghost="${name}"]`);

/** Proposes for the whole molecule with the P shortcut; the list of proposed beads once it shows. */
async function proposeWholeMolecule(page: Page) {
  await page.getByRole('radio', { name: 'Whole molecule' }).check();
  await page.locator('svg[role="application"]').focus();
  await page.keyboard.press('p');
  const proposed = page.getByRole('list', { name: 'Proposed beads' });
  await proposed.getByRole('listitem').first().waitFor();
  return proposed;
}

beforeAll(async () => {
  await session.open();
  await addModeller(session, SECOND);
});
afterAll(() => session.close());

describe('proposals in the editor', () => {
  it('shows one modeller’s proposal to the other live; accepted beads arrive, dismissed ones go', async () => {
    const first = await session.signedIn('modeller@example.org', PASSWORD);
    const second = await session.signedIn(SECOND.email, SECOND.password);

    // A fresh, empty mapping of the demo's ibuprofen.
    const mappingId = await first.evaluate(async () => {
      const projects = await (await fetch('/api/projects')).json();
      const molecules = await (await fetch(`/api/projects/${projects[0].id}/molecules`)).json();
      const ibuprofen = molecules.find((m: { name: string }) => m.name === 'Ibuprofen');
      const { token } = await (await fetch('/api/auth/csrf')).json();
      const res = await fetch(`/api/molecules/${ibuprofen.id}/mappings`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'x-csrf-token': token },
        body: JSON.stringify({ name: 'Proposed live', resolution: '4:1' }),
      });
      return (await res.json()).id as number;
    });

    for (const page of [first, second]) await page.goto(`/mappings/${mappingId}`);
    await first.locator('[data-connection="live"]').waitFor();
    await second.locator('[data-connection="live"]').waitFor();

    // The first modeller proposes with the keyboard shortcut (scope: the whole molecule).
    const proposed = await proposeWholeMolecule(first);
    const count = await proposed.getByRole('listitem').count();
    expect(count).toBeGreaterThanOrEqual(4);

    // The second modeller sees every ghost, labelled as the first modeller's.
    await expect.poll(() => second.locator('[data-ghost-owner="Tomas Brenn"]').count(), { timeout: 10_000 }).toBe(count);
    await second.getByText(`Tomas Brenn proposes ${count} beads`).waitFor();

    // The alternatives can be put on show instead of the best one, for everyone; back to the best.
    const which = first.getByRole('group', { name: 'Which proposal' });
    await which.getByRole('button', { name: /^Alternative 1/ }).click();
    const alternative = await proposed.getByRole('listitem').count();
    await expect.poll(() => second.locator('[data-ghost-owner="Tomas Brenn"]').count(), { timeout: 10_000 }).toBe(alternative);
    await which.getByRole('button', { name: /^Best/ }).click();
    await expect.poll(() => second.locator('[data-ghost-owner="Tomas Brenn"]').count(), { timeout: 10_000 }).toBe(count);

    // Accept B1 and B2, dismiss B3.
    await first.getByRole('button', { name: 'Accept B1' }).click();
    await first.getByRole('button', { name: 'Accept B2' }).click();
    await first.getByRole('button', { name: 'Dismiss B3' }).click();

    for (const page of [first, second]) {
      await tag(page, 'B1').waitFor();
      await tag(page, 'B2').waitFor();
      await ghost(page, 'B3').waitFor({ state: 'detached' });
      await ghost(page, 'B1').waitFor({ state: 'detached' });
    }
    await expect(tag(second, 'B3').count()).resolves.toBe(0);
    await expect(ghost(second, 'B4').count()).resolves.toBe(1);
    await expect.poll(() => second.locator('[data-ghost-owner="Tomas Brenn"]').count()).toBe(count - 3);

    // The second modeller, not the proposer, accepts B4 from the same proposal.
    await second.getByRole('button', { name: 'Accept B4' }).click();
    for (const page of [first, second]) {
      await tag(page, 'B4').waitFor();
      await ghost(page, 'B4').waitFor({ state: 'detached' });
    }
    await expect.poll(() => first.locator('[data-ghost-owner="you"]').count()).toBe(count - 4);

    // Undo is the accepting person's: one step takes back the last accept (B2) for everyone, and its
    // ghost comes back; the second modeller's accept (B4) stays.
    await first.locator('svg[role="application"]').focus();
    await first.keyboard.press('Control+z');
    await tag(second, 'B2').waitFor({ state: 'detached' });
    await ghost(second, 'B2').waitFor();
    await expect(tag(second, 'B1').count()).resolves.toBe(1);
    await expect(tag(second, 'B4').count()).resolves.toBe(1);
    // The second modeller's undo takes back B4 only.
    await second.locator('svg[role="application"]').focus();
    await second.keyboard.press('Control+z');
    await tag(first, 'B4').waitFor({ state: 'detached' });
    await ghost(first, 'B4').waitFor();
    await expect(tag(first, 'B1').count()).resolves.toBe(1);

    // The proposer reloads: the open proposal is the mapping's, so the ghosts are still there for both.
    await first.reload();
    await first.locator('[data-connection="live"]').waitFor();
    await expect.poll(() => first.locator('[data-ghost-owner="you"]').count(), { timeout: 10_000 }).toBe(count - 2);
    await expect(first.getByRole('list', { name: 'Proposed beads' }).getByRole('listitem').count()).resolves.toBe(count - 2);
    await expect(second.locator('[data-ghost-owner="Tomas Brenn"]').count()).resolves.toBe(count - 2);

    // Dismiss all, here by the second modeller, clears the ghosts for everyone.
    await second.getByRole('button', { name: 'Dismiss all' }).click();
    await expect.poll(() => first.locator('[data-ghost-owner]').count()).toBe(0);
    await expect.poll(() => second.locator('[data-ghost-owner]').count()).toBe(0);

    expect(pageErrors).toEqual([]);
  });

  it('shows ghosts that share atoms (adamantane) and accepts them into beads that share those atoms', async () => {
    const page = await session.signedIn('modeller@example.org', PASSWORD);
    const { mappingId } = await newMappingInPage(page, { molecule: 'Adamantane', smiles: 'C1C2CC3CC1CC(C2)C3', mapping: 'Shared CH2', resolution: '4:1' });
    await page.goto(`/mappings/${mappingId}`);
    await page.locator('[data-connection="live"]').waitFor();
    const proposed = await proposeWholeMolecule(page);
    // Four bridgehead beads, each sharing its three CH2 (docs/collaboration.md, "Ghosts that share atoms").
    await expect.poll(() => page.locator('[data-ghost-owner="you"]').count(), { timeout: 10_000 }).toBe(4);
    for (const item of await proposed.getByRole('listitem').all()) await expect(item.textContent()).resolves.toContain('shares 3 atoms · weighted size 2.5');

    await page.getByRole('button', { name: 'Accept all' }).click();
    for (const name of ['B1', 'B2', 'B3', 'B4']) await tag(page, name).waitFor();
    await expect.poll(() => page.locator('[data-ghost-owner]').count()).toBe(0);
    // Stored: every CH2 half in each of two beads, every atom's weights summing to 1.
    const entries = async () => {
      const { draft } = await page.evaluate(async (id) => (await fetch(`/api/mappings/${id}`)).json(), mappingId);
      const perAtom = new Map<number, number[]>();
      for (const b of draft.beads as { atoms: { index: number; weight: number }[] }[]) for (const a of b.atoms) perAtom.set(a.index, [...(perAtom.get(a.index) ?? []), a.weight]);
      return [...perAtom.entries()].sort((x, y) => x[0] - y[0]).map(([, ws]) => ws.sort().join('+'));
    };
    await expect.poll(entries, { timeout: 10_000 }).toEqual(expect.arrayContaining(['0.5+0.5', '1']));
    const stored = await entries();
    expect(stored).toHaveLength(10);
    expect(stored.filter((e) => e === '0.5+0.5')).toHaveLength(6);
    expect(stored.filter((e) => e === '1')).toHaveLength(4);
    expect(pageErrors).toEqual([]);
  });

  it('creates a mapping that starts from the automatic proposal from the molecule page', async () => {
    const page = await session.signedIn('modeller@example.org', PASSWORD);
    const moleculeId = await page.evaluate(async () => {
      const projects = await (await fetch('/api/projects')).json();
      const molecules = await (await fetch(`/api/projects/${projects[0].id}/molecules`)).json();
      return molecules.find((m: { name: string }) => m.name === 'Ibuprofen').id as number;
    });
    await page.goto(`/molecules/${moleculeId}`);
    const form = page.getByRole('form', { name: 'New mapping' });
    await form.getByLabel('Mapping name').fill('From the proposal');
    await form.getByLabel('Start from').selectOption({ label: 'Automatic proposal (edit it together afterwards)' });
    await form.getByRole('button', { name: 'Create and open' }).click();
    await page.locator('[data-connection="live"]').waitFor();
    await tag(page, 'B1').waitFor();
    await expect.poll(() => page.locator('[data-bead-tag]').count()).toBeGreaterThanOrEqual(4);
    expect(pageErrors).toEqual([]);
  });

  it('transfers a saved version of a related molecule’s mapping from the form and shows the transfer report', async () => {
    const page = await session.signedIn('modeller@example.org', PASSWORD);
    const { targetId, version, sourceLabel } = await page.evaluate(async () => {
      const projects = await (await fetch('/api/projects')).json();
      const molecules = await (await fetch(`/api/projects/${projects[0].id}/molecules`)).json();
      const c12e4 = molecules.find((m: { name: string }) => m.name.includes('C12E4'));
      const [source] = await (await fetch(`/api/molecules/${c12e4.id}/mappings`)).json();
      const { token } = await (await fetch('/api/auth/csrf')).json();
      const post = (url: string, body: unknown) => fetch(url, { method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': token }, body: JSON.stringify(body) }).then((r) => r.json());
      const saved = await post(`/api/mappings/${source.id}/versions`, { message: 'Agreed tail' });
      const target = await post(`/api/projects/${projects[0].id}/molecules`, { name: 'C12E6 for the transfer', smiles: `${'C'.repeat(12)}${'OCC'.repeat(6)}O` });
      return { targetId: target.id as number, version: saved.number as number, sourceLabel: `Transfer from ${c12e4.name}: “${source.name}”` };
    });

    await page.goto(`/molecules/${targetId}`);
    const form = page.getByRole('form', { name: 'New mapping' });
    await form.getByLabel('Mapping name').fill('C12E6 from the agreed tail');
    await form.getByLabel('Start from').selectOption({ label: sourceLabel });
    // The source's state: its draft, or any saved version (this one, chosen with the keyboard).
    const which = form.getByLabel('Version of the source');
    await which.locator(`option[value="${version}"]`).waitFor({ state: 'attached' });
    await which.focus();
    await which.selectOption(String(version));
    await form.getByRole('button', { name: 'Create and open' }).click();

    const report = page.getByRole('region', { name: /^Transfer report/ });
    await report.waitFor();
    await expect(report.getByRole('heading').textContent()).resolves.toContain(`version ${version}`);
    await expect(report.textContent()).resolves.toMatch(/25 of 31 heavy atoms have a counterpart/);
    await expect(report.locator('dt', { hasText: 'Carried over' }).textContent()).resolves.not.toBe('Carried over (0)');
    await expect(report.locator('dd').first().textContent()).resolves.toContain('T1');
    await page.locator('[data-connection="live"]').waitFor();
    await tag(page, 'T1').waitFor();

    // A reload keeps the report; dismissing it removes it, and its summary stays in the description.
    await page.reload();
    await report.waitFor();
    await report.getByRole('button', { name: 'Dismiss' }).click();
    await report.waitFor({ state: 'detached' });
    await page.goto(`/molecules/${targetId}`);
    await page.getByRole('list', { name: 'Mappings' }).getByText(`(version ${version}): 25 of 31 heavy atoms matched`).waitFor();
    expect(pageErrors).toEqual([]);
  });
});
