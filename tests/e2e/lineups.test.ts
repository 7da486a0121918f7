import AxeBuilder from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ComparisonDto, LineupDto } from '@splitcase/contracts';
import { launch, signedInPage } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

/** Serious and critical accessibility violations inside the given parts of the page. */
async function axeProblems(page: Page, selectors: string[]): Promise<string[]> {
  let builder = new AxeBuilder({ page });
  for (const s of selectors) builder = builder.include(s);
  const result = await builder.analyze();
  return result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}

async function csrf(page: Page): Promise<string> {
  return (await (await page.request.get('/api/auth/csrf')).json()).token;
}

/** "High — the most power at the main load" as the table shows a row's mode, from the API's row. */
const modeWords = (r: ComparisonDto['rows'][number]) => (r.mode ? `${r.mode.name} — ${r.mode.reason}` : null);

const rankingNames = async (page: Page) => (await page.getByRole('list', { name: 'Ranking' }).getByTestId('ranking-row').allTextContents()).map((t) => t.replace(/^\d+/, ''));

describe('lineups', () => {
  it('a lead builds a lineup of three devices, moves a weight slider, sees the ranking change, and opens the print view', async () => {
    const page = await signedInPage(browser, 'lead');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Lineups' }).click();
    await page.getByRole('heading', { name: 'Lineups' }).waitFor();
    await page.getByRole('link', { name: 'New lineup' }).click();
    await page.getByRole('heading', { name: 'New lineup' }).waitFor();

    await page.getByLabel('Name', { exact: true }).fill('Bench check: banks and a heater');
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
    expect(await rankingNames(page)).toEqual([
      expect.stringContaining('Pellam Works Stackcell 10'),
      expect.stringContaining('Halvix HandGlow Duo 10'),
      expect.stringContaining('Corvane Breeze Pocket'),
    ]);
    await page.getByRole('table', { name: 'Normalised comparison' }).waitFor();
    await page.getByTestId('pareto-chart').locator('svg').first().waitFor();
    await page.getByRole('table', { name: 'Scatter chart, data' }).waitFor();

    // Price to the maximum weight: the server ranks again (POST, not saved) and the cheapest leads.
    const preview = page.waitForResponse((r) => r.url().includes('/comparison') && r.request().method() === 'POST');
    await page.getByRole('slider', { name: 'Weight of Retail price' }).focus();
    await page.keyboard.press('End');
    expect((await preview).status()).toBe(200);
    await expect.poll(async () => (await rankingNames(page))[0], { timeout: 10_000 }).toContain('Corvane Breeze Pocket');
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

  it('a lead picks the operating mode the lineup compares: each device says which mode its runtime comes from, incomplete rows come last and say what they lack', async () => {
    const page = await signedInPage(browser, 'lead');
    // Three heaters; runtime weighs in the ranking, so a device without the mode lacks a weighted metric.
    const devices = (await (await page.request.get('/api/devices?category=pocket-heater')).json()).devices as { id: number; model: string }[];
    const heaters = ['HandGlow Duo 10', 'HandGlow Pro 2', 'Pocketsun S'].map((model) => devices.find((d) => d.model === model)!);
    expect(heaters.every(Boolean)).toBe(true);
    const created = await page.request.post('/api/lineups', {
      headers: { 'X-CSRF-Token': await csrf(page) },
      data: { name: 'Heaters by mode (browser test)', deviceIds: heaters.map((d) => d.id), weights: { runtimeH: 2, packWh: 1 } },
    });
    expect(created.status()).toBe(201);
    const lineup = (await created.json()).lineup as LineupDto;
    expect(lineup.mode).toEqual({ rule: 'highest' });
    await page.goto(`/lineups/${lineup.id}`);
    await page.getByRole('heading', { name: 'Heaters by mode (browser test)' }).waitFor();
    const table = page.getByRole('table', { name: 'Normalised comparison' });
    await table.waitFor();
    const choice = page.getByTestId('mode-choice');
    await expect.poll(() => choice.getByRole('radio', { name: 'Most power at the main load (e.g. highest heat)' }).isChecked(), { timeout: 10_000 }).toBe(true);

    // The saved choice: every row names its mode as the API does.
    const saved = (await (await page.request.get(`/api/lineups/${lineup.id}/comparison`)).json()) as ComparisonDto;
    for (const r of saved.rows) {
      const words = modeWords(r);
      const cell = table.locator('tr', { hasText: r.device.label }).getByTestId('row-mode');
      await expect.poll(() => cell.textContent(), { timeout: 10_000 }).toContain(words ?? 'No modes recorded');
    }

    // Power-bank output, tried without saving: the server's preview decides, the page shows it.
    const expected = (await (
      await page.request.post(`/api/lineups/${lineup.id}/comparison`, { headers: { 'X-CSRF-Token': await csrf(page) }, data: { weights: lineup.weights, mode: { rule: 'power-bank' } } })
    ).json()) as ComparisonDto;
    const incomplete = expected.rows.filter((r) => !r.complete);
    // A heater without a power-bank mode lacks its runtime (the demo has one heater with a USB output).
    expect(incomplete.length).toBeGreaterThan(0);
    expect(incomplete.every((r) => r.incompleteMetrics.includes('runtimeH'))).toBe(true);
    const preview = page.waitForResponse((r) => r.url().endsWith(`/api/lineups/${lineup.id}/comparison`) && r.request().method() === 'POST');
    await choice.getByRole('radio', { name: 'Power-bank output' }).check();
    expect((await preview).status()).toBe(200);
    await page.getByText('Unsaved mode').waitFor();
    const ranking = page.getByRole('list', { name: 'Ranking' });
    await expect.poll(async () => (await rankingNames(page)).map((t) => t.trim()), { timeout: 10_000 }).toEqual(expected.rows.map((r) => expect.stringContaining(r.device.label)));
    // Complete rows first, then a heading, then the incomplete rows, each saying what it lacks, in words.
    const flags = await ranking.getByTestId('ranking-row').evaluateAll((els) => els.map((e) => e.getAttribute('data-complete')));
    expect(flags).toEqual(expected.rows.map((r) => (r.complete ? 'true' : 'false')));
    await expect.poll(() => ranking.getByTestId('ranking-incomplete-heading').textContent(), { timeout: 10_000 }).toContain('Incomplete: ranked after every complete device');
    for (const r of incomplete) {
      const row = table.locator('tr', { hasText: r.device.label });
      await expect.poll(() => row.getByTestId('row-incomplete').textContent(), { timeout: 10_000 }).toBe('Incomplete, lacks Runtime');
      await expect.poll(() => row.getByTestId('row-mode').textContent(), { timeout: 10_000 }).toBe(r.missing.runtimeH);
    }
    for (const r of expected.rows.filter((x) => x.mode)) {
      await expect.poll(() => table.locator('tr', { hasText: r.device.label }).getByTestId('row-mode').textContent(), { timeout: 10_000 }).toContain(modeWords(r)!);
    }

    // A mode by name needs its name; with one, the rows follow it.
    await choice.getByRole('radio', { name: 'A mode by name' }).check();
    await expect.poll(() => choice.getByRole('alert').textContent(), { timeout: 10_000 }).toBe('Give the mode name to compare.');
    await expect(page.getByRole('button', { name: 'Save mode' }).isDisabled()).resolves.toBe(true);
    const named = page.waitForResponse((r) => r.url().endsWith(`/api/lineups/${lineup.id}/comparison`) && r.request().method() === 'POST' && (r.request().postData() ?? '').includes('"named"'));
    await choice.getByLabel('Mode name').fill('high');
    expect((await named).status()).toBe(200);
    const byName = (await (await named).json()) as ComparisonDto;
    for (const r of byName.rows.filter((x) => x.mode)) {
      expect(r.mode!.reason).toBe('the mode named "high"');
      await expect.poll(() => table.locator('tr', { hasText: r.device.label }).getByTestId('row-mode').textContent(), { timeout: 10_000 }).toContain(`${r.mode!.name} — the mode named "high"`);
    }
    expect(await axeProblems(page, ['[data-testid="mode-choice"]', 'table', '[aria-label="Ranking"]', '[aria-label="Metric weights"]'])).toEqual([]);

    // Saved: power-bank output. The lineup keeps it, and the page says so after a reload.
    await choice.getByRole('radio', { name: 'Power-bank output' }).check();
    await page.getByRole('button', { name: 'Save mode' }).click();
    await page.getByText('Mode saved.').waitFor();
    const after = (await (await page.request.get(`/api/lineups/${lineup.id}`)).json()).lineup as LineupDto;
    expect(after.mode).toEqual({ rule: 'power-bank' });
    await page.reload();
    await expect.poll(() => page.getByTestId('lineup-mode').textContent(), { timeout: 10_000 }).toBe('Power-bank output');
    await expect.poll(() => page.getByTestId('mode-choice').getByRole('radio', { name: 'Power-bank output' }).isChecked(), { timeout: 10_000 }).toBe(true);

    // The printable report says the same: the mode compared, each device's mode, the incomplete rows last.
    await page.getByRole('link', { name: 'Printable report' }).click();
    const report = page.getByTestId('lineup-report');
    await report.waitFor();
    await expect.poll(() => report.getByTestId('report-mode').textContent(), { timeout: 10_000 }).toMatch(/^Power-bank output: /);
    const printed = report.getByTestId('report-ranking-row');
    await expect.poll(() => printed.count(), { timeout: 10_000 }).toBe(expected.rows.length);
    expect(await printed.evaluateAll((els) => els.map((e) => e.getAttribute('data-complete')))).toEqual(expected.rows.map((r) => (r.complete ? 'true' : 'false')));
    for (const r of incomplete) await expect.poll(() => printed.filter({ hasText: r.device.label }).textContent(), { timeout: 10_000 }).toContain('Incomplete, lacks Runtime');
    const modeCells = await report.getByTestId('report-row-mode').allTextContents();
    for (const r of expected.rows) expect(modeCells.some((t) => (r.mode ? t.includes(modeWords(r)!) : t.includes(r.missing.runtimeH!)))).toBe(true);
    expect(await axeProblems(page, ['[data-testid="lineup-report"]'])).toEqual([]);

    await page.request.delete(`/api/lineups/${lineup.id}`, { headers: { 'X-CSRF-Token': await csrf(page) } });
    await page.context().close();
  });
});
