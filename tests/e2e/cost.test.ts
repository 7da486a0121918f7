import { readFileSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, launch, signedInPage } from './browser';

// The parts list comes from another module: without its routes the demo BOMs are empty, and only
// the empty state can be checked. (Unauthenticated, an existing route answers 401; a missing one 404.)
const partsRouteExists = (await fetch(`${baseUrl()}/api/teardowns/1/parts`)).status !== 404;

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

interface Line {
  partId: number;
  designators: string | null;
  description: string;
  priced: boolean;
  price: { currency: string; breaks: { minQty: number; unitPrice: number }[]; source: string; confidence: string; priceDate: string } | null;
}

async function costOf(page: Page, id = 1) {
  const res = await page.request.get(`/api/teardowns/${id}/cost`);
  expect(res.status()).toBe(200);
  return (await res.json()) as { partsTotal: number; landed: number; volume: number; currency: string; lines: Line[] };
}

describe('the cost section of a demo teardown', () => {
  it('sourcing opens it: the BOM with prices, or the empty state when the teardown has no parts', async () => {
    const page = await signedInPage(browser, 'sourcing');
    await page.goto('/teardowns/1/cost');
    const cost = await costOf(page);
    if (cost.lines.length === 0) {
      await page.getByText("No parts in this teardown's BOM yet.").waitFor();
      // The cost model and the rate date are there even without parts.
      await page.getByText('Cost model (workspace defaults)').waitFor();
      await expect.poll(() => page.getByTestId('rate-date').textContent(), { timeout: 10_000 }).toMatch(/Rates of \d{1,2} \w{3} \d{4}/);
    } else {
      await page.getByRole('table', { name: 'Costed bill of materials' }).waitFor();
      await page.getByTestId('cost-landed').waitFor();
    }
    // The rail entry for sourcing leads to the rates page.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Rates & cost model' }).click();
    await page.getByRole('heading', { name: 'Rates & cost model' }).waitFor();
    await page.getByRole('button', { name: 'Import reference-rate XML' }).or(page.getByText('Import reference-rate XML')).first().waitFor();
    await page.context().close();
  });

  it('an engineer sees prices read-only', async () => {
    const page = await signedInPage(browser, 'engineer');
    await page.goto('/teardowns/1/cost');
    await page.getByTestId('rate-date').waitFor();
    await expect(page.getByRole('button', { name: /Edit the price of/ }).count()).resolves.toBe(0);
    await expect(page.getByRole('button', { name: 'Import prices' }).count()).resolves.toBe(0);
    await expect(page.getByRole('link', { name: 'Rates & cost model' }).count()).resolves.toBe(0);
    await page.context().close();
  });

  it.runIf(partsRouteExists)('sourcing changes a price break, sees the totals and the chart move, and exports the costed BOM', async () => {
    const page = await signedInPage(browser, 'sourcing');
    await page.goto('/teardowns/1/cost');
    const before = await costOf(page);
    const line = before.lines.find((l) => l.priced && l.designators) ?? before.lines.find((l) => l.priced)!;
    expect(line, 'a priced line in the demo BOM').toBeTruthy();
    const partsCell = page.getByTestId('cost-parts-total');
    await partsCell.waitFor();
    const partsText = await partsCell.textContent();
    const waterfall = page.getByRole('table', { name: 'From parts to retail price, data' });
    await waterfall.waitFor();
    const partsRow = waterfall
      .getByRole('row')
      .filter({ hasText: /^Parts/ })
      .first();
    const chartPartsBefore = await partsRow.textContent();

    // One break at 1 piece, far above the current price: the line's unit price changes at any volume.
    await page.getByRole('button', { name: `Edit the price of ${line.designators ?? line.description}`, exact: true }).click();
    const editor = page.getByRole('region', { name: `Price of ${line.designators ?? line.description}`, exact: true });
    await editor.waitFor();
    while ((await editor.getByRole('button', { name: /^Remove break / }).count()) > 1) {
      await editor
        .getByRole('button', { name: /^Remove break / })
        .last()
        .click();
    }
    await editor.getByLabel('Break 1 minimum quantity').fill('1');
    await editor.getByLabel('Break 1 unit price').fill('97.5');
    await editor.getByRole('button', { name: 'Save price' }).click();
    await editor.waitFor({ state: 'detached' });

    // The totals come back from the server and the page shows them.
    await page.waitForFunction(([id, old]) => document.querySelector(`[data-testid="${id}"]`)?.textContent !== old, ['cost-parts-total', partsText] as const);
    const after = await costOf(page);
    expect(after.partsTotal).toBeGreaterThan(before.partsTotal);
    expect(after.landed).toBeGreaterThan(before.landed);
    await expect(partsRow.textContent()).resolves.not.toBe(chartPartsBefore);
    await page.getByTestId('chart-waterfall').locator('svg').first().waitFor();

    // The costed BOM as CSV carries the new break.
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Export CSV' }).click()]);
    expect(download.suggestedFilename()).toMatch(/^costed-bom-.*\.csv$/);
    const csv = readFileSync((await download.path())!, 'utf8');
    // Every export follows the one CSV rule (lib/csv.ts): text cells, the header too, are quoted.
    expect(csv.split(/\r?\n/)[0]).toMatch(/^\uFEFF?"designators","maker_part_number","description","category","mount","quantity","currency","breaks","source","confidence"/);
    expect(csv).toContain('1@97.5');

    // Put the demo price back for the other tests.
    const token = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
    const p = line.price!;
    const restore = await page.request.put(`/api/parts/${line.partId}/price`, {
      headers: { 'X-CSRF-Token': token },
      data: { currency: p.currency, breaks: p.breaks, source: p.source, confidence: p.confidence, priceDate: p.priceDate },
    });
    expect(restore.status()).toBe(200);
    await page.context().close();
  });

  it.runIf(partsRouteExists)('with a line unpriced the implied margin reads "Incomplete" with the count of priced lines, and comes back once priced', async () => {
    const page = await signedInPage(browser, 'sourcing');
    await page.goto('/teardowns/1/cost');
    const before = await costOf(page);
    const line = before.lines.find((l) => l.priced)!;
    const token = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
    expect((await page.request.delete(`/api/parts/${line.partId}/price`, { headers: { 'X-CSRF-Token': token } })).status()).toBe(204);
    try {
      await page.reload();
      const priced = before.lines.filter((l) => l.priced).length - 1;
      await expect.poll(() => page.getByTestId('cost-margin').textContent(), { timeout: 10_000 }).toBe('Incomplete');
      await expect.poll(() => page.getByTestId('cost-margin').locator('xpath=..').textContent(), { timeout: 10_000 }).toContain(`${priced} of ${before.lines.length} lines priced`);
      await page.getByRole('table', { name: 'Cost at each volume' }).getByText('incomplete').first().waitFor();
    } finally {
      const p = line.price!;
      const restore = await page.request.put(`/api/parts/${line.partId}/price`, {
        headers: { 'X-CSRF-Token': token },
        data: { currency: p.currency, breaks: p.breaks, source: p.source, confidence: p.confidence, priceDate: p.priceDate },
      });
      expect(restore.status()).toBe(200);
    }
    await page.reload();
    await expect.poll(() => page.getByTestId('cost-margin').textContent(), { timeout: 10_000 }).not.toBe('Incomplete');
  });

  it.runIf(partsRouteExists)('sourcing types a price in another currency: the break and the form name the field as the editor labels it; nothing is saved', async () => {
    const page = await signedInPage(browser, 'sourcing');
    await page.goto('/teardowns/1/cost');
    const before = await costOf(page);
    const line = before.lines.find((l) => l.priced && l.designators) ?? before.lines.find((l) => l.priced)!;
    const name = line.designators ?? line.description;
    await page.getByRole('button', { name: `Edit the price of ${name}`, exact: true }).click();
    const editor = page.getByRole('region', { name: `Price of ${name}`, exact: true });
    await editor.waitFor();
    // A currency mark that is not the line's: "€" on a non-euro line, "£" on a euro line [CP].
    const [typed, mark, code] = line.price!.currency === 'EUR' ? ['£0.12', '£', 'GBP'] : ['0,12 €', '€', 'EUR'];
    await editor.getByLabel('Break 1 unit price').fill(typed);
    await editor.getByRole('button', { name: 'Save price' }).click();
    await editor.getByText(`Unit price: "${mark}" is ${code}, but this price is in ${line.price!.currency}`).waitFor();
    await editor.getByText('Not saved: check Break 1 unit price.').waitFor();
    await expect(editor.getByText(/breaks\.0/).count()).resolves.toBe(0);
    await editor.getByRole('button', { name: 'Cancel' }).click();
    const after = await costOf(page);
    expect(after.lines.find((l) => l.partId === line.partId)!.price!.breaks).toEqual(line.price!.breaks);
    await page.context().close();
  });
});
