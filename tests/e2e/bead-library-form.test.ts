import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { browserSession } from '../helpers/browser-session';

// The bead type library's edit form (react-hook-form with the route's own schema) in the real
// browser: a new type without a name and with ΔG min above max is refused beside its cells, with
// aria-invalid and the message tied by aria-describedby, and the first invalid cell takes focus;
// once fixed it saves, and the server's library holds the new type.

const session = browserSession();
beforeAll(() => session.open());
afterAll(() => session.close());

describe('bead type library form', () => {
  it('refuses a bad row beside its cells, focuses it, then saves the fixed row', async () => {
    const page = await session.signedIn('modeller@example.org', 'beadloom-demo');
    const projectId = await page.evaluate(async () => (await (await fetch('/api/projects')).json())[0].id as number);
    const before = await page.evaluate(async (id) => (await (await fetch(`/api/projects/${id}/bead-types`)).json()).types.length as number, projectId);
    await page.goto(`/projects/${projectId}`);
    await page.getByRole('button', { name: 'Edit library' }).click();
    await page.getByRole('button', { name: 'Add a type' }).click();
    const n = before + 1;
    const lowest = page.getByLabel(`Lowest ΔG of type ${n}`);
    await lowest.fill('5');
    await page.getByLabel(`Highest ΔG of type ${n}`).fill('1');
    await page.getByRole('button', { name: 'Save library' }).click();

    const name = page.getByLabel(`Name of type ${n}`);
    await expect.poll(() => name.getAttribute('aria-invalid')).toBe('true');
    // Focus goes to the first invalid field, the new row's name.
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('id'))).toBe(await name.getAttribute('id'));
    // The messages are the shared schema's, each tied to its cell.
    const describedBy = async (field: typeof name) => page.evaluate((ids) => ids!.split(' ').map((id) => document.getElementById(id)?.textContent).join(' '), await field.getAttribute('aria-describedby'));
    expect(await describedBy(name)).toBe('A bead type needs a name.');
    expect(await lowest.getAttribute('aria-invalid')).toBe('true');
    expect(await describedBy(lowest)).toBe('deltaGMin must not exceed deltaGMax.');

    await name.fill('Form test type');
    await lowest.fill('-1');
    await page.getByRole('button', { name: 'Save library' }).click();
    await page.getByText('The library is saved; open mappings re-evaluate with it.').waitFor();
    const saved = await page.evaluate(async (id) => (await (await fetch(`/api/projects/${id}/bead-types`)).json()).types, projectId);
    expect(saved).toHaveLength(n);
    expect(saved[n - 1]).toEqual({ name: 'Form test type', heavyAtomsPerBead: 4, charge: 0, deltaGMin: -1, deltaGMax: 1, description: '' });
    expect(session.errors).toEqual([]);
  });
});
