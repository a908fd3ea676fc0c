import { existsSync } from 'node:fs';
import path from 'node:path';
import type { Browser, BrowserContext, BrowserContextOptions, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll } from 'vitest';
import { config } from '@server/config';
import { useTestApp } from './app';
import { APP } from './browserless';
import { launchChromium, signedInPage, VIEWPORTS } from './chromium';

/**
 * The start-up every end-to-end file shares: the client build must be there, the real app runs
 * (useTestApp), one Chromium is launched for the file, and every context a test opened through
 * `pageAs` is closed after that test. `before` runs first, as in useTestApp.
 */
export function useBrowserApp<U extends string = never>(opts: { signIn?: readonly U[]; before?: () => Promise<unknown> } = {}) {
  let browser: Browser | undefined;
  const opened: BrowserContext[] = [];
  const users = useTestApp({
    signIn: opts.signIn,
    before: async () => {
      if (!existsSync(path.join(config.clientDist, 'index.html'))) throw new Error(`no client build in ${config.clientDist}: run vite build first`);
      await opts.before?.();
    },
  });
  beforeAll(async () => void (browser = await launchChromium()));
  afterEach(async () => {
    for (const context of opened.splice(0)) await context.close();
  });
  afterAll(async () => browser?.close());
  const theBrowser = () => {
    if (!browser) throw new Error('Chromium is not running yet (use it inside a test or hook)');
    return browser;
  };
  return {
    users,
    browser: theBrowser,
    /** A fresh context at tablet width, signed in as `username` on `pagePath`; closed after the test. */
    async pageAs(username: string, pagePath: string, options: BrowserContextOptions = {}): Promise<Page> {
      const { context, page } = await signedInPage(theBrowser(), APP, username, pagePath, options);
      opened.push(context);
      return page;
    },
    /** A fresh signed-out page in a context of its own; closed after the test. */
    async newPage(options: BrowserContextOptions = {}): Promise<Page> {
      const context = await theBrowser().newContext({ viewport: VIEWPORTS.tablet, ...options });
      opened.push(context);
      const page = await context.newPage();
      page.setDefaultTimeout(10_000);
      return page;
    },
  };
}
