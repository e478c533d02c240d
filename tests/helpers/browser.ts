import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

// Debian's chromium driven by playwright-core (never a downloaded browser).
// Playwright gives every launch a fresh temporary profile directory.

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/** A fresh context signed in through the real sign-in page; page errors and console errors go to `errors`. */
export async function signedInPage(browser: Browser, baseURL: string, email: string, password: string, errors: string[]): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ baseURL, viewport: { width: 1440, height: 1000 }, acceptDownloads: true });
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  page.on('pageerror', (e) => errors.push(`${email}: ${e.message}`));
  page.on('console', (m) => m.type() === 'error' && errors.push(`${email}: ${m.text()}`));
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();
  return { context, page };
}
