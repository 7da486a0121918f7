import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launch, signedInPage } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

const rankingNames = async (page: Page) => (await page.getByRole('list', { name: 'Ranking' }).getByTestId('ranking-row').allTextContents()).map((t) => t.replace(/^\d+/, ''));

describe('lineups', () => {
  it('a lead builds a lineup of three devices, moves a weight slider, sees the ranking change, and opens the print view', async () => {
    const page = await signedInPage(browser, 'lead');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Lineups' }).click();
    await page.getByRole('heading', { name: 'Lineups' }).waitFor();
    await page.getByRole('link', { name: 'New lineup' }).click();
    await page.getByRole('heading', { name: 'New lineup' }).waitFor();

    await page.getByLabel('Name').fill('Bench check: banks and a heater');
    const search = page.getByRole('searchbox', { name: 'Search devices' });
    for (const [q, name] of [
      ['stackcell 10', 'Pellam Works Stackcell 10'],
      ['duo', 'Halvix HandGlow Duo 10'],
      ['breeze pocket', 'Corvane Breeze Pocket'],
    ]) {
      await search.fill(q!);
      await page.getByRole('checkbox', { name: name!, exact: true }).check();
    }
    await expect.poll(() => page.getByRole('list', { name: 'Devices in the lineup' }).getByRole('listitem').count(), { timeout: 10_000 }).toBe(3);

    // Only pack energy weighs at first: every other slider to off (Home), pack energy to 1.
    const sliders = page.getByRole('list', { name: 'Metric weights' }).getByRole('slider');
    const n = await sliders.count();
    expect(n).toBe(13);
    for (let k = 0; k < n; k++) {
      await sliders.nth(k).focus();
      await page.keyboard.press('Home');
    }
    await page.getByRole('slider', { name: 'Weight of Pack energy' }).focus();
    await page.keyboard.press('ArrowRight');
    await page.getByRole('button', { name: 'Build lineup' }).click();
    await page.waitForURL(/\/lineups\/\d+$/);
    await page.getByRole('heading', { name: 'Bench check: banks and a heater' }).waitFor();

    // Ranked by pack energy: 37.2 Wh, 9.99 Wh, 4.44 Wh.
    await page.getByRole('list', { name: 'Ranking' }).waitFor();
    expect(await rankingNames(page)).toEqual([expect.stringContaining('Pellam Works Stackcell 10'), expect.stringContaining('Halvix HandGlow Duo 10'), expect.stringContaining('Corvane Breeze Pocket')]);
    await page.getByRole('table', { name: 'Normalised comparison' }).waitFor();
    await page.getByTestId('pareto-chart').locator('svg').first().waitFor();
    await page.getByRole('table', { name: 'Scatter chart, data' }).waitFor();

    // Price to the maximum weight: the server ranks again (POST, not saved) and the cheapest leads.
    const preview = page.waitForResponse((r) => r.url().includes('/comparison') && r.request().method() === 'POST');
    await page.getByRole('slider', { name: 'Weight of Retail price' }).focus();
    await page.keyboard.press('End');
    expect((await preview).status()).toBe(200);
    await expect
      .poll(async () => (await rankingNames(page))[0], { timeout: 10_000 })
      .toContain('Corvane Breeze Pocket');
    await page.getByText('Unsaved weights').waitFor();

    // Save them; the saved comparison ranks the same way.
    await page.getByRole('button', { name: 'Save weights' }).click();
    await page.getByText('Weights saved.').waitFor();
    await page.getByText('Saved weights').waitFor();
    expect((await rankingNames(page))[0]).toContain('Corvane Breeze Pocket');

    // The printable report: header, comparison, chart with its data, sources, cautions; no rail.
    await page.getByRole('link', { name: 'Printable report' }).click();
    await page.waitForURL(/\/lineups\/\d+\/print/);
    const report = page.getByTestId('lineup-report');
    await report.waitFor();
    await report.getByRole('heading', { name: 'Bench check: banks and a heater' }).waitFor();
    await expect.poll(() => page.getByTestId('report-rate-date').textContent(), { timeout: 10_000 }).toMatch(/\d{1,2} \w{3} \d{4} · base EUR/);
    await report.getByRole('table', { name: 'Normalised comparison, report' }).waitFor();
    await report.getByTestId('pareto-chart').locator('svg').first().waitFor();
    await report.getByRole('heading', { name: /Sources of each metric/ }).waitFor();
    await report.getByText('Engineering estimates, not certification results', { exact: false }).first().waitFor();
    await expect(page.getByRole('navigation', { name: 'Main' }).count()).resolves.toBe(0);
    await page.getByRole('button', { name: 'Print or save as PDF' }).waitFor();
    // As a PDF: more than one A4 page, with the document's pages numbered by the print stylesheet.
    await page.emulateMedia({ media: 'print' });
    const pdf = await page.pdf({ format: 'A4', printBackground: true });
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    await page.context().close();
  });

  it('a viewer sees the published lineup only, cannot build one, and may try weights without saving', async () => {
    const page = await signedInPage(browser, 'viewer');
    await page.goto('/lineups');
    await page.getByRole('cell', { name: 'Pocket heaters, winter 2026' }).click();
    await page.getByRole('heading', { name: 'Pocket heaters, winter 2026' }).waitFor();
    await page.getByRole('list', { name: 'Ranking' }).waitFor();
    await page.getByText(/One device of this lineup has no published teardown yet/).waitFor();
    await expect(page.getByRole('button', { name: 'Save weights' }).count()).resolves.toBe(0);
    await expect(page.getByRole('link', { name: 'Edit' }).count()).resolves.toBe(0);
    // Trying other weights asks the server for a ranking without saving anything.
    const preview = page.waitForResponse((r) => r.url().includes('/comparison') && r.request().method() === 'POST');
    await page.getByRole('slider', { name: 'Weight of Pack energy' }).focus();
    await page.keyboard.press('End');
    expect((await preview).status()).toBe(200);
    await page.getByText('Unsaved weights').waitFor();
    await page.goto('/lineups');
    await page.getByRole('table', { name: 'Lineups' }).waitFor();
    await expect(page.getByRole('link', { name: 'New lineup' }).count()).resolves.toBe(0);
    await expect(page.getByText('Power banks under 40 USD').count()).resolves.toBe(0);
    await page.context().close();
  });
});
