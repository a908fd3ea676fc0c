import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { launchChromium, signInInBrowser, VIEWPORTS } from '../tests/helpers/chromium';

/**
 * Screenshots of a running app at tablet and desktop width, signed in as a role:
 *   npx tsx scripts/screenshot.ts <appOrigin> <username> <path> <name> [--click "text"] [--fill "label=value"]
 *     [--select "label=value"] [--check "radio label"] [--wait ms] [--full]...
 * writes screenshots/<name>-tablet.png and screenshots/<name>-desktop.png.
 */
const [origin, username, pagePath, name, ...args] = process.argv.slice(2);
const fullPage = args.includes('--full');
const rest = args.filter((a) => a !== '--full');
if (!origin || !username || !pagePath || !name) {
  console.error('usage: tsx scripts/screenshot.ts <appOrigin> <username> <path> <name> [--click "text"] [--fill "label=value"] [--select "label=value"] [--check "label"] [--upload file]');
  process.exit(2);
}
const browser = await launchChromium();
mkdirSync('screenshots', { recursive: true });
for (const [label, viewport] of Object.entries(VIEWPORTS)) {
  const page = await browser.newPage({ viewport });
  await signInInBrowser(page, origin, username, pagePath);
  await page.goto(`${origin}${pagePath}`);
  for (let i = 0; i < rest.length; i += 2) {
    const [flag, arg] = [rest[i], rest[i + 1]];
    if (flag === '--click') await page.getByText(arg, { exact: false }).first().click();
    if (flag === '--fill') {
      const [field, value] = arg.split('=');
      await page.getByLabel(field).fill(value);
    }
    if (flag === '--select') {
      const [field, value] = arg.split('=');
      await page.getByLabel(field).selectOption(value);
    }
    if (flag === '--check') await page.getByLabel(arg, { exact: true }).check();
    if (flag === '--upload') await page.locator('input[type=file]').setInputFiles(arg);
    if (flag === '--wait') await page.waitForTimeout(Number(arg));
  }
  await page.waitForLoadState('networkidle');
  const file = path.join('screenshots', `${name}-${label}.png`);
  await page.screenshot({ path: file, fullPage });
  console.log(file);
  await page.close();
}
await browser.close();
