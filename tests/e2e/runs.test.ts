import AxeBuilder from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launch, signedInPage } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

/** No serious or critical accessibility violation in the part of the page a test covers. */
async function expectNoSeriousViolations(page: Page, selector: string) {
  const result = await new AxeBuilder({ page }).include(selector).analyze();
  expect(result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => v.id)).toEqual([]);
}

/**
 * A discharge log whose column names give nothing away, so the columns are mapped by hand:
 * 1.5 A (logged in mA) for 3600 s with the voltage (in mV) falling from 4.1 V to 3.3 V.
 * Delivered: 1.5 A × 1 h = 1.5 Ah; 1.5 A × 3.7 V mean × 1 h = 5.55 Wh [C].
 */
function log(): string {
  const lines = ['col_a,col_b,col_c'];
  for (let k = 0; k <= 3600; k += 5) lines.push(`${k},${(4100 - (800 * k) / 3600).toFixed(2)},1500`);
  return lines.join('\n') + '\n';
}

describe('bench runs', () => {
  it('uploads a discharge log, maps its columns, and shows the chart and the delivered capacity', async () => {
    const page = await signedInPage(browser, 'engineer');
    // The draft teardown of the Stackcell 20 PD (editable without the published confirmation).
    const runs = (await (await page.request.get('/api/runs?kind=discharge')).json()) as { runs: { teardownId: number; device: { model: string } }[] };
    const teardownId = runs.runs.find((r) => r.device.model === 'Stackcell 20 PD')!.teardownId;
    await page.goto(`/teardowns/${teardownId}/runs`);
    await page.getByRole('button', { name: 'Add a run' }).first().click();
    await page.getByLabel('Log file (CSV or TSV)').setInputFiles({ name: 'bench-load.csv', mimeType: 'text/csv', buffer: Buffer.from(log()) });

    // The preview shows the columns; map them.
    await page.getByRole('button', { name: 'Upload and analyse' }).waitFor();
    await page.getByRole('table', { name: 'Preview of the log' }).getByText('col_b').waitFor();
    await page.getByLabel('Kind of run').selectOption('discharge');
    await page.getByLabel('Label', { exact: true }).fill('Bench check at 1.5 A');
    await page.getByLabel('Time', { exact: true }).selectOption('col_a');
    await page.getByLabel('Time unit').selectOption('s');
    await page.getByLabel('Voltage', { exact: true }).selectOption('col_b');
    await page.getByLabel('Voltage unit').selectOption('mV');
    await page.getByLabel('Current', { exact: true }).selectOption('col_c');
    await page.getByLabel('Current unit').selectOption('mA');
    await page.getByLabel('Cut-off voltage (V)').fill('');
    await page.getByRole('button', { name: 'Upload and analyse' }).click();

    // The new run is selected: its delivered capacity and the voltage chart.
    const capacity = page.locator('dt', { hasText: 'Delivered capacity' }).locator('xpath=following-sibling::dd[1]');
    await capacity.waitFor({ timeout: 30_000 });
    await expect.poll(() => page.getByRole('heading', { name: /Bench check at 1.5 A/ }).count(), { timeout: 10_000 }).toBe(1);
    // (1.50 Ah once the shared formatter keeps trailing zeros, as its own test asks.)
    await expect.poll(() => capacity.textContent(), { timeout: 10_000 }).toMatch(/^1\.50? Ah$/);
    const energy = page.locator('dt', { hasText: 'Delivered energy' }).locator('xpath=following-sibling::dd[1]');
    await expect.poll(() => energy.textContent(), { timeout: 10_000 }).toBe('5.55 Wh');
    // Against the 20 Ah on the label: 7.5 %, below the 90 % warning threshold.
    await expect.poll(() => page.getByRole('region', { name: 'Comparison with the label' }).textContent(), { timeout: 10_000 }).toMatch(/7\.50? %\s*of the label/);

    const chart = page.getByRole('figure', { name: 'Voltage against time' });
    await chart.locator('.recharts-line-curve').first().waitFor();
    await expect(chart.locator('.recharts-line-curve').count()).resolves.toBeGreaterThan(0);
    // Every chart has its data table: 721 samples, all plotted.
    await chart.getByText(/Data table: voltage, 721 plotted points/).click();
    // The table renders once the details element reports it is open; wait for its last row.
    await chart.getByRole('table').locator('tbody tr').nth(720).waitFor({ state: 'attached' });
    await expect.poll(() => chart.getByRole('table').locator('tbody tr').count(), { timeout: 10_000 }).toBe(721);
    await page.context().close();
  });

  it("shows a demo discharge's pulse resistance with both levels, the debounce it used and the label in Wh; a charge's termination basis", async () => {
    const page = await signedInPage(browser, 'engineer');
    type Run = { id: number; teardownId: number; kind: string; analysis: { discharge?: { internalResistance?: { ohms: number } | null } } };
    const all = ((await (await page.request.get('/api/runs')).json()) as { runs: Run[] }).runs;
    const pulsed = all.find((r) => r.kind === 'discharge' && r.analysis.discharge?.internalResistance)!;
    await page.goto(`/teardowns/${pulsed.teardownId}/runs?run=${pulsed.id}`);
    const resistance = page.locator('dt', { hasText: 'Internal resistance (DC)' }).locator('xpath=following-sibling::dd');
    await resistance.first().waitFor({ timeout: 30_000 });
    await expect.poll(() => resistance.first().textContent(), { timeout: 10_000 }).toMatch(/^\d+(\.\d+)? mΩ$/);
    // Both levels: I₁ at U₁ → I₂ at U₂.
    await expect.poll(() => resistance.nth(1).textContent(), { timeout: 10_000 }).toMatch(/A at \d\.\d+ V → .*A at \d\.\d+ V/);
    const duration = page.locator('dt', { hasText: 'Duration' }).locator('xpath=following-sibling::dd[2]');
    await expect.poll(() => duration.textContent(), { timeout: 10_000 }).toMatch(/held 5 s \(workspace setting\)/);
    await expect
      .poll(() => page.getByRole('region', { name: 'Comparison with the label' }).textContent(), { timeout: 10_000 })
      .toMatch(/of the label, in energy: .* Wh delivered, .* Wh claimed.*Basis:/);

    const charge = all.find((r) => r.kind === 'charge' && r.teardownId === pulsed.teardownId)!;
    await page.goto(`/teardowns/${charge.teardownId}/runs?run=${charge.id}`);
    const termination = page.locator('dt', { hasText: 'Termination current' }).locator('xpath=following-sibling::dd[2]');
    await expect.poll(() => termination.textContent(), { timeout: 30_000 }).toMatch(/0\.05 C of the rated .* Ah \(.*pack record\)/);
    await page.context().close();
  });

  it('on a published teardown a run change asks in the dialog: "Keep it published" saves nothing, the confirm saves and moves it to draft', async () => {
    const page = await signedInPage(browser, 'engineer');
    type Run = { id: number; teardownId: number; label: string; teardownStatus: string };
    const all = ((await (await page.request.get('/api/runs')).json()) as { runs: Run[] }).runs;
    // Not the demo's teardown 1, which the cost and price-view tests read as published.
    const run = all.filter((r) => r.teardownStatus === 'published' && r.teardownId !== 1).at(-1)!;
    expect(run, 'a run on a published demo teardown').toBeTruthy();
    const status = async () => ((await (await page.request.get(`/api/teardowns/${run.teardownId}`)).json()) as { teardown: { status: string } }).teardown.status;
    const label = async () => ((await (await page.request.get(`/api/runs/${run.id}`)).json()) as { run: Run }).run.label;
    await page.goto(`/teardowns/${run.teardownId}/runs?run=${run.id}`);
    await page.getByRole('button', { name: 'Settings' }).click();
    const form = page.getByRole('form', { name: 'Run settings' });
    await form.getByLabel('Label', { exact: true }).fill(`${run.label} (checked)`);
    await form.getByRole('button', { name: 'Save and re-analyse' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByText('Move this teardown back to draft?').waitFor();
    await expectNoSeriousViolations(page, 'dialog[open]');
    await dialog.getByRole('button', { name: 'Keep it published' }).click();
    await dialog.waitFor({ state: 'detached' });
    expect(await label()).toBe(run.label);
    expect(await status()).toBe('published');
    // The form keeps the edit; saving again and confirming saves it and moves the teardown to draft.
    await form.getByRole('button', { name: 'Save and re-analyse' }).click();
    await dialog.getByRole('button', { name: 'Save and move to draft' }).click();
    await form.waitFor({ state: 'detached' });
    await expect.poll(label, { timeout: 10_000 }).toBe(`${run.label} (checked)`);
    expect(await status()).toBe('draft');

    // Put the demo back: the old label, submitted by the engineer and approved by a lead.
    const token = async (p: Page) => ((await (await p.request.get('/api/auth/csrf')).json()) as { token: string }).token;
    const headers = { 'X-CSRF-Token': await token(page) };
    expect((await page.request.patch(`/api/runs/${run.id}`, { headers, data: { label: run.label } })).status()).toBe(200);
    expect((await page.request.post(`/api/teardowns/${run.teardownId}/submit`, { headers, data: {} })).status()).toBe(200);
    const lead = await signedInPage(browser, 'lead');
    expect((await lead.request.post(`/api/teardowns/${run.teardownId}/approve`, { headers: { 'X-CSRF-Token': await token(lead) }, data: {} })).status()).toBe(200);
    expect(await status()).toBe('published');
    await lead.context().close();
    await page.context().close();
  });

  it('names the row and column of a bad log and keeps the mapping to fix it', async () => {
    const page = await signedInPage(browser, 'engineer');
    const runs = (await (await page.request.get('/api/runs?kind=discharge')).json()) as { runs: { teardownId: number; device: { model: string } }[] };
    const teardownId = runs.runs.find((r) => r.device.model === 'Stackcell 20 PD')!.teardownId;
    await page.goto(`/teardowns/${teardownId}/runs`);
    await page.getByRole('button', { name: 'Add a run' }).first().click();
    const bad = 'elapsed_s,volts,amps\n0,4.10,1\n1,4.09,1\n1,4.08,1\n';
    await page.getByLabel('Log file (CSV or TSV)').setInputFiles({ name: 'repeated.csv', mimeType: 'text/csv', buffer: Buffer.from(bad) });
    await page.getByRole('button', { name: 'Upload and analyse' }).click();
    const alert = page.getByRole('alert').filter({ hasText: 'refused at row 4' });
    await alert.waitFor();
    await expect.poll(() => alert.textContent(), { timeout: 10_000 }).toMatch(/column “elapsed_s”.*Nothing was stored/);
    await expect.poll(() => page.getByLabel('Time', { exact: true }).inputValue(), { timeout: 10_000 }).toBe('elapsed_s');
    await page.context().close();
  });
});
