import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { mkdtemp, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { browserSession } from '../helpers/browser-session';
import { generateConformer } from '../../server/chem/index';
import { groText, makeSystem } from '../../seeds/invented-reference';
import type { Molecule } from '../../src/shared/chem';

// Issue 15 through the real client and server: on the molecule page a modeller uploads an invented
// reference of the demo's anisole, sees it matched, starts an analysis of the demo mapping, watches it
// finish and opens its distributions (uPlot charts); picking a term (keyboard in the term list, a click
// on a chart) shows its beads on the drawing and the bead graph, and opens the editor with them marked;
// a student sees both but may not start one. A search that missed the molecule is tried again
// elsewhere without uploading the files again.

const session = browserSession();
let dir: string;

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'beadloom-refs-e2e-'));
  await session.open();
});
afterAll(() => session.close());

/** The demo project's anisole, through the API as the signed-in page sees it. */
async function demoAnisole(page: Page): Promise<{ moleculeId: number; mol: Molecule }> {
  const { moleculeId, model } = await page.evaluate(async () => {
    const projects = await (await fetch('/api/projects')).json();
    const molecules: { id: number; name: string }[] = await (await fetch(`/api/projects/${projects[0].id}/molecules`)).json();
    const anisole = molecules.find((m) => m.name === 'Anisole')!;
    const detail = await (await fetch(`/api/molecules/${anisole.id}`)).json();
    return { moleculeId: anisole.id, model: detail.model };
  });
  return { moleculeId, mol: model as Molecule };
}

