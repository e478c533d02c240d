import type { Browser, BrowserContext, BrowserContextOptions, Page } from 'playwright-core';
import { startTestServer } from './app-server';
import { launchBrowser, signedInPage } from './browser';

/**
 * One browser test file's app server and Chromium: `open()` in beforeAll, `close()` in afterAll.
 * Every context it makes is closed at the end; page and console errors of signed-in pages collect in
 * `errors`. (Its own file: app-server reads the database settings when imported.)
 */
export function browserSession() {
  let server: Awaited<ReturnType<typeof startTestServer>> | undefined;
  let browser: Browser | undefined;
  const contexts: BrowserContext[] = [];
  const errors: string[] = [];
  const ready = <T>(x: T | undefined): T => {
    if (!x) throw new Error('browserSession: call open() first');
    return x;
  };
  return {
    errors,
    get url(): string {
      return ready(server).url;
    },
    async open(): Promise<void> {
      server = await startTestServer();
      browser = await launchBrowser();
    },
    /** A context of its own on the app (not signed in). */
    async context(options: BrowserContextOptions = {}): Promise<BrowserContext> {
      const context = await ready(browser).newContext({ baseURL: ready(server).url, ...options });
      contexts.push(context);
      return context;
    },
    async signedIn(email: string, password: string): Promise<Page> {
      const { context, page } = await signedInPage(ready(browser), ready(server).url, email, password, errors);
      contexts.push(context);
      return page;
    },
    async close(): Promise<void> {
      for (const c of contexts) await c.close();
      await browser?.close();
      await server?.stop();
    },
  };
}
