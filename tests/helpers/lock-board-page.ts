import { expect } from 'vitest';
import type { Page } from 'playwright-core';
import { lockNo } from './lockout';

/**
 * On an order's page, the signed-in fitter applies a lock of their own to every point the lock
 * board offers (`points` of them) and waits until the board shows each; returns the lock numbers.
 */
export async function applyMyLocksInBrowser(page: Page, points: number): Promise<string[]> {
  await page.getByRole('button', { name: 'Apply my locks' }).click();
  const form = page.getByRole('form', { name: 'Apply my locks' });
  const fields = form.getByRole('textbox');
  await fields.first().waitFor();
  expect(await fields.count()).toBe(points);
  const numbers: string[] = [];
  for (const field of await fields.all()) {
    const n = lockNo('F');
    numbers.push(n);
    await field.fill(n);
  }
  await form.getByRole('button', { name: 'Record my locks' }).click();
  await form.waitFor({ state: 'detached' });
  const list = page.getByRole('list', { name: 'Isolation points' });
  for (const n of numbers) await list.getByText(`(you) · lock ${n}`, { exact: false }).waitFor();
  return numbers;
}

/** On an order's page, an operations person records zero energy verified and waits for the board to say so with `locks` locks on. */
export async function verifyZeroEnergyInBrowser(page: Page, locks: number): Promise<void> {
  const form = page.getByRole('form', { name: 'Verify zero energy' });
  await form.getByLabel('How the section was proven dead').fill('Opened the low-point drain and the vent; watched the gauge for five minutes.');
  await form.getByLabel('What was read').fill('0 psi on the gauge, no flow at the drain.');
  await form.getByRole('button', { name: 'Record zero energy verified' }).click();
  await page.getByText(`Every point is protected and zero energy is verified; ${locks} locks are on.`).waitFor();
}