describe('references and analyses in the browser', () => {
  it('uploads a reference, runs an analysis and shows its distributions', async () => {
    const modeller = await session.signedIn('modeller@example.org', 'beadloom-demo');
    const { moleculeId, mol } = await demoAnisole(modeller);
    const s = makeSystem(mol, await generateConformer(mol, { seed: 5 }), { copies: 8, frames: 12, boxA: 40, noiseA: 0.05, seed: 8 });
    await writeFile(join(dir, 'box.gro'), groText(s, s.frames.slice(0, 1)));
    await writeFile(join(dir, 'traj.gro'), groText(s));

    await modeller.goto(`/molecules/${moleculeId}`);
    const upload = modeller.getByRole('form', { name: 'Upload a reference' });
    await upload.getByLabel('Name', { exact: true }).fill('Anisole box');
    await upload.getByLabel('Structure (.gro, .pdb, .mol)').setInputFiles(join(dir, 'box.gro'));
    await upload.getByLabel(/^Trajectory/).setInputFiles(join(dir, 'traj.gro'));
    await upload.getByRole('button', { name: 'Upload reference' }).click();
    const refs = modeller.getByRole('list', { name: 'References' });
    await refs.getByText('8 copies × 12 frames', { exact: false }).waitFor({ timeout: 60_000 });

    const start = modeller.getByRole('form', { name: 'Start an analysis' });
    await start.getByRole('button', { name: 'Start analysis' }).click();
    const analyses = modeller.getByRole('list', { name: 'Analyses' });
    await analyses.getByRole('button', { name: 'Show distributions' }).click({ timeout: 60_000 });
    await modeller.getByRole('region', { name: 'bonds distributions' }).waitFor();
    expect(await modeller.locator('figure .uplot').count()).toBeGreaterThan(0);

    // A term picked in the term list, with the keyboard, shows its beads on the analysed state's drawing
    // (its atoms ringed) and in the bead graph (its two beads marked).
    const terms = modeller.getByRole('list', { name: 'Terms' });
    const firstBond = terms.getByRole('button').first();
    const bondName = ((await firstBond.textContent()) ?? '').split(' ')[1];
    const [b1, b2] = bondName.split('–');
    await firstBond.focus();
    await modeller.keyboard.press('Enter');
    await expect(firstBond.getAttribute('aria-pressed')).resolves.toBe('true');
    const beads = modeller.getByRole('region', { name: `Beads of the bond ${bondName}` });
    await beads.waitFor();
    await expect.poll(() => beads.locator('[data-term-bead][data-picked="true"]').evaluateAll((els) => els.map((e) => e.getAttribute('data-term-bead')).sort())).toEqual([b1, b2].sort());
    const picture = beads.getByRole('img', { name: /^Drawing of/ });
    await expect(picture.getAttribute('src')).resolves.toMatch(/format=svg.*highlight=\d/);
    await expect.poll(() => picture.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0)).toBe(true);

    // A click on another term's chart picks that term instead.
    const angles = modeller.getByRole('region', { name: 'angles distributions' });
    const angleFigure = angles.locator('figure').first();
    const angleLabel = (await angleFigure.getAttribute('aria-label'))!.split(':')[0].replace(/^angle /, '').replaceAll('-', '–');
    await angleFigure.click();
    const angleBeads = modeller.getByRole('region', { name: `Beads of the angle ${angleLabel}` });
    await angleBeads.waitFor();
    await expect(angleBeads.locator('[data-term-bead][data-picked="true"]').count()).resolves.toBe(3);

    // The editor opens with the term's beads marked in its bead graph and their atoms ringed.
    await angleBeads.getByRole('link', { name: 'Open in the editor with these beads selected' }).click();
    await modeller.locator('[data-connection="live"]').waitFor();
    await expect.poll(() => modeller.locator('[data-graph-bead][data-active="true"]').count(), { timeout: 10_000 }).toBe(3);
    expect(await modeller.locator('[data-flagged]').count()).toBeGreaterThanOrEqual(3);

    const student = await session.signedIn('student@example.org', 'beadloom-demo');
    await student.goto(`/molecules/${moleculeId}`);
    await student.getByRole('list', { name: 'Analyses' }).getByText('done').waitFor();
    expect(await student.getByRole('form', { name: 'Start an analysis' }).count()).toBe(0);
    expect(await student.getByRole('form', { name: 'Upload a reference' }).count()).toBe(0);
  }, 180_000);

  it('a search that missed the molecule keeps the files: the modeller looks elsewhere and matches again without uploading', async () => {
    const modeller = await session.signedIn('modeller@example.org', 'beadloom-demo');
    const { moleculeId, mol } = await demoAnisole(modeller);
    const s = makeSystem(mol, await generateConformer(mol, { seed: 6 }), { copies: 5, frames: 3, boxA: 36, noiseA: 0.05, seed: 9, residue: 'ANI' });
    await writeFile(join(dir, 'missed.gro'), groText(s));

    await modeller.goto(`/molecules/${moleculeId}`);
    const upload = modeller.getByRole('form', { name: 'Upload a reference' });
    await upload.getByLabel('Name', { exact: true }).fill('Missed box');
    await upload.getByLabel('Structure (.gro, .pdb, .mol)').setInputFiles(join(dir, 'missed.gro'));
    await upload.getByLabel('Where to look (optional)').fill('{ "residue": "SOL" }');
    await upload.getByRole('button', { name: 'Upload reference' }).click();
    const again = modeller.getByRole('form', { name: 'Match Missed box again' });
    await again.waitFor({ timeout: 60_000 });
    await modeller.getByRole('list', { name: 'References' }).getByText('No atom of the reference belongs to a residue named SOL').waitFor();
    // Not JSON is caught in the page; then the right residue finds every copy.
    await again.getByLabel('Look elsewhere (the files are kept)').fill('residue ANI');
    await again.getByRole('button', { name: 'Match again' }).click();
    await again.getByText('Not JSON', { exact: false }).waitFor();
    await again.getByLabel('Look elsewhere (the files are kept)').fill('{ "residue": "ANI" }');
    await again.getByRole('button', { name: 'Match again' }).click();
    await modeller.getByRole('list', { name: 'References' }).getByText('5 copies × 3 frames', { exact: false }).waitFor({ timeout: 60_000 });
    expect(await modeller.getByRole('form', { name: 'Match Missed box again' }).count()).toBe(0);
  }, 120_000);
});
