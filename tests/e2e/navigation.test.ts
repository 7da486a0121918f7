import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launch, signedInPage, baseUrl } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

/** What the left rail shows to each role (the server enforces the same rules). */
const EVERYONE = ['Home', 'Devices', 'Findings', 'Lineups', 'Bench tools', 'Bench runs'];
const EXPECTED: Record<string, { shows: string[]; hides: string[] }> = {
  admin: { shows: [...EVERYONE, 'Rates & cost model', 'Admin'], hides: [] },
  engineer: { shows: EVERYONE, hides: ['Rates & cost model', 'Admin'] },
  sourcing: { shows: [...EVERYONE, 'Rates & cost model'], hides: ['Admin'] },
  lead: { shows: EVERYONE, hides: ['Rates & cost model', 'Admin'] },
  viewer: { shows: EVERYONE, hides: ['Rates & cost model', 'Admin'] },
};

describe('sign-in and navigation per role', () => {
  for (const [role, nav] of Object.entries(EXPECTED)) {
    it(`${role} signs in and sees the right navigation`, async () => {
      const page = await signedInPage(browser, role);
      const rail = page.getByRole('navigation', { name: 'Main' });
      await rail.getByRole('link', { name: 'Home', exact: true }).waitFor();
      for (const label of nav.shows) await expect(rail.getByRole('link', { name: label, exact: true }).count()).resolves.toBe(1);
      for (const label of nav.hides) await expect(rail.getByRole('link', { name: label, exact: true }).count()).resolves.toBe(0);
      await expect.poll(() => page.getByTestId('current-user').textContent(), { timeout: 10_000 }).toBeTruthy();
      await page.context().close();
    });
  }

  it('anonymous visitors are sent to sign-in, and come back after it', async () => {
    const context = await browser.newContext({ baseURL: baseUrl() });
    const page = await context.newPage();
    await page.goto('/admin/users');
    await page.waitForURL(/\/sign-in\?next=/);
    await page.getByLabel('E-mail').fill('admin@splitcase.test');
    await page.getByLabel('Password').fill('wrong-password-here');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => page.getByRole('alert').first().textContent(), { timeout: 10_000 }).toMatch(/wrong/i);
    await context.close();
  });

  it('a viewer who opens an admin URL sees a refusal, not the page', async () => {
    const page = await signedInPage(browser, 'viewer');
    await page.goto('/admin/users');
    await expect.poll(() => page.getByRole('alert').first().textContent(), { timeout: 10_000 }).toMatch(/role does not give access/);
    await page.context().close();
  });
});
