// In the browser: signing out leaves no render error behind, a viewer's cost section and printable
// report show the should-cost totals without line prices, and the password forms state the rule.
import AxeBuilder from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PASSWORD_RULE, PRICE_VIEW_NOTE } from '@splitcase/contracts';
import { baseUrl, launch, signedInPage } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

/** Serious and critical accessibility violations on the page as it is now. */
async function axeProblems(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page }).analyze();
  return result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}

/** Console errors and uncaught page errors, from now on. */
function collectErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text());
  });
  page.on('pageerror', (e) => errors.push(`${e.name}: ${e.message}`));
  page.on('response', (r) => {
    if (r.status() === 401) errors.push('401 ' + r.url());
  });
  return errors;
}

/** A teardown the caller can read (a viewer: published) with at least one priced line. */
async function publishedTeardownWithPrices(page: Page): Promise<number> {
  for (let id = 1; id <= 30; id++) {
    const res = await page.request.get(`/api/teardowns/${id}/cost`);
    if (!res.ok()) continue;
    const teardown = await (await page.request.get(`/api/teardowns/${id}`)).json();
    if (teardown.teardown?.status !== 'published') continue;
    if ((await res.json()).lines?.some((l: { priced: boolean }) => l.priced)) return id;
  }
  throw new Error('no published teardown with prices in the demo');
}

describe('sign-out', () => {
  for (const [role, path] of [
    ['engineer', '/'],
    ['admin', '/admin/users'],
    ['viewer', '/teardowns/1/cost'],
  ] as const) {
    it(`${role}: signing out from ${path} logs no error and lands on sign-in`, async () => {
      const page = await signedInPage(browser, role);
      const errors = collectErrors(page);
      await page.goto(path);
      await page.getByTestId('current-user').waitFor();
      await page.getByRole('button', { name: 'Sign out' }).click();
      await page.waitForURL(/\/sign-in/);
      await page.getByRole('button', { name: 'Sign in' }).waitFor();
      // Give late renders a moment to report.
      await page.waitForTimeout(300);
      expect(errors).toEqual([]);
      await page.context().close();
    });
  }
});

describe('price detail in the browser', () => {
  it('a viewer sees the totals and the note, not the break, unit price, confidence or source columns', async () => {
    const page = await signedInPage(browser, 'viewer');
    const id = await publishedTeardownWithPrices(page);
    await page.goto(`/teardowns/${id}/cost`);
    await page.getByTestId('cost-landed').waitFor();
    await expect.poll(() => page.getByTestId('price-view-note').textContent(), { timeout: 10_000 }).toBe(PRICE_VIEW_NOTE);
    const table = page.getByRole('table', { name: 'Costed bill of materials' });
    await table.waitFor();
    const headers = await table.locator('th').allTextContents();
    for (const hidden of ['Break used', 'Confidence', 'Source']) expect(headers.join('|')).not.toContain(hidden);
    expect(headers.some((h) => /^Unit /.test(h))).toBe(false);
    // No subtotal per category either (one line's category would be its price); the waterfall stays.
    await page.getByTestId('chart-waterfall').waitFor();
    expect(await page.getByRole('table', { name: 'Parts by category, data' }).count()).toBe(0);
    expect(await axeProblems(page)).toEqual([]);
    await page.goto(`/teardowns/${id}/report`);
    await expect.poll(() => page.getByTestId('bom-total').textContent(), { timeout: 10_000 }).toBeTruthy();
    await expect.poll(() => page.locator('body').textContent(), { timeout: 10_000 }).toContain(PRICE_VIEW_NOTE);
    expect(await page.locator('th', { hasText: 'Unit price' }).count()).toBe(0);
    await page.context().close();
  });

  it('a lead sees the line prices', async () => {
    const page = await signedInPage(browser, 'lead');
    const id = await publishedTeardownWithPrices(page);
    await page.goto(`/teardowns/${id}/cost`);
    const table = page.getByRole('table', { name: 'Costed bill of materials' });
    await table.waitFor();
    await expect.poll(async () => (await table.locator('th').allTextContents()).join('|'), { timeout: 10_000 }).toContain('Break used');
    await page.getByRole('table', { name: 'Parts by category, data' }).waitFor();
    expect(await page.getByTestId('price-view-note').count()).toBe(0);
    await page.context().close();
  });
});

describe('password forms', () => {
  it('the account page and the reset page state the password rule', async () => {
    const page = await signedInPage(browser, 'engineer');
    await page.goto('/');
    await page.getByTestId('current-user').click();
    await page.getByRole('heading', { name: 'Your account' }).waitFor();
    await expect.poll(() => page.getByText(PASSWORD_RULE).count(), { timeout: 10_000 }).toBe(1);
    expect(await axeProblems(page)).toEqual([]);
    const context = await browser.newContext({ baseURL: baseUrl() });
    const anon = await context.newPage();
    await anon.goto('/reset-password?token=an-incomplete-link-token');
    await expect.poll(() => anon.getByText(PASSWORD_RULE).count(), { timeout: 10_000 }).toBe(1);
    await context.close();
    await page.context().close();
  });

  it('admins set the session limits on the Users page', async () => {
    const page = await signedInPage(browser, 'admin');
    await page.goto('/admin/users');
    const idle = page.getByLabel('Sign out after inactivity (minutes)');
    await idle.waitFor();
    await expect.poll(() => idle.inputValue(), { timeout: 10_000 }).toBe('60');
    await idle.fill('2');
    await page.getByRole('button', { name: 'Save' }).click();
    await expect.poll(() => page.getByText('At least 5 min').count(), { timeout: 10_000 }).toBe(1);
    await idle.fill('90');
    await page.getByRole('button', { name: 'Save' }).click();
    await expect.poll(async () => (await (await page.request.get('/api/settings')).json()).settings.sessionIdleMinutes, { timeout: 10_000 }).toBe(90);
    expect(await axeProblems(page)).toEqual([]);
    await idle.fill('60');
    await page.getByRole('button', { name: 'Save' }).click();
    await expect.poll(async () => (await (await page.request.get('/api/settings')).json()).settings.sessionIdleMinutes, { timeout: 10_000 }).toBe(60);
    await page.context().close();
  });
});
