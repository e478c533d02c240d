import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtemp, readFile, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { browserSession } from '../helpers/browser-session';
import { firstMappingId } from '../helpers/demo-ids';

// Issue 13, point 10, through the real client and server: the export menu offers a chosen saved
// version; the molecule page's Import dialog previews where a JSON export's beads land, imports it,
// asks again for a hand-edited file (hash mismatch → allowModified) and shows a 422 refusal's message.

const session = browserSession();
let dir: string;

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'beadloom-import-'));
  await session.open();
});
afterAll(() => session.close());

async function openImport(page: Page, moleculeId: number, file: string) {
  await page.goto(`/molecules/${moleculeId}`);
  await page.getByRole('button', { name: 'Import a mapping…' }).click();
  const dialog = page.getByRole('dialog', { name: /^Import a mapping onto / });
  await dialog.getByLabel('Mapping file (JSON export)').setInputFiles(file);
  return dialog;
}

describe('import and export by version', () => {
  it('exports a chosen version, previews and imports it, confirms an edited file and shows a refusal', async () => {
    const modeller = await session.signedIn('modeller@example.org', 'beadloom-demo');
    const mappingId = await firstMappingId(modeller);
    const mapping = await modeller.evaluate(async (id) => (await fetch(`/api/mappings/${id}`)).json(), mappingId);
    await modeller.goto(`/mappings/${mappingId}`);
    await modeller.locator('[data-connection="live"]').waitFor();
    for (const [message, n] of [['first', 1], ['second', 2]] as const) {
      await modeller.getByLabel('Version message').fill(message);
      await modeller.getByRole('button', { name: 'Save version' }).click();
      await modeller.getByRole('list', { name: 'Versions' }).getByRole('listitem', { name: `Version ${n}` }).waitFor();
    }

    // The export menu: the draft, and a select of saved versions (newest first) with its own links.
    await modeller.getByText('Export', { exact: true }).click();
    const select = modeller.getByLabel('A saved version');
    expect(await select.locator('option').allTextContents()).toEqual(['Version 2', 'Version 1']);
    await select.selectOption('1');
    const links = modeller.getByRole('list', { name: 'Export Version 1' });
    expect(await links.getByRole('link', { name: 'Mapping (JSON)' }).getAttribute('href')).toBe(`/api/mappings/${mappingId}/export?format=json&version=1`);
    const [download] = await Promise.all([modeller.waitForEvent('download'), links.getByRole('link', { name: 'Mapping (JSON)' }).click()]);
    const text = await readFile((await download.path())!, 'utf8');
    const exported = JSON.parse(text);
    const v1 = await modeller.evaluate(async (id) => (await fetch(`/api/mappings/${id}/versions/1`)).json(), mappingId);
    expect(exported.sha256).toBe(v1.sha256);
    const file = join(dir, 'v1.json');
    await writeFile(file, text);

    // Preview: the beads on the molecule, atom numbers from 1, nothing written yet.
    const before = await modeller.evaluate(async (id) => (await (await fetch(`/api/molecules/${id}/mappings`)).json()).length, mapping.moleculeId);
    let dialog = await openImport(modeller, mapping.moleculeId, file);
    const preview = dialog.getByRole('region', { name: 'Import preview' });
    await preview.waitFor();
    const rows = await preview.locator('tbody tr').evaluateAll((trs) => trs.map((tr) => [tr.children[0].textContent, tr.children[2].textContent]));
    expect(rows).toEqual(exported.content.beads.map((b: { name: string; atoms: [number, number][] }) => [b.name, b.atoms.map(([n, w]) => (w === 1 ? String(n) : `${n} (${w})`)).join(', ')]));
    const coloured = await preview.locator('[data-preview-atom]').evaluateAll((cs) => cs.filter((c) => c.getAttribute('data-bead-colour') !== 'none').length);
    expect(coloured).toBe(new Set(exported.content.beads.flatMap((b: { atoms: [number, number][] }) => b.atoms.map(([n]) => n))).size);
    // Drawn by the shared renderer (src/shared/drawing): one hull per bead, in the colour its atoms are marked with.
    const hulls = await preview.locator('path[data-bead]').evaluateAll((ps) => ps.map((p) => p.getAttribute('fill')));
    expect(hulls).toHaveLength(exported.content.beads.length);
    const marked = await preview.locator('[data-preview-atom]').evaluateAll((cs) => cs.map((c) => c.getAttribute('data-bead-colour')).filter((c) => c !== 'none'));
    expect(new Set(marked)).toEqual(new Set(hulls));
    expect(await modeller.evaluate(async (id) => (await (await fetch(`/api/molecules/${id}/mappings`)).json()).length, mapping.moleculeId)).toBe(before);

    await dialog.getByRole('button', { name: 'Import', exact: true }).click();
    await modeller.waitForURL(/\/mappings\/\d+$/);
    await modeller.getByRole('heading', { level: 1, name: `${exported.mapping.name} (imported)` }).waitFor();

    // A hand-edited file: the preview says so, the import is refused by its hash, then confirmed.
    const edited = { ...exported, content: { ...exported.content, beads: exported.content.beads.map((b: { name: string }, i: number) => (i === 0 ? { ...b, name: 'EDITED' } : b)) } };
    const editedFile = join(dir, 'edited.json');
    await writeFile(editedFile, JSON.stringify(edited));
    dialog = await openImport(modeller, mapping.moleculeId, editedFile);
    await dialog.getByText('The file was changed after export').waitFor();
    await dialog.getByRole('button', { name: 'Import', exact: true }).click();
    await dialog.getByText('This file was changed after it was exported.').waitFor();
    await dialog.getByRole('button', { name: 'Import the edited file' }).click();
    await modeller.waitForURL(/\/mappings\/\d+$/);
    const importedId = Number(new URL(modeller.url()).pathname.split('/').pop());
    const imported = await modeller.evaluate(async (id) => (await fetch(`/api/mappings/${id}`)).json(), importedId);
    expect(imported.draft.beads.map((b: { name: string }) => b.name)).toContain('EDITED');

    // A file of another molecule: 422, its message shown, nothing imported.
    const foreign = { ...exported, content: { ...exported.content, canonicalSmiles: 'CCCCCCCCCCCCCCCCCCCCO' } };
    const foreignFile = join(dir, 'foreign.json');
    await writeFile(foreignFile, JSON.stringify(foreign));
    const count = await modeller.evaluate(async (id) => (await (await fetch(`/api/molecules/${id}/mappings`)).json()).length, mapping.moleculeId);
    dialog = await openImport(modeller, mapping.moleculeId, foreignFile);
    const refusal = dialog.getByRole('alert');
    await refusal.waitFor();
    expect(await refusal.textContent()).toMatch(/CCCCCCCCCCCCCCCCCCCCO/);
    expect(await dialog.getByRole('button', { name: 'Import', exact: true }).isDisabled()).toBe(true);
    expect(await modeller.evaluate(async (id) => (await (await fetch(`/api/molecules/${id}/mappings`)).json()).length, mapping.moleculeId)).toBe(count);

    expect(session.errors.filter((e) => !/422|Unprocessable/.test(e))).toEqual([]);
  });
});
