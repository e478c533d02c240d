import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { MoleculeDetail } from '../../src/shared/molecules';
import { browserSession } from '../helpers/browser-session';
import { flatMolfile } from '../helpers/molfiles';

// Issue 13, point 14: entering a structure the project already has is not a silent duplicate — the
// form names and links the existing molecule, and adds the new one only when asked again.

const session = browserSession();
beforeAll(() => session.open());
afterAll(() => session.close());

describe('a duplicate molecule', () => {
  it('is named and linked, and added only on a second, explicit request', async () => {
    const modeller = await session.signedIn('modeller@example.org', 'beadloom-demo');
    const { projectId, existing } = await modeller.evaluate(async () => {
      const projects = await (await fetch('/api/projects')).json();
      const molecules = await (await fetch(`/api/projects/${projects[0].id}/molecules`)).json();
      return { projectId: projects[0].id as number, existing: molecules[0] as { id: number; name: string; canonicalSmiles: string } };
    });
    await modeller.goto(`/projects/${projectId}/molecules/new`);
    const form = modeller.getByRole('form', { name: 'New molecule from SMILES' });
    await form.getByLabel('Name').fill('Second copy');
    await form.getByLabel('SMILES').fill(existing.canonicalSmiles);
    await form.getByRole('button', { name: 'Add molecule' }).click();
    const warning = form.getByRole('alert');
    await warning.getByText('This project already has this structure as').waitFor();
    expect(await warning.getByRole('link', { name: existing.name }).getAttribute('href')).toBe(`/molecules/${existing.id}`);
    const before = await modeller.evaluate(async (id) => (await (await fetch(`/api/projects/${id}/molecules`)).json()).length, projectId);

    await warning.getByRole('button', { name: 'Add it anyway' }).click();
    await modeller.waitForURL(/\/molecules\/\d+$/);
    expect(modeller.url()).not.toMatch(new RegExp(`/molecules/${existing.id}$`));
    await modeller.getByRole('heading', { level: 1, name: 'Second copy' }).waitFor();
    expect(await modeller.evaluate(async (id) => (await (await fetch(`/api/projects/${id}/molecules`)).json()).length, projectId)).toBe(before + 1);
    expect(session.errors.filter((e) => !/status of 409/.test(e))).toEqual([]);
  });

  it('in an uploaded file is named and linked too, and added only with "Add it anyway"', async () => {
    const modeller = await session.signedIn('modeller@example.org', 'beadloom-demo');
    const projectId = await modeller.evaluate(async () => (await (await fetch('/api/projects')).json())[0].id as number);
    // A structure of our own for this test (nonan-1-ol), created through the API so the upload repeats it.
    const existing = await modeller.evaluate(async (id) => {
      const { token } = await (await fetch('/api/auth/csrf')).json();
      const res = await fetch(`/api/projects/${id}/molecules`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': token }, body: JSON.stringify({ name: 'Nonanol for upload', smiles: 'OCCCCCCCCC', allowDuplicate: true }) });
      return (await res.json()) as MoleculeDetail;
    }, projectId);
    const count = () => modeller.evaluate(async (id) => (await (await fetch(`/api/projects/${id}/molecules`)).json()).length as number, projectId);
    await modeller.goto(`/projects/${projectId}/molecules/new`);
    const form = modeller.getByRole('form', { name: 'Upload a structure file' });
    await form.getByLabel('Molfile or SD file').setInputFiles({ name: 'nonanol.mol', mimeType: 'chemical/x-mdl-molfile', buffer: Buffer.from(flatMolfile('Nonanol again', existing.model)) });
    await form.getByRole('button', { name: 'Upload' }).click();
    const status = form.getByRole('status');
    await status.getByText('0 imported, 1 refused.').waitFor();
    await status.getByText('This project already has this structure as').waitFor();
    expect(await status.getByRole('link', { name: existing.name }).getAttribute('href')).toBe(`/molecules/${existing.id}`);
    const before = await count();

    await status.getByRole('button', { name: 'Add it anyway' }).click();
    await status.getByText('1 imported, 0 refused.').waitFor();
    const added = status.getByRole('link', { name: /^added as / });
    expect(await added.getAttribute('href')).not.toBe(`/molecules/${existing.id}`);
    expect(await count()).toBe(before + 1);
    // Nothing left to add again: the button is gone once the record is in.
    expect(await status.getByRole('button', { name: 'Add it anyway' }).count()).toBe(0);
    expect(session.errors.filter((e) => !/status of 4(09|22)/.test(e))).toEqual([]);
  });
});
