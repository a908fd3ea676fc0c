import { chromium, type Browser, type BrowserContextOptions, type Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../scripts/demo-accounts';

/** Debian's Chromium, headless; the flags keep it off this machine's closed network. */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
}

export const VIEWPORTS = { tablet: { width: 1024, height: 768 }, desktop: { width: 1440, height: 900 } } as const;

/** Signs in through the app's sign-in page and the identity provider's form, as a person would. */
export async function signInInBrowser(page: Page, appOrigin: string, username: string, path = '/lines'): Promise<void> {
  await page.goto(`${appOrigin}${path}`);
  await page.getByRole('link', { name: /sign in/i }).click();
  await page.getByLabel('User name').fill(username);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => url.origin === appOrigin && !url.pathname.startsWith('/auth'));
}

/** A fresh browser context (no cookies) at tablet width, signed in as `username` on `path`; `options` add to or change the context's. */
export async function signedInPage(browser: Browser, appOrigin: string, username: string, path: string, options: BrowserContextOptions = {}) {
  const context = await browser.newContext({ viewport: VIEWPORTS.tablet, ...options });
  const page = await context.newPage();
  page.setDefaultTimeout(10_000);
  await signInInBrowser(page, appOrigin, username, path);
  return { context, page };
}

