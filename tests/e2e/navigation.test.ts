import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page, Request } from 'playwright-core';
import { browserSession } from '../helpers/browser-session';
import { firstMappingId } from '../helpers/demo-ids';

// The router-first client through the real server and Chromium: pages get their code as separate
// chunks (the sign-in page does not download the editor), loaders fill the cache before a page
// shows (the mapping page asks for its data together, not one read after another), a 404 from any
// loader lands on the one "Nothing here" boundary inside the shell, a signed-out deep link comes
// back after sign-in, and what a person may do comes from the shared rule table (a site admin who
// is not a member may start a mapping, as the server allows).

const PASSWORD = 'beadloom-demo';
const session = browserSession();

/** The paths of the JS files a page asked for while `run` ran. */
async function scriptsLoaded(page: Page, run: () => Promise<void>): Promise<string[]> {
  const seen: string[] = [];
  const onRequest = (r: Request) => void (r.resourceType() === 'script' && seen.push(new URL(r.url()).pathname));
  page.on('request', onRequest);
  try {
    await run();
  } finally {
    page.off('request', onRequest);
  }
  return seen;
}

beforeAll(() => session.open());
afterAll(() => session.close());

describe('the router-first client', () => {
  it('loads the sign-in page without the editor, and a signed-out deep link comes back after sign-in', async () => {
    const page = await (await session.context()).newPage();
    page.setDefaultTimeout(15_000);
    const signInScripts = await scriptsLoaded(page, async () => {
      await page.goto('/sign-in');
      await page.getByRole('button', { name: 'Sign in' }).waitFor();
    });
    expect(signInScripts.some((p) => /\/assets\/sign-in-[\w-]+\.js$/.test(p))).toBe(true);
    expect(signInScripts.filter((p) => /\/assets\/(mapping|bead-graph|new-molecule|rendered-comment-body|app-shell)-/.test(p))).toEqual([]);
    // The shared schema loads with the first check, not with the page; it still refuses before anything is sent.
    const validatorScripts = await scriptsLoaded(page, async () => {
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByText('Enter your password.').waitFor();
      await page.getByText('Enter a valid e-mail address.').waitFor();
    });
    expect(validatorScripts.length).toBeGreaterThan(0);
    expect(signInScripts.filter((p) => validatorScripts.includes(p))).toEqual([]);

    // A signed-out link to a mapping: sign-in first, then that mapping.
    const admin = await session.signedIn('admin@example.org', PASSWORD);
    const mappingId = await firstMappingId(admin);
    const editorScripts = await scriptsLoaded(page, async () => {
      await page.goto(`/mappings/${mappingId}?bead=x`);
      await page.waitForURL((url) => url.pathname === '/sign-in' && url.searchParams.get('next') === `/mappings/${mappingId}?bead=x`);
      await page.getByLabel('E-mail').fill('student@example.org');
      await page.getByLabel('Password', { exact: true }).fill(PASSWORD);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.waitForURL((url) => url.pathname === `/mappings/${mappingId}`);
      await page.getByRole('navigation', { name: 'Breadcrumb' }).waitFor();
      await page.locator('[data-connection]').waitFor();
    });
    expect(editorScripts.some((p) => /\/assets\/mapping-[\w-]+\.js$/.test(p))).toBe(true);
  });

  it('asks for the mapping and the reads that need only its id together', async () => {
    const page = await session.signedIn('modeller@example.org', PASSWORD);
    const mappingId = await firstMappingId(page);
    const asked: { path: string; at: number }[] = [];
    let mappingAnsweredAt = Infinity;
    page.on('request', (r) => void (r.url().includes('/api/') && asked.push({ path: new URL(r.url()).pathname, at: Date.now() })));
    page.on('response', (r) => void (new URL(r.url()).pathname === `/api/mappings/${mappingId}` && (mappingAnsweredAt = Math.min(mappingAnsweredAt, Date.now()))));
    await page.goto(`/mappings/${mappingId}`);
    await page.locator('[data-connection="live"]').waitFor();

    const first = (path: string) => asked.find((a) => a.path === path)?.at ?? Infinity;
    expect(Number.isFinite(mappingAnsweredAt)).toBe(true);
    // Each asked once for the page, and before the mapping's own answer came back.
    for (const path of [`/api/mappings/${mappingId}/threads`, `/api/mappings/${mappingId}/versions`, `/api/mappings/${mappingId}/lock`]) {
      expect(first(path), path).toBeLessThanOrEqual(mappingAnsweredAt);
    }
    expect(asked.filter((a) => a.path === `/api/mappings/${mappingId}`)).toHaveLength(1);
  });

  it('shows "Nothing here" inside the shell for an unknown path, a bad id and an unknown record', async () => {
    const page = await session.signedIn('modeller@example.org', PASSWORD);
    for (const path of ['/no-such-page', '/mappings/not-a-number', '/mappings/999999', '/molecules/999999', '/projects/999999', '/admin/users']) {
      await page.goto(path);
      await page.getByRole('heading', { level: 1, name: 'Nothing here' }).waitFor();
      // Inside the shell: the signed-in header is still there.
      await expect(page.getByRole('navigation', { name: 'Main' }).count(), path).resolves.toBe(1);
    }
    // From there, the way back works without a page load.
    await page.getByRole('link', { name: 'Go to your projects' }).click();
    await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();
  });

  it('lets a site admin who is not a member start a mapping, as the server does', async () => {
    const admin = await session.signedIn('admin@example.org', PASSWORD);
    const mappingId = await firstMappingId(admin);
    await admin.goto(`/mappings/${mappingId}`);
    const moleculeLink = admin.getByRole('navigation', { name: 'Breadcrumb' }).getByRole('link').nth(1);
    const moleculePath = await moleculeLink.getAttribute('href');
    await moleculeLink.click();
    await admin.getByRole('button', { name: 'Import a mapping…' }).waitFor();
    const form = admin.getByRole('form', { name: 'New mapping' });
    await form.getByLabel('Mapping name').fill('Admin draft');
    await form.getByRole('button', { name: 'Create and open' }).click();
    await admin.waitForURL(/\/mappings\/\d+$/);
    expect(Number(new URL(admin.url()).pathname.split('/').pop())).not.toBe(mappingId);
    await admin.getByRole('heading', { level: 1, name: 'Admin draft' }).waitFor();

    // A student of the same project does not get the form.
    const student = await session.signedIn('student@example.org', PASSWORD);
    await student.goto(moleculePath!);
    await student.getByRole('heading', { level: 2, name: 'Mappings' }).waitFor();
    await expect(student.getByRole('form', { name: 'New mapping' }).count()).resolves.toBe(0);
    await expect(student.getByRole('button', { name: 'Import a mapping…' }).count()).resolves.toBe(0);
  });

  it('reports no page errors beyond the deliberate 401 and 404 answers', () => {
    const expected = /Failed to load resource: the server responded with a status of (401|404)/;
    expect(session.errors.filter((e) => !expected.test(e))).toEqual([]);
  });
});
