import { chromium, type Browser } from 'playwright-core';

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
