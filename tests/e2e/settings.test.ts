// Workspace settings changed from the Rates & cost model page (reporting currency, sales tax), through
// the one settings module of the web app: the page shows what was saved, the API has it, and the
// settings the page does not show stay as they were.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { WorkspaceSettings } from '@splitcase/contracts';
import { launch, signedInPage } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

const settingsOf = async (page: Page) => (await (await page.request.get('/api/settings')).json()).settings as WorkspaceSettings;
const csrf = async (page: Page) => (await (await page.request.get('/api/auth/csrf')).json()).token as string;

describe('settings on the Rates & cost model page (sourcing)', () => {
  it('sets the reporting currency and the sales tax of a currency; other settings stay', async () => {
    const page = await signedInPage(browser, 'sourcing');
    const before = await settingsOf(page);
    try {
      await page.goto('/rates');
      const select = page.getByLabel('Reporting currency');
      await expect.poll(() => select.inputValue(), { timeout: 10_000 }).toBe(before.reportingCurrency);
      const options = await select.locator('option').allTextContents();
      const other = options.find((c) => c !== before.reportingCurrency)!;
      expect(other).toBeTruthy();
      await select.selectOption(other);
      await page.getByText(`Cost figures are now reported in ${other}.`).waitFor();
      await expect.poll(() => select.inputValue(), { timeout: 10_000 }).toBe(other);
      expect(await settingsOf(page)).toEqual({ ...before, reportingCurrency: other });

      // The first currency's sales tax to 12.5 %; a rate over 100 % is refused on its field first.
      const table = page.getByRole('table', { name: 'Sales tax by currency' });
      const code = (await table.getByLabel('Currency 1', { exact: true }).inputValue()).toUpperCase();
      const rate = table.getByLabel('Sales tax in prices of currency 1');
      await rate.fill('150');
      await page.getByRole('button', { name: 'Save sales tax' }).click();
      await expect.poll(() => table.getByText('At most 100 %').count(), { timeout: 10_000 }).toBe(1);
      await expect.poll(() => rate.getAttribute('aria-invalid'), { timeout: 10_000 }).toBe('true');
      expect((await settingsOf(page)).salesTaxByCurrency).toEqual(before.salesTaxByCurrency);
      await rate.fill('12.5');
      await page.getByRole('button', { name: 'Save sales tax' }).click();
      await page.getByText('Sales-tax defaults saved; implied margins use them now.').waitFor();
      const after = await settingsOf(page);
      expect(after.salesTaxByCurrency[code]).toBeCloseTo(0.125, 12);
      expect({ ...after, salesTaxByCurrency: before.salesTaxByCurrency }).toEqual({ ...before, reportingCurrency: other });
    } finally {
      const res = await page.request.patch('/api/settings', {
        headers: { 'X-CSRF-Token': await csrf(page) },
        data: { reportingCurrency: before.reportingCurrency, salesTaxByCurrency: before.salesTaxByCurrency },
      });
      expect(res.status()).toBe(200);
      await page.context().close();
    }
  });
});
