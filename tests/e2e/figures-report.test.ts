// The printable teardown report's figures by operating mode, implausible figures in words, and the
// admin's figure settings (contact time by device category, usable share) in the browser.
import AxeBuilder from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { durationText, type FiguresResponse, type PowerSystemDto, type TeardownDto, type WorkspaceSettings } from '@splitcase/contracts';
import { launch, signedInPage } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

/** Serious and critical accessibility violations inside the given part of the page. */
async function axeProblems(page: Page, selector: string): Promise<string[]> {
  const result = await new AxeBuilder({ page }).include(selector).analyze();
  return result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}

async function csrf(page: Page): Promise<string> {
  return (await (await page.request.get('/api/auth/csrf')).json()).token;
}

async function post(page: Page, url: string, data: unknown) {
  const res = await page.request.post(url, { headers: { 'X-CSRF-Token': await csrf(page) }, data });
  expect(res.status(), `${url}: ${await res.text()}`).toBe(201);
  return res.json();
}

async function teardownOf(page: Page, model: string): Promise<number> {
  const devices = (await (await page.request.get(`/api/devices?q=${encodeURIComponent(model)}`)).json()).devices as { model: string; latestTeardown: { id: number } | null }[];
  const id = devices.find((d) => d.model === model)?.latestTeardown?.id;
  if (!id) throw new Error(`No teardown of ${model}`);
  return id;
}

const figuresOf = async (page: Page, id: number) => (await (await page.request.get(`/api/teardowns/${id}/figures`)).json()) as FiguresResponse;

async function openReport(page: Page, id: number) {
  await page.goto(`/teardowns/${id}/report`);
  await page.locator('[data-testid="report"][data-ready="true"]').waitFor();
}

const SUMMARY_KEYS = ['mode.power', 'mode.packPower', 'mode.current', 'mode.cRate', 'mode.runtime.hours', 'mode.surfaceTemperature', 'mode.touchMargin', 'mode.standby.months'];

