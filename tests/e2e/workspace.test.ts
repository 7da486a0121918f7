// The teardown workspace end to end, through the screens: an engineer adds a device and starts a
// teardown, records a part, uploads two photos (progress to 100 %), pins a callout linked to the part,
// records the pack and the heater load with units, enters a measurement with its unit, sees the
// figures panel follow the records, accepts a suggested finding and submits; a lead approves; a
// viewer reads it published.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { launch, signedInPage } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

/** A JPEG of about a megabyte (noise compresses badly), so an upload shows more than one progress event. */
async function benchJpeg(seed: number): Promise<Buffer> {
  const w = 1400;
  const h = 1000;
  const raw = Buffer.alloc(w * h * 3);
  for (let i = 0; i < raw.length; i++) raw[i] = ((i * 2654435761 + seed * 97) >>> 24) & 0xff;
  return sharp(raw, { raw: { width: w, height: h, channels: 3 } })
    .jpeg({ quality: 80 })
    .toBuffer();
}

const section = (page: Page, name: string) => page.getByRole('navigation', { name: 'Teardown sections' }).getByRole('link', { name, exact: true }).click();

const figure = (page: Page, label: string) => page.locator('aside[aria-label="Figures"] li', { has: page.getByRole('button', { name: new RegExp(`^${label}`) }) }).getByTestId('figure-value');

describe('left rail', () => {
  it('every role has Devices in the rail', async () => {
    for (const role of ['admin', 'engineer', 'sourcing', 'lead', 'viewer']) {
      const page = await signedInPage(browser, role);
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Devices', exact: true }).click();
      await page.getByRole('heading', { name: 'Devices' }).waitFor();
      await expect(page.getByRole('button', { name: 'New device' }).count(), role).resolves.toBe(role === 'engineer' || role === 'admin' ? 1 : 0);
      await page.context().close();
    }
  });
});

