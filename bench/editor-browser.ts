// `npm run bench:editor`: the mapping editor in Chromium on a 2,000-heavy-atom molecule.
// Reads the editor's own performance marks (src/features/editor/model/perf-marks.ts):
//   editor ready (navigation → live draft synced and painted), target < 2 s;
//   select-and-assign → repaint (a make-bead command on 4 selected atoms), target < 100 ms.
// Needs the built client (`npx vite build`); starts its own throwaway MariaDB. Not a timed test.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startMariaDb } from '../scripts/lib/mariadb';
import { freePort } from '../scripts/lib/free-port';
import { launchBrowser } from '../tests/helpers/browser';

// "CC(c1ccccc1)" has 8 heavy atoms: 250 repeats make a 2,000-atom polystyrene-like chain.
// A smaller count as the first argument (e.g. 25) checks the benchmark itself quickly.
const REPEATS = Number(process.argv[2] ?? 250);
const smiles = 'C' + 'CC(c1ccccc1)'.repeat(REPEATS) + 'C';

const dir = mkdtempSync(join(tmpdir(), 'beadloom-bench-'));
const mariadb = await startMariaDb({ dataDir: dir, port: await freePort(), database: 'beadloom_bench', user: 'beadloom', password: 'bench-password-123' });
process.env.TEST_DATABASE_URL = mariadb.url;
const { startTestServer } = await import('../tests/helpers/app-server');
// A generous chemistry job limit: on a busy machine the 2,000-atom chain's parse must not be cut short.
const server = await startTestServer({ CHEM_JOB_TIMEOUT_MS: '300000' });
const browser = await launchBrowser();
try {
  const context = await browser.newContext({ baseURL: server.url, viewport: { width: 1600, height: 1000 } });
  const page = await context.newPage();
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('modeller@example.org');
  await page.getByLabel('Password', { exact: true }).fill('beadloom-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();
  console.log(`creating a ${smiles.length}-character SMILES molecule (the server parses and types it; slow for this size)…`);
  // No helper functions inside evaluate: tsx would wrap them in a `__name` the page lacks.
  const { mappingId, heavyAtoms } = await page.evaluate(async (smi) => {
    const { token } = await (await fetch('/api/auth/csrf')).json();
    const headers = { 'content-type': 'application/json', 'x-csrf-token': token };
    const projects = await (await fetch('/api/projects')).json();
    const made = await fetch(`/api/projects/${projects[0].id}/molecules`, { method: 'POST', headers, body: JSON.stringify({ name: 'Benchmark chain (2,000 heavy atoms)', smiles: smi }) });
    if (!made.ok) throw new Error(`molecule: ${made.status} ${await made.text()}`);
    const molecule = await made.json();
    const mapped = await fetch(`/api/molecules/${molecule.id}/mappings`, { method: 'POST', headers, body: JSON.stringify({ name: 'Benchmark', resolution: '4:1' }) });
    if (!mapped.ok) throw new Error(`mapping: ${mapped.status} ${await mapped.text()}`);
    return { mappingId: (await mapped.json()).id as number, heavyAtoms: molecule.heavyAtoms as number };
  }, smiles);

  console.log(`molecule of ${heavyAtoms} heavy atoms, mapping ${mappingId}; opening the editor…`);
  page.setDefaultTimeout(120_000);
  const runs: { ready: number; assign: number[] }[] = [];
  for (let r = 0; r < 3; r++) {
    await page.goto(`/mappings/${mappingId}`);
    await page.waitForFunction(() => performance.getEntriesByName('beadloom:editor-ready').length > 0, null, { timeout: 60_000 });
    const ready = await page.evaluate(() => performance.getEntriesByName('beadloom:editor-ready')[0].startTime);
    const assign: number[] = [];
    for (let k = 0; k < 5; k++) {
      const first = (r * 5 + k) * 8;
      // Pointer presses go straight to each atom's target: zoomed out, neighbouring targets overlap.
      await page.locator(`[data-atom="${first}"]`).dispatchEvent('pointerdown', { button: 0, bubbles: true });
      for (const a of [first + 1, first + 2, first + 3]) await page.locator(`[data-atom="${a}"]`).dispatchEvent('pointerdown', { button: 0, shiftKey: true, bubbles: true });
      await page.locator('svg[role="application"]').focus();
      await page.keyboard.press('b');
      await page.waitForFunction((n) => performance.getEntriesByName('beadloom:command-to-paint').length >= n, k + 1);
      assign.push(await page.evaluate((i) => performance.getEntriesByName('beadloom:command-to-paint')[i].duration, k));
    }
    runs.push({ ready, assign });
    console.log(`run ${r + 1}: ready ${ready.toFixed(0)} ms; make bead → repaint ${assign.map((x) => x.toFixed(1)).join(', ')} ms`);
  }
  const all = runs.flatMap((x) => x.assign).sort((a, b) => a - b);
  const pct = (p: number) => all[Math.min(all.length - 1, Math.floor((p / 100) * all.length))];
  console.log(`heavy atoms: ${heavyAtoms}`);
  console.log(`editor ready (ms): ${runs.map((x) => x.ready.toFixed(0)).join(', ')}  (target < 2000)`);
  console.log(`make bead → repaint (ms): p50 ${pct(50).toFixed(1)}, p95 ${pct(95).toFixed(1)}, max ${all.at(-1)!.toFixed(1)}  (target < 100; n = ${all.length})`);
} finally {
  await browser.close();
  await server.stop();
  await mariadb.stop();
  rmSync(dir, { recursive: true, force: true });
}