describe('printable report: figures by operating mode', () => {
  it('a summary across modes, a table per mode with formula and source, then the whole-device figures; the modes in the power part', async () => {
    const page = await signedInPage(browser, 'engineer');
    const id = await teardownOf(page, 'HandGlow Duo 10');
    const data = await figuresOf(page, id);
    const power = (await (await page.request.get(`/api/teardowns/${id}/power`)).json()) as PowerSystemDto;
    expect(data.modes.length).toBeGreaterThan(1);
    await openReport(page, id);
    const figures = page.locator('[data-section="figures"]');

    // The summary: one row per mode, a value where the API has the figure, a dash where it has none.
    const summary = figures.getByRole('table', { name: 'Figures by mode' });
    await expect.poll(() => summary.locator('tbody tr').count(), { timeout: 10_000 }).toBe(data.modes.length);
    for (const m of data.modes) {
      const row = summary.locator(`tr[data-mode-row="${m.id}"]`);
      await expect.poll(() => row.locator('td').first().textContent(), { timeout: 10_000 }).toBe(m.name);
      for (const key of SUMMARY_KEYS) {
        const f = data.figures.find((x) => x.modeId === m.id && x.key === key);
        const text = (await row.locator(`td[data-summary="${key}"]`).textContent()) ?? '';
        if (!f) expect(text, `${m.name} ${key}`).toBe('—');
        else expect(text, `${m.name} ${key}`).not.toBe('—');
        // The runtime as the API has it, to three significant figures.
        if (f && key === 'mode.runtime.hours') {
          expect(text).toMatch(/^\d[\d.]* h$/);
          expect(Math.abs(Number.parseFloat(text) / (f.value as number) - 1)).toBeLessThan(0.005);
        }
      }
    }

    // Each mode's own table: every figure of that mode with the API's source.
    for (const m of data.modes) {
      const own = data.figures.filter((f) => f.modeId === m.id);
      const table = figures.locator(`[data-mode-figures="${m.id}"]`);
      await expect.poll(() => table.locator('tr[data-figure]').count(), { timeout: 10_000 }).toBe(own.length);
      for (const f of own) await expect.poll(() => table.locator(`tr[data-figure="${f.key}"][data-mode="${m.id}"] [data-testid="figure-source"]`).textContent(), { timeout: 10_000 }).toBe(f.source);
    }
    // The whole-device figures once each, after the modes.
    const device = data.figures.filter((f) => f.modeId === null);
    await expect.poll(() => figures.locator('tr[data-figure][data-mode=""]').count(), { timeout: 10_000 }).toBe(device.length);
    for (const f of device.slice(0, 6))
      await expect.poll(() => figures.locator(`tr[data-figure="${f.key}"][data-mode=""] [data-testid="figure-source"]`).textContent(), { timeout: 10_000 }).toBe(f.source);

    // The power part lists the modes: name, note, loads at their duty, quiescent current.
    const modes = page.locator('[data-section="power"]').getByRole('table', { name: 'Operating modes' });
    await expect.poll(() => modes.locator('tbody tr').count(), { timeout: 10_000 }).toBe(power.modes.length);
    for (const m of power.modes) {
      const text = (await modes.locator(`tr[data-mode="${m.id}"]`).textContent()) ?? '';
      expect(text).toContain(m.name);
      if (m.note) expect(text).toContain(m.note);
      for (const l of m.loads) expect(text).toContain(power.loads.find((x) => x.id === l.loadId)!.label);
      if (!m.loads.length) expect(text).toContain('No loads');
      // The report shows stored values normalised with a prefix, three significant figures (20 µA → "20.0 µA").
      if (m.quiescentAmps !== null && m.quiescentAmps < 1e-3) expect(text).toContain(`${(m.quiescentAmps * 1e6).toPrecision(3)} µA`);
      else if (m.quiescentAmps !== null) expect(text).toMatch(/\d A/);
    }
    expect(await axeProblems(page, '[data-testid="report"]')).toEqual([]);

    // As a PDF: several A4 pages.
    await page.emulateMedia({ media: 'print' });
    const pdf = await page.pdf({ format: 'A4', printBackground: true, preferCSSPageSize: true });
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect((pdf.toString('latin1').match(/\/Type\s*\/Page(?!s)/g) ?? []).length).toBeGreaterThan(1);
    await page.context().close();
  });

  it('without modes the report says so, an implausible figure is marked in words, and recorded modes bring per-mode tables', async () => {
    const page = await signedInPage(browser, 'engineer');
    const device = (await post(page, '/api/devices', { maker: 'Tessland Bench', model: 'Checkpad (browser test)', category: 'pocket-heater' })).device as { id: number };
    const teardown = (await post(page, '/api/teardowns', { deviceId: device.id })).teardown as { id: number };
    // 4.6 g for a 10 Wh pack: about 2 170 Wh/kg, far beyond any lithium-ion cell (100–265 Wh/kg [S: encyclopedic data]).
    const pack = await page.request.put(`/api/teardowns/${teardown.id}/pack`, {
      headers: { 'X-CSRF-Token': await csrf(page) },
      data: { chemistry: 'li-ion', nominalVolts: '3.7 V', capacityAh: '2700 mAh', massKg: '4.6 g' },
    });
    expect(pack.status()).toBeLessThan(300);
    const load = (await post(page, `/api/teardowns/${teardown.id}/loads`, { kind: 'heater', label: 'Heater pad', resistanceOhms: '3R0', heatedAreaM2: '54 cm²' })).load as { id: number };

    let data = await figuresOf(page, teardown.id);
    expect(data.modes).toEqual([]);
    const flagged = data.figures.filter((f) => f.implausible).map((f) => f.key);
    expect(flagged).toContain('pack.specificEnergy');
    await openReport(page, teardown.id);
    const figures = page.locator('[data-section="figures"]');
    await expect.poll(() => figures.getByTestId('no-modes').textContent(), { timeout: 10_000 }).toMatch(/^No operating modes recorded: the figures below take all loads at once/);
    await expect.poll(() => figures.getByRole('table', { name: 'Figures by mode' }).count(), { timeout: 10_000 }).toBe(0);
    for (const key of flagged) await expect.poll(() => figures.locator(`tr[data-figure="${key}"] [data-testid="figure-implausible"]`).textContent(), { timeout: 10_000 }).toBe('implausible');
    await expect.poll(() => figures.locator('[data-testid="figure-implausible"]').count(), { timeout: 10_000 }).toBe(flagged.length);
    await expect.poll(() => figures.getByTestId('implausible-count').textContent(), { timeout: 10_000 }).toMatch(/marked implausible/);
    await expect.poll(() => page.locator('[data-section="power"]').textContent(), { timeout: 10_000 }).toContain('No operating modes recorded');
    expect(await axeProblems(page, '[data-testid="report"]')).toEqual([]);

    // Two modes recorded: the report follows with a row and a table for each.
    await post(page, `/api/teardowns/${teardown.id}/modes`, { name: 'Full heat', note: 'button held', loads: [{ loadId: load.id, duty: 1 }] });
    await post(page, `/api/teardowns/${teardown.id}/modes`, { name: 'Half heat', loads: [{ loadId: load.id, duty: '50 %' }] });
    data = await figuresOf(page, teardown.id);
    expect(data.modes.map((m) => m.name)).toEqual(['Full heat', 'Half heat']);
    await openReport(page, teardown.id);
    const summary = figures.getByRole('table', { name: 'Figures by mode' });
    await expect.poll(() => summary.locator('tbody tr td:first-child').allTextContents(), { timeout: 10_000 }).toEqual(['Full heat', 'Half heat']);
    for (const m of data.modes) {
      expect(data.figures.some((f) => f.modeId === m.id && f.key === 'mode.runtime.hours')).toBe(true);
      await expect.poll(() => summary.locator(`tr[data-mode-row="${m.id}"] td[data-summary="mode.runtime.hours"]`).textContent(), { timeout: 10_000 }).toMatch(/^\d[\d.]* h$/);
      await expect.poll(() => figures.locator(`[data-mode-figures="${m.id}"] h3`).textContent(), { timeout: 10_000 }).toContain(`Mode: ${m.name}`);
    }
    await expect.poll(() => page.locator('[data-section="power"]').getByRole('table', { name: 'Operating modes' }).textContent(), { timeout: 10_000 }).toContain('Heater pad at 50 %');
    await expect(figures.getByTestId('no-modes').count()).resolves.toBe(0);
    await page.context().close();
  });
});

