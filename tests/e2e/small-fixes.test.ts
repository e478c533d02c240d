import type { Response } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { browserSession } from '../helpers/browser-session';

// Issue 13, point 9: two small fixes found by first users — the admin's create-account form shows
// only the answer to the latest attempt, and a molecule page asks for no project it does not have.

const PASSWORD = 'beadloom-demo';
const session = browserSession();
beforeAll(() => session.open());
afterAll(() => session.close());

describe('the create-account form', () => {
  it('clears the last error when a new attempt is made', async () => {
    const admin = await session.signedIn('admin@example.org', PASSWORD);
    await admin.goto('/admin/users');
    const form = admin.getByRole('form', { name: 'Create an account' });
    const taken = form.getByText('An account with that e-mail address already exists.');

    await form.getByLabel('E-mail').fill('modeller@example.org');
    await form.getByLabel('Display name').fill('Second modeller');
    await form.getByRole('button', { name: 'Create account' }).click();
    await taken.waitFor();

    // A new attempt that the form itself refuses: its own message, and the server's old one is gone.
    await form.getByLabel('E-mail').fill('not an address');
    await form.getByRole('button', { name: 'Create account' }).click();
    await form.locator('[aria-invalid="true"]').first().waitFor();
    await taken.waitFor({ state: 'detached' });

    // A second server refusal is shown once, not beside the first.
    await form.getByLabel('E-mail').fill('student@example.org');
    await form.getByRole('button', { name: 'Create account' }).click();
    await taken.waitFor();
    expect(await taken.count()).toBe(1);
    expect(await form.getByRole('alert').count()).toBe(1);
    expect(session.errors.filter((e) => !/status of 409/.test(e))).toEqual([]);
  });
});

describe('a molecule page', () => {
  it('requests no /api/projects/0 and gets no 404 from the API', async () => {
    const modeller = await session.signedIn('modeller@example.org', PASSWORD);
    const moleculeId = await modeller.evaluate(async () => {
      const projects = await (await fetch('/api/projects')).json();
      return (await (await fetch(`/api/projects/${projects[0].id}/molecules`)).json())[0].id as number;
    });
    const seen: { url: string; status: number }[] = [];
    const record = (r: Response) => {
      if (new URL(r.url()).pathname.startsWith('/api/')) seen.push({ url: new URL(r.url()).pathname, status: r.status() });
    };
    modeller.on('response', record);
    await modeller.goto(`/molecules/${moleculeId}`);
    await modeller.getByRole('button', { name: 'Import a mapping…' }).waitFor();
    await modeller.waitForLoadState('networkidle');
    modeller.off('response', record);
    // The page did ask the API (else the test could not fail), and for the molecule itself.
    expect(seen.some((r) => r.url === `/api/molecules/${moleculeId}`)).toBe(true);
    expect(seen.filter((r) => r.url.startsWith('/api/projects/0'))).toEqual([]);
    expect(seen.filter((r) => r.status === 404)).toEqual([]);
  });
});