describe('teardown workspace', () => {
  let teardownUrl = '';

  it('an engineer adds a device and a teardown, a part, two photos with a pinned callout, the power system and a measurement with units, sees the figures, accepts a suggested finding and submits', async () => {
    const page = await signedInPage(browser, 'engineer');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Devices' }).click();
    await page.getByRole('heading', { name: 'Devices' }).waitFor();
    await page.getByRole('row', { name: /HandGlow Duo 10/ }).waitFor();
    await page.getByRole('button', { name: 'New device' }).click();
    await page.getByRole('heading', { name: 'New device' }).waitFor();

    await page.getByLabel('Maker', { exact: true }).fill('Testwright');
    await page.getByLabel('Model', { exact: true }).fill('Pocketwarm E2E');
    await page.getByLabel('Category', { exact: true }).selectOption('pocket-heater');
    await page.getByLabel('Retail price').fill('19.50');
    await page.getByLabel('Currency').fill('usd');
    await page.getByLabel('Capacity on the label').fill('4000 bananas');
    await page.getByRole('button', { name: 'Add device' }).click();
    // The server names the field; the form shows it there.
    await expect.poll(() => page.getByText(/^Capacity on the label: enter a capacity such as "2700 mAh"/).textContent(), { timeout: 10_000 }).toContain('bananas');
    await page.getByLabel('Capacity on the label').fill('4000 mAh');
    await page.getByRole('button', { name: 'Add device' }).click();
    await page.getByRole('heading', { name: 'Testwright Pocketwarm E2E' }).waitFor();
    await page.getByText('4000 mAh', { exact: true }).waitFor();

    await page.getByRole('button', { name: 'Start a teardown' }).click();
    const dialog = page.getByRole('dialog');
    await expect.poll(() => dialog.getByRole('note', { name: /Lithium cell/ }).textContent(), { timeout: 10_000 }).toMatch(/Discharge the cell first/);
    await dialog.getByLabel('Unit').fill('Unit E');
    await dialog.getByRole('button', { name: 'Start the teardown' }).click();
    await page.waitForURL(/\/teardowns\/\d+$/);
    teardownUrl = new URL(page.url()).pathname;
    const teardownId = Number(teardownUrl.split('/').pop());
    await page.getByRole('heading', { name: /Testwright Pocketwarm E2E/ }).waitFor();

    // No records yet: the panel says how figures appear.
    const panel = page.locator('aside[aria-label="Figures"]');
    await panel.getByText(/No figures yet/).waitFor();
    await expect.poll(() => panel.getByText(/not certification results/).count(), { timeout: 10_000 }).toBe(1);

    await page.getByLabel('Summary').fill('Single-cell pocket heater, two flexible heaters in parallel, no sensor found yet.');
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await page.getByText('Saved.').waitFor();

    // A part, added inline in the parts list.
    await section(page, 'Parts');
    await page.getByLabel('New part: designators').fill('HT1, HT2');
    await page.getByLabel('New part: category').selectOption('heater');
    await page.getByLabel('New part: description').fill('Flexible PCB heater element, 3 Ω');
    await page.getByLabel('New part: description').press('Enter');
    await page.getByRole('row').filter({ hasText: 'Flexible PCB heater element' }).waitFor();
    const parts = (await (await page.request.get(`/api/teardowns/${teardownId}/parts`)).json()).parts as { id: number; description: string }[];
    const heaterPart = parts.find((x) => x.description.startsWith('Flexible PCB heater element'))!;

    // Two photos through the drop zone's file chooser: each shows its progress up to 100 %.
    await section(page, 'Photos');
    await page.getByTestId('photo-file-input').setInputFiles([
      { name: 'e2e-case-open.jpg', mimeType: 'image/jpeg', buffer: await benchJpeg(3) },
      { name: 'e2e-heater-flex.jpg', mimeType: 'image/jpeg', buffer: await benchJpeg(4) },
    ]);
    const uploads = page.getByTestId('upload-row');
    for (const name of ['e2e-case-open.jpg', 'e2e-heater-flex.jpg']) {
      const row = uploads.filter({ hasText: name });
      await row.getByText('Stored').waitFor({ timeout: 60_000 });
      await expect.poll(() => row.getByRole('progressbar').getAttribute('aria-valuenow'), { timeout: 10_000 }).toBe('100');
    }
    await expect.poll(() => page.getByTestId('upload-overall').textContent(), { timeout: 10_000 }).toBe('100 %');

    // A numbered pin on the heater photo, linked to the heater part.
    const photos = (await (await page.request.get(`/api/teardowns/${teardownId}/photos`)).json()).photos as { id: number; name: string }[];
    const flexPhoto = photos.find((x) => x.name === 'e2e-heater-flex.jpg')!;
    await page.getByTestId(`thumb-${flexPhoto.id}`).click();
    const stage = page.getByTestId('photo-stage');
    // Wait for the stage to show the photo just opened (not the one shown before the click).
    await stage.locator(`img[src*="/api/photos/${flexPhoto.id}/"]`).waitFor();
    await stage.scrollIntoViewIfNeeded();
    const box = (await stage.boundingBox())!;
    await page.mouse.click(box.x + box.width * 0.5, box.y + box.height * 0.5);
    await page.getByLabel('Label of pin 1').fill('Heater flex, front');
    await page.getByLabel('Part').selectOption(String(heaterPart.id));
    await page.getByRole('button', { name: 'Place pin' }).click();
    await page.getByTestId('stage-pin-1').waitFor();
    const pins = (await (await page.request.get(`/api/photos/${flexPhoto.id}/callouts`)).json()).callouts as { part: { id: number } | null }[];
    expect(pins[0]?.part?.id).toBe(heaterPart.id);

    // The power system, typed with units: one 2700 mAh cell, two 3R0 elements in parallel at 3.65 V.
    await section(page, 'Power system');
    await page.getByLabel('Chemistry').selectOption('li-ion');
    await page.getByLabel('Nominal voltage (per cell)').fill('3.7 V');
    await page.getByLabel('Rated capacity (per cell)').fill('2700 mAh');
    // A bare number is read in the unit of the field's example (46 g), never as 46 kg.
    await page.getByLabel('Pack mass').fill('46');
    await page.getByRole('button', { name: 'Record pack' }).click();
    await page.getByText('Pack saved.').waitFor();
    await page.getByRole('button', { name: 'Add load' }).click();
    const loadForm = page.getByRole('form', { name: 'New load' });
    await loadForm.getByLabel('Kind').selectOption('heater');
    await loadForm.getByLabel('Label').fill('Heater flexes, front and back');
    await loadForm.getByLabel('Resistance (per element)').fill('3R0');
    await loadForm.getByLabel('Supply voltage').fill('3.65 V');
    await loadForm.getByLabel('Count').fill('2');
    await loadForm.getByLabel('Connection').selectOption('parallel');
    await loadForm.getByRole('button', { name: 'Add load' }).click();
    await page.getByRole('row').filter({ hasText: 'Heater flexes, front and back' }).waitFor();

    // A measurement with its unit.
    await section(page, 'Measurements');
    await page.getByRole('combobox', { name: 'Quantity' }).first().selectOption('resistance');
    await page.getByRole('textbox', { name: 'What was measured', exact: true }).fill('Heater flex, front, cold');
    await page.getByRole('textbox', { name: 'Value with unit' }).fill('3.02 Ω');
    await page.getByRole('textbox', { name: 'Value with unit' }).press('Enter');
    await page.getByRole('row').filter({ hasText: 'Heater flex, front, cold' }).waitFor();

    // The figures panel followed every record.
    // [REFERENCES §3; C] 2 × 3.0 Ω in parallel at 3.65 V: 8.881667 W, 2.433333 A; [C] 3.7 V × 2.7 Ah = 9.99 Wh
    await expect.poll(() => figure(page, 'Total load power').textContent(), { timeout: 15_000 }).toBe('8.88 W');
    await expect.poll(() => figure(page, 'Current from the pack').textContent(), { timeout: 10_000 }).toBe('2.43 A');
    await expect.poll(() => figure(page, 'Pack energy').textContent(), { timeout: 10_000 }).toBe('9.99 Wh');
    await expect.poll(() => figure(page, 'Air-transport class').textContent(), { timeout: 10_000 }).toBe('Up to 100 Wh');
    // [C] 9.99 Wh / 0.046 kg = 217.17 Wh/kg (a bare "46" misread as kg would give 0.217 Wh/kg).
    await expect.poll(() => figure(page, 'Pack specific energy').textContent(), { timeout: 10_000 }).toBe('217 Wh/kg');
    await page.getByRole('button', { name: /^Pack energy/ }).click();
    await expect.poll(() => panel.getByText('Formula').first().isVisible(), { timeout: 10_000 }).toBe(true);

    const suggestion = panel.locator('[data-suggestion="thermal.no-sensor"]');
    await suggestion.getByText('Heater without temperature sensing').waitFor();
    await suggestion.getByRole('button', { name: 'Accept' }).click();
    await suggestion.getByText('Accepted', { exact: true }).waitFor();
    await page.getByRole('navigation', { name: 'Teardown sections' }).getByRole('link', { name: 'Findings' }).click();
    const finding = page.locator('[data-finding-id]').filter({ hasText: 'From a suggestion' });
    await finding.waitFor();
    await expect.poll(() => finding.count(), { timeout: 10_000 }).toBe(1);
    await expect.poll(() => finding.textContent(), { timeout: 10_000 }).toMatch(/no part is recorded as a sensor/);

    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Submit', exact: true }).click();
    await page.getByText('Waiting for a lead to review it.').waitFor();
    await page.context().close();
  });

  it('a lead approves it', async () => {
    const page = await signedInPage(browser, 'lead');
    await page.goto(teardownUrl);
    await page.getByRole('button', { name: 'Approve and publish' }).click();
    await page.getByRole('dialog').getByLabel('Note (optional)').fill('Good first pass.');
    await page.getByRole('dialog').getByRole('button', { name: 'Approve and publish' }).click();
    await page.getByText('Approved and published.').first().waitFor();
    await expect(page.getByRole('button', { name: 'Approve and publish' }).count()).resolves.toBe(0);
    await page.context().close();
  });

  it('a viewer sees it published, read-only', async () => {
    const page = await signedInPage(browser, 'viewer');
    await page.goto('/devices');
    await page.getByRole('row', { name: /Pocketwarm E2E/ }).click();
    await page.getByRole('link', { name: /Unit E/ }).click();
    await page.waitForURL(teardownUrl);
    await page.locator('header').getByText('Published').waitFor();
    await page.getByText('Single-cell pocket heater, two flexible heaters in parallel, no sensor found yet.').waitFor();
    await expect(page.getByRole('button', { name: 'Save', exact: true }).count()).resolves.toBe(0);
    await expect.poll(() => figure(page, 'Pack energy').textContent(), { timeout: 10_000 }).toBe('9.99 Wh');
    await page.locator('[data-suggestion="thermal.no-sensor"]').getByText('Accepted', { exact: true }).waitFor();
    await expect(page.locator('[data-suggestion="thermal.no-sensor"]').getByRole('button', { name: 'Accept' }).count()).resolves.toBe(0);
    await page.context().close();
  });
});
