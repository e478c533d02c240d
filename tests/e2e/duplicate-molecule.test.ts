import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { browserSession } from '../helpers/browser-session';

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
});
