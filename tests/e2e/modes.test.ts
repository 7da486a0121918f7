// Operating modes through the screens (issue 10 §1): an engineer records low / high / power-bank /
// standby modes for a pocket heater in the power system's modes matrix, uses "duty for 45 °C", and
// reads the runtime of each mode in the figures panel.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launch, signedInPage } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

async function post(page: Page, path: string, data: unknown, method: 'post' | 'put' = 'post') {
  const token = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
  const res = await page.request[method](path, { data, headers: { 'X-CSRF-Token': token } });
  expect(res.status(), `${path}: ${await res.text()}`).toBeLessThan(300);
  return res.json();
}

const modeFigure = (page: Page, mode: string, label: string) =>
  page.locator(`aside[aria-label="Figures"] section[data-mode-group="${mode}"] li`, { has: page.getByRole('button', { name: new RegExp(`^${label}`) }) }).getByTestId('figure-value');

describe('operating modes', () => {
  it('an engineer records modes for a heater and sees a runtime per mode', async () => {
    const page = await signedInPage(browser, 'engineer');
    // A pocket heater set up through the API: one 2700 mAh cell, two 3R0 elements at 3.65 V over 100 cm² of plastic, a 5 V 1 A USB output.
    const device = (await post(page, '/api/devices', { maker: 'Testwright', model: `Modes ${Date.now()}`, category: 'pocket-heater' })).device;
    const td = (await post(page, '/api/teardowns', { deviceId: device.id })).teardown;
    await post(page, `/api/teardowns/${td.id}/pack`, { chemistry: 'li-ion', nominalVolts: '3.7 V', capacityAh: '2700 mAh', protection: true }, 'put');
    const boost = (
      await post(page, `/api/teardowns/${td.id}/converters`, { topology: 'boost', role: 'output', inputVolts: '3.7 V', outputVolts: '5 V', efficiency: '90 %', efficiencySource: 'measured' })
    ).converter;
    await post(page, `/api/teardowns/${td.id}/loads`, {
      kind: 'heater',
      label: 'Heater pads',
      resistanceOhms: '3R0',
      supplyVolts: '3.65 V',
      count: 2,
      connection: 'parallel',
      heatedAreaM2: '100 cm²',
      surfaceMaterial: 'plastic',
    });
    await post(page, `/api/teardowns/${td.id}/loads`, { kind: 'usb-output', label: 'USB-A port', currentAmps: '1 A', converterId: boost.id });

    await page.goto(`/teardowns/${td.id}/power`);
    const panel = page.locator('aside[aria-label="Figures"]');
    await panel.getByTestId('all-at-once').waitFor();
    const card = page.locator('section', { has: page.getByRole('heading', { name: 'Operating modes' }) });
    await card.getByText(/No modes yet/).waitFor();

    // Low: the heater at 50 %, typed from the keyboard, Enter saves.
    await card.getByRole('button', { name: 'Add mode' }).click();
    await card.getByLabel('Name of the new mode').fill('Low');
    await card.getByLabel('Duty of Heater pads in the new mode').fill('50 %');
    await card.getByLabel('Duty of Heater pads in the new mode').press('Enter');
    await card.locator('tr[data-mode="Low"]').waitFor();

    // High: duty worked out for 45 °C first, then full power typed over it.
    await card.getByRole('button', { name: 'Add mode' }).click();
    await card.getByLabel('Name of the new mode').fill('High');
    await card.getByRole('button', { name: 'Duty for 45 °C' }).click();
    // 3.196 W of loss at 45 °C over 100 cm² (convection + exact radiation) ÷ 8.881667 W = 36.0 % [C]
    await expect.poll(() => card.getByLabel('Duty of Heater pads in the new mode').inputValue(), { timeout: 10_000 }).toBe('36 %');
    await card
      .getByRole('status')
      .getByText(/holds about 45 °C/)
      .waitFor();
    await card.getByLabel('Duty of Heater pads in the new mode').fill('100 %');
    await card.getByLabel('Note on the new mode').fill('button held 2 s');
    await card.getByRole('button', { name: 'Add', exact: true }).click();
    await card.locator('tr[data-mode="High"]').waitFor();

    // Power bank and standby.
    await card.getByRole('button', { name: 'Add mode' }).click();
    await card.getByLabel('Name of the new mode').fill('Power bank');
    // A bare "1" could be 1 % or 100 %: refused, naming the field and the unit asked for; nothing saved.
    await card.getByLabel('Duty of USB-A port in the new mode').fill('1');
    await card.getByLabel('Duty of USB-A port in the new mode').press('Enter');
    await card.getByText('Duty: add a unit, e.g. 60 %').waitFor();
    await expect(card.locator('tr[data-mode="Power bank"]').count()).resolves.toBe(0);
    await card.getByLabel('Duty of USB-A port in the new mode').fill('100 %');
    await card.getByLabel('Duty of USB-A port in the new mode').press('Enter');
    await card.locator('tr[data-mode="Power bank"]').waitFor();
    await card.getByRole('button', { name: 'Add mode' }).click();
    await card.getByLabel('Name of the new mode').fill('Standby');
    await card.getByLabel('Standby current of the new mode').fill('20 µA');
    await card.getByLabel('Standby current of the new mode').press('Enter');
    await card.locator('tr[data-mode="Standby"]').waitFor();

    // A bad duty is refused in its cell, and nothing is saved.
    await card.getByRole('button', { name: 'Edit mode Low' }).click();
    await card.getByLabel('Duty of Heater pads in Low').fill('150 %');
    await card.getByLabel('Duty of Heater pads in Low').press('Enter');
    await expect.poll(() => card.getByText('Duty: at most 100 %').count(), { timeout: 10_000 }).toBe(1);
    await card.getByLabel('Duty of Heater pads in Low').press('Escape');

    // The figures per mode [C: REFERENCES §3, §11]: high 8.88 W for 9.99 Wh × 0.9 ÷ 8.881667 W = 1.01 h;
    // low 4.44 W for 2.02 h; the power bank 5 W at the port, 5.56 W from the pack, 1.62 h.
    await expect.poll(() => modeFigure(page, 'High', 'Power at the loads').textContent(), { timeout: 15_000 }).toBe('8.88 W');
    await expect.poll(() => modeFigure(page, 'High', 'Runtime').textContent(), { timeout: 10_000 }).toBe('1.01 h');
    await expect.poll(() => modeFigure(page, 'Low', 'Runtime').textContent(), { timeout: 10_000 }).toBe('2.02 h');
    await expect.poll(() => modeFigure(page, 'Power bank', 'Power from the pack').textContent(), { timeout: 10_000 }).toBe('5.56 W');
    await expect.poll(() => modeFigure(page, 'Power bank', 'Runtime').textContent(), { timeout: 10_000 }).toBe('1.62 h');
    await expect.poll(() => modeFigure(page, 'Standby', 'Standby from full to empty').count(), { timeout: 10_000 }).toBe(1);
    await expect.poll(() => panel.getByTestId('all-at-once').count(), { timeout: 10_000 }).toBe(0);
    await page.context().close();
  });
});
