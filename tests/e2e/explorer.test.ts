// Findings explorer in the browser: a lead searches "sensor", narrows to pocket heaters with the
// category facet, opens a result (landing on the teardown section that holds it), and the address
// reproduces the whole search on reload and through back/forward.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launch, signedInPage } from './browser';

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await launch();
  page = await signedInPage(browser, 'lead');
});
afterAll(() => browser?.close());

const results = (p: Page) => p.getByRole('table', { name: 'Search results' });
const resultTitles = async (p: Page) => (await results(p).locator('tbody tr td:nth-child(2) a').allTextContents()).map((s) => s.trim());
const facet = (p: Page, title: string) => p.getByRole('region', { name: new RegExp(`^${title}`) });

describe('left rail', () => {
  it('every role has Findings in the rail and can open the explorer', async () => {
    for (const role of ['admin', 'engineer', 'sourcing', 'lead', 'viewer']) {
      const p = await signedInPage(browser, role);
      await p.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Findings', exact: true }).click();
      await p.getByRole('heading', { name: 'Findings explorer' }).waitFor();
      await results(p).waitFor();
      await p.context().close();
    }
  });
});

describe('findings explorer', () => {
  let explorerUrl = '';
  let titles: string[] = [];

  it('a lead opens Findings from the rail and sees findings listed and the pattern counts', async () => {
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Findings', exact: true }).click();
    await page.getByRole('heading', { name: 'Findings explorer' }).waitFor();
    await results(page).waitFor();
    const heaters = page.locator('[data-pattern="heater.no-sensor"]');
    // The browser tests share one server, and others add devices: the card shows what the API counts
    // now (the demo's own counts, 1 of 3, are checked by tests/api/explorer.test.ts on a fresh database).
    const api = (await (await page.request.get('/api/patterns')).json()).patterns as { key: string; count: number; of: number }[];
    const pattern = api.find((x) => x.key === 'heater.no-sensor')!;
    await expect.poll(() => heaters.textContent(), { timeout: 10_000 }).toMatch(new RegExp(`${pattern.count} of ${pattern.of} pocket heaters ha(s|ve) no temperature sensor`));
    await expect.poll(() => heaters.getByRole('link', { name: 'Halvix HandGlow Duo 10' }).count(), { timeout: 10_000 }).toBe(1);
  });

  it('searches "sensor" and narrows to pocket heaters; the address holds the query', async () => {
    await page.getByRole('searchbox', { name: /Search findings/ }).fill('sensor');
    await page.waitForURL((u) => u.searchParams.get('q') === 'sensor');
    await expect.poll(() => page.getByText(/hits? for sensor/).count(), { timeout: 10_000 }).toBe(1);
    const all = await resultTitles(page);
    expect(all.length).toBeGreaterThan(3);

    await facet(page, 'Device category')
      .getByRole('checkbox', { name: /Pocket heater/ })
      .click();
    await page.waitForURL((u) => u.searchParams.getAll('category').join() === 'pocket-heater' && u.searchParams.get('q') === 'sensor');
    await expect.poll(async () => (await resultTitles(page)).length, { timeout: 10_000 }).toBeLessThan(all.length);
    titles = await resultTitles(page);
    expect(titles).toContain('No temperature sensor anywhere');
    // Every row is a pocket heater now, and the hit is highlighted in its snippet.
    const devices = await results(page).locator('tbody tr td:nth-child(3)').allTextContents();
    expect(devices.every((d) => d.includes('Pocket heater'))).toBe(true);
    await expect(
      results(page)
        .locator('mark', { hasText: /^sensor$/i })
        .count(),
    ).resolves.toBeGreaterThan(0);
    explorerUrl = page.url();
  });

  it('reloading the address reproduces the search: words, facet and results', async () => {
    await page.reload();
    await results(page).waitFor();
    await expect.poll(() => page.getByRole('searchbox', { name: /Search findings/ }).inputValue(), { timeout: 10_000 }).toBe('sensor');
    await expect
      .poll(
        () =>
          facet(page, 'Device category')
            .getByRole('checkbox', { name: /Pocket heater/ })
            .isChecked(),
        { timeout: 10_000 },
      )
      .toBe(true);
    await expect.poll(() => resultTitles(page), { timeout: 10_000 }).toEqual(titles);
    // The same address opened afresh in another tab gives the same results.
    const other = await page.context().newPage();
    await other.goto(explorerUrl);
    await results(other).waitFor();
    await expect.poll(() => resultTitles(other), { timeout: 10_000 }).toEqual(titles);
    await other.close();
  });

  it('opens a result on the teardown section that holds it; back returns to the same search', async () => {
    await results(page).getByRole('link', { name: 'No temperature sensor anywhere' }).click();
    await page.waitForURL((u) => /^\/teardowns\/\d+\/findings$/.test(u.pathname));
    await page
      .getByRole('heading', { name: /HandGlow Duo 10/ })
      .first()
      .waitFor();
    await page
      .getByText(/No temperature sensor anywhere: not on the board/)
      .first()
      .waitFor();
    await page.goBack();
    await page.waitForURL((u) => u.pathname === '/findings' && u.searchParams.get('q') === 'sensor');
    await expect.poll(() => resultTitles(page), { timeout: 10_000 }).toEqual(titles);
    await expect.poll(() => page.getByRole('searchbox', { name: /Search findings/ }).inputValue(), { timeout: 10_000 }).toBe('sensor');
  });

  it('back and forward step through facet changes', async () => {
    await facet(page, 'Type').getByRole('checkbox', { name: /^Part/ }).click();
    await page.waitForURL((u) => u.searchParams.getAll('type').join() === 'part');
    await expect.poll(async () => (await resultTitles(page)).every((t) => /NTC thermistor/.test(t)), { timeout: 10_000 }).toBe(true);
    await page.goBack();
    await page.waitForURL((u) => u.searchParams.getAll('type').length === 0 && u.searchParams.get('q') === 'sensor');
    await expect.poll(() => resultTitles(page), { timeout: 10_000 }).toEqual(titles);
    await page.goForward();
    await page.waitForURL((u) => u.searchParams.getAll('type').join() === 'part');
  });

  it('exports the current results as CSV', async () => {
    const href = await page.getByRole('link', { name: 'Export CSV' }).getAttribute('href');
    expect(href).toMatch(/^\/api\/search\.csv\?/);
    const res = await page.request.get(href!);
    expect(res.status()).toBe(200);
    const text = await res.text();
    expect(text.split('\r\n')[0]).toContain('"Type","Title","Text"');
    expect(text).toContain('NTC thermistor');
  });
});
