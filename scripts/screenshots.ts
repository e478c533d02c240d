// `npx tsx scripts/screenshots.ts [name…]`: pictures of the app for docs/screenshots/ (listed in its
// README). It starts what the browser tests start — a private MariaDB, the whole app on a fresh demo
// database (tests/helpers/app-server.ts) and Debian's Chromium through playwright-core — and needs
// the built client (`npx vite build`). Each picture is taken on its own; one that fails is reported
// and the others are still taken. Viewport 1280 × 800, so the files stay small.
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { startMariaDb } from './lib/mariadb';
import { freePort } from './lib/free-port';
import { launchBrowser, signedInPage } from '../tests/helpers/browser';
import { firstMappingId } from '../tests/helpers/demo-ids';

const OUT = 'docs/screenshots';
const only = process.argv.slice(2);

const dir = mkdtempSync(join(tmpdir(), 'beadloom-shots-'));
const mariadb = await startMariaDb({ dataDir: dir, port: await freePort(), database: 'beadloom_shots', user: 'beadloom', password: 'shots-password-123' });
process.env.TEST_DATABASE_URL = mariadb.url;
const { startTestServer } = await import('../tests/helpers/app-server');
const server = await startTestServer({ CHEM_JOB_TIMEOUT_MS: '300000' });
const browser = await launchBrowser();
mkdirSync(OUT, { recursive: true });
const pageErrors: string[] = [];

// Signed in through the real sign-in page (the browser tests' helper), at the pictures' size.
async function signedIn(): Promise<Page> {
  const { page } = await signedInPage(browser, server.url, 'modeller@example.org', 'beadloom-demo', pageErrors);
  await page.setViewportSize({ width: 1280, height: 800 });
  return page;
}

/** POSTs JSON through the page (its session and CSRF token); no helper functions inside evaluate (tsx would wrap them). */
function post<T>(page: Page, path: string, body: unknown): Promise<T> {
  return page.evaluate(
    async ([p, b]) => {
      const { token } = await (await fetch('/api/auth/csrf')).json();
      const res = await fetch(p as string, { method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': token }, body: JSON.stringify(b) });
      return res.json();
    },
    [path, body] as const,
  ) as Promise<T>;
}

const firstProjectId = (page: Page) => page.evaluate(async () => (await (await fetch('/api/projects')).json())[0].id as number);

const shots: Record<string, (page: Page) => Promise<void>> = {
  async 'duplicate-warning'(page) {
    const projectId = await firstProjectId(page);
    const existing = await page.evaluate(async (id) => (await (await fetch(`/api/projects/${id}/molecules`)).json())[0].canonicalSmiles as string, projectId);
    await page.goto(`/projects/${projectId}/molecules/new`);
    const form = page.getByRole('form', { name: 'New molecule from SMILES' });
    await form.getByLabel('Name').fill('Second copy');
    await form.getByLabel('SMILES').fill(existing);
    await form.getByRole('button', { name: 'Add molecule' }).click();
    await form.getByRole('alert').getByText('This project already has this structure as').waitFor();
  },
  async 'layout-150-atoms'(page) {
    const projectId = await firstProjectId(page);
    const molecule = await post<{ id: number }>(page, `/api/projects/${projectId}/molecules`, { name: 'Polystyrene 18-mer (150 heavy atoms)', smiles: 'CCCC' + 'CC(c1ccccc1)'.repeat(18) + 'CC', allowDuplicate: true });
    await page.goto(`/molecules/${molecule.id}`);
    await page.locator('[data-molecule-drawing]').first().waitFor();
  },
  async 'restore-confirmation'(page) {
    const mappingId = await firstMappingId(page);
    await page.goto(`/mappings/${mappingId}`);
    await page.locator('[data-connection="live"]').waitFor();
    await page.getByLabel('Version message').fill('As seeded');
    await page.getByRole('button', { name: 'Save version' }).click();
    const versions = page.getByRole('list', { name: 'Versions' });
    await versions.getByRole('listitem', { name: 'Version 1' }).getByRole('button', { name: 'Restore into draft' }).click();
    await page.getByRole('dialog', { name: 'Restore version 1 into the draft?' }).waitFor();
  },
  async 'editor-pictures'(page) {
    const mappingId = await firstMappingId(page);
    await page.goto(`/mappings/${mappingId}`);
    await page.locator('[data-connection="live"]').waitFor();
    await page.locator('[data-bead-tag]').first().waitFor();
  },
  async 'atom-numbers-colour-by-bead'(page) {
    const mappingId = await firstMappingId(page);
    await page.goto(`/mappings/${mappingId}`);
    await page.locator('[data-connection="live"]').waitFor();
    await page.getByRole('button', { name: /^Show or hide atom numbers/ }).click();
    await page.getByRole('button', { name: /^Colour atoms by bead/ }).click();
  },
  async 'bead-type-library'(page) {
    await page.goto(`/projects/${await firstProjectId(page)}`);
    // The table's top (the library's note and the column names) at the top of the picture.
    await page.getByRole('table', { name: 'Bead types' }).evaluate((el) => {
      el.scrollIntoView({ block: 'start' });
      window.scrollBy(0, -160);
    });
  },
};

let failed = 0;
for (const [name, take] of Object.entries(shots)) {
  if (only.length && !only.includes(name)) continue;
  const page = await signedIn();
  try {
    await take(page);
    await page.waitForTimeout(300); // let a transition finish before the picture (not a test: nothing is asserted)
    await page.screenshot({ path: `${OUT}/${name}.png` });
    console.log(`${OUT}/${name}.png`);
  } catch (err) {
    failed++;
    console.error(`${name}: ${(err as Error).message.split('\n')[0]}`);
  } finally {
    await page.context().close();
  }
}
// Page errors do not stop a picture, but a picture of a page that threw is not to be trusted.
for (const e of pageErrors) console.error(`page error: ${e}`);
await browser.close();
await server.stop();
await mariadb.stop();
rmSync(dir, { recursive: true, force: true });
process.exit(failed ? 1 : 0);