describe('figure settings (admin)', () => {
  it('an admin sets the contact time of a device category and the usable share, typed with units; mistakes name the field; other settings stay', async () => {
    const page = await signedInPage(browser, 'admin');
    const before = (await (await page.request.get('/api/settings')).json()).settings as WorkspaceSettings;
    try {
      await page.goto('/admin/figures');
      await page.getByRole('navigation', { name: 'Admin sections' }).getByRole('link', { name: 'Figures & safety' }).waitFor();
      const form = page.getByRole('form', { name: 'Figure settings' });
      const heater = form.getByLabel('Pocket heater', { exact: true });
      const stored = before.contactSecondsByCategory['pocket-heater'];
      await expect.poll(() => heater.inputValue(), { timeout: 10_000 }).toBe(stored === undefined ? '' : durationText(stored));
      await expect.poll(() => form.getByText(/burn threshold.*metal 51 °C.*10 min it is 48 °C and for 8 h or\s+longer 43 °C/).count(), { timeout: 10_000 }).toBe(1);

      // A bare number, a time over 8 h and a share under 50 % are refused, each on its field; nothing is saved.
      await heater.fill('600');
      await form.getByLabel('USB fan', { exact: true }).fill('9 h');
      await form.getByLabel('Usable share of the rated energy (%)').fill('40');
      await form.getByRole('button', { name: 'Save figure settings' }).click();
      await expect.poll(() => form.getByText('Give the unit too, such as 10 min, 8 h or 60 s').count(), { timeout: 10_000 }).toBe(1);
      await expect.poll(() => form.getByText('At most 8 h').count(), { timeout: 10_000 }).toBe(1);
      await expect.poll(() => form.getByText('At least 50 %').count(), { timeout: 10_000 }).toBe(1);
      await expect(heater.getAttribute('aria-invalid')).resolves.toBe('true');
      expect((await (await page.request.get('/api/settings')).json()).settings).toEqual(before);
      expect(await axeProblems(page, 'form[aria-label="Figure settings"]')).toEqual([]);

      // Pocket heaters judged at 8 h, fans at the default, 85 % usable.
      await heater.fill('8 h');
      await form.getByLabel('USB fan', { exact: true }).fill('');
      await form.getByLabel('Usable share of the rated energy (%)').fill('85 %');
      await form.getByRole('button', { name: 'Save figure settings' }).click();
      await page.getByText('Figure settings saved').waitFor();
      const after = (await (await page.request.get('/api/settings')).json()).settings as WorkspaceSettings;
      expect(after.contactSecondsByCategory['pocket-heater']).toBe(28_800);
      expect(after.contactSecondsByCategory['usb-fan']).toBeUndefined();
      expect(after.usableFraction).toBe(0.85);
      // The settings this form does not show are as they were.
      expect({ ...after, contactSecondsByCategory: before.contactSecondsByCategory, usableFraction: before.usableFraction }).toEqual(before);

      // A heater's touch margin now reads the threshold at 8 h: 43 °C for every material (ISO 13732-1 [M]).
      const id = await teardownOf(page, 'HandGlow Duo 10');
      const own = (await (await page.request.get(`/api/teardowns/${id}`)).json()).teardown as TeardownDto;
      expect(own.contactSeconds).toBeNull();
      const margin = (await figuresOf(page, id)).figures.find((f) => f.key === 'mode.touchMargin' && f.inputs.some((i) => i.key === 'contactSeconds'))!;
      expect(margin.inputs.find((i) => i.key === 'contactSeconds')!.value).toBe(28_800);
      expect(margin.inputs.find((i) => i.key === 'thresholdC')!.value).toBe(43);
      await page.reload();
      await expect.poll(() => page.getByRole('form', { name: 'Figure settings' }).getByLabel('Pocket heater', { exact: true }).inputValue(), { timeout: 10_000 }).toBe('8 h');
    } finally {
      const res = await page.request.patch('/api/settings', { headers: { 'X-CSRF-Token': await csrf(page) }, data: before });
      expect(res.status()).toBe(200);
      await page.context().close();
    }
  });
});
