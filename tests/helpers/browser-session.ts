import type { Browser, BrowserContext, BrowserContextOptions, Page } from 'playwright-core';
import { startTestServer } from './app-server';
import { launchBrowser, signedInPage } from './browser';
import { DEMO_PASSWORD } from '../../seeds/demo-data';

/** One message of the local mail sink, as /dev/mail.json gives it. */
export interface CaughtMail {
  to: string[];
  subject: string;
  text: string;
}

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
    /**
     * The caught mail, newest first, read from /dev/mail.json as the demo's site admin (no one else
     * may read it) in a context of its own, so no page's sign-in changes.
     */
    async mail(): Promise<CaughtMail[]> {
      const { request } = await this.context();
      const { token } = await (await request.get('/api/auth/csrf')).json();
      const login = await request.post('/api/auth/login', { data: { email: 'admin@example.org', password: DEMO_PASSWORD }, headers: { 'x-csrf-token': token } });
      if (!login.ok()) throw new Error(`admin sign-in failed: ${login.status()}`);
      const res = await request.get('/dev/mail.json');
      if (!res.ok()) throw new Error(`/dev/mail.json answered ${res.status()}`);
      return res.json();
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
