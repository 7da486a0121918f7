// Bench tools in the browser: decode a marking, compute a heater trace and a runtime from typed
// units, and open "How was this computed" to see formula and source. Values: REFERENCES.md.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launch, signedInPage } from './browser';

let browser: Browser;
let page: Page;
beforeAll(async () => {
  browser = await launch();
  page = await signedInPage(browser, 'engineer');
});
afterAll(async () => {
  await page?.context().close();
  await browser?.close();
});

const text = (testId: string) => page.getByTestId(testId).first().textContent();

describe('bench tools', () => {
  it('opens from the left rail', async () => {
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Bench tools' }).click();
    await page.waitForURL(/\/tools$/);
    await page.getByRole('heading', { name: 'Bench tools' }).waitFor();
    await expect.poll(() => page.getByRole('tab', { name: 'Marking decoder' }).getAttribute('aria-selected'), { timeout: 10_000 }).toBe('true');
  });

  it('decodes "4R7" as 4.70 Ω on a resistor [S], with formula and source', async () => {
    await page.getByLabel('Marking as read').fill('4R7');
    await page.getByText('Resistor', { exact: true }).first().click();
    const value = page.getByTestId('marking-value');
    await expect.poll(() => value.count()).toBe(1);
    await expect.poll(() => value.textContent()).toBe('4.70 Ω');
    const reading = page.getByRole('article', { name: 'Resistor reading' });
    await expect.poll(() => reading.textContent(), { timeout: 10_000 }).toMatch(/"R" stands for the decimal point/);
    await reading.getByText('How was this computed').click();
    await expect.poll(() => reading.getByTestId('formula').textContent(), { timeout: 10_000 }).toMatch(/R, K or M is the decimal point/);
    await expect.poll(() => reading.getByTestId('source').textContent(), { timeout: 10_000 }).toMatch(/IEC 60062/);
  });

  it('lists every reading of "10R", ranked with its rule: 10.0 Ω R-notation first, 1.24 Ω EIA-96 second [S: IEC 60062; EIA-96; CP: ranking]', async () => {
    await page.getByLabel('Marking as read').fill('10R');
    await expect.poll(() => page.getByTestId('marking-reading').count(), { timeout: 10_000 }).toBe(2);
    await expect.poll(() => page.getByTestId('marking-value').allTextContents(), { timeout: 10_000 }).toEqual(['10.0 Ω', '1.24 Ω']);
    await expect.poll(() => page.getByTestId('marking-rule').allTextContents(), { timeout: 10_000 }).toEqual(['Letter-and-digit code (IEC 60062)', 'EIA-96 code']);
    await expect.poll(() => page.getByRole('article', { name: 'Resistor reading 1 of 2' }).textContent(), { timeout: 10_000 }).toMatch(/most likely/);
  });

  it('reads yellow-violet-red-gold as 4.70 kΩ ±5 % [C]', async () => {
    await page.getByText('Colour bands', { exact: true }).click();
    const colours = ['Yellow', 'Violet', 'Red', 'Gold'];
    for (const [i, c] of colours.entries()) await page.getByLabel(new RegExp(`^Band ${i + 1} `)).selectOption({ label: c });
    await expect.poll(() => text('marking-value')).toBe('4.70 kΩ');
    await expect.poll(() => page.getByRole('article', { name: 'Resistor reading' }).textContent(), { timeout: 10_000 }).toMatch(/±5 %/);
  });

  it('computes a 3.00 Ω heater trace at 3.65 V from typed units: 4.44 W [C], with the hot-surface caution', async () => {
    // Keyboard: arrow keys move between the tool tabs.
    await page.getByRole('tab', { name: 'Marking decoder' }).focus();
    await page.keyboard.press('ArrowRight');
    await page.waitForURL(/tool=heater-trace/);
    await page.getByLabel('Trace length').fill('1547 mm');
    await page.getByLabel('Trace width').fill('0.254 mm');
    await page.getByLabel('Copper thickness').fill('35 µm');
    await page.getByLabel('Supply voltage').fill('3.65 V');
    await page.getByLabel('Heated area').fill('24 cm²');
    await expect.poll(() => text('value-resistance')).toBe('3.00 Ω');
    await expect.poll(() => text('value-power')).toBe('4.44 W');
    await expect.poll(() => text('parsed-thickness')).toMatch(/read as 35\.0 µm/);
    await expect.poll(() => text('parsed-length')).toMatch(/read as 1\.55 m/);
    const resistance = page.locator('[data-figure="resistance"]');
    await resistance.getByText('How was this computed').click();
    await expect.poll(() => resistance.getByTestId('formula').textContent(), { timeout: 10_000 }).toBe('R = ρ·L / (w·t) · [1 + α·(T − 20 °C)]');
    await expect.poll(() => resistance.getByTestId('source').textContent(), { timeout: 10_000 }).toMatch(/IEC 60028/);
    await expect.poll(() => page.locator('[data-figure="powerDensity"]').getByRole('note', { name: 'Hot surfaces' }).count(), { timeout: 10_000 }).toBe(1);
  });

  it('names a wrong field and keeps the last results', async () => {
    await page.getByLabel('Copper thickness').fill('1 lb');
    await expect.poll(() => page.getByText(/copper weight such as "1 oz"/).count()).toBe(1);
    await expect.poll(() => page.getByText('These results are for the last inputs that could be computed.').count()).toBe(1);
    await expect.poll(() => text('value-power'), { timeout: 10_000 }).toBe('4.44 W');
    await page.getByLabel('Copper thickness').fill('1 oz');
    await expect.poll(() => text('parsed-thickness')).toMatch(/read as 35\.0 µm/);
  });

  it('computes a runtime from "2700 mAh" and "9 W": 1.11 h [CP], with the lithium caution, formula and source', async () => {
    await page.getByRole('tab', { name: 'Runtime' }).click();
    await page.getByLabel('Cell nominal voltage').fill('3.7 V');
    await page.getByLabel('Cell capacity').fill('2700 mAh');
    await page.getByLabel('Load power').fill('9 W');
    await expect.poll(() => text('value-runtime')).toBe('1.11 h');
    await expect.poll(() => text('value-packEnergy')).toBe('9.99 Wh');
    await expect.poll(() => text('parsed-cellCapacity')).toMatch(/read as 2\.70 Ah/);
    await expect.poll(() => page.getByRole('note', { name: 'Lithium cells' }).count(), { timeout: 10_000 }).toBe(1);
    const runtime = page.locator('[data-figure="runtime"]');
    await runtime.getByText('How was this computed').click();
    await expect.poll(() => runtime.getByTestId('formula').textContent(), { timeout: 10_000 }).toMatch(/t = E · η · u \/ P/);
    await expect.poll(() => runtime.getByTestId('source').textContent(), { timeout: 10_000 }).toMatch(/\[C\]/);
  });

  it('is in the rail of every role, viewers included', async () => {
    const viewer = await signedInPage(browser, 'viewer');
    const rail = viewer.getByRole('navigation', { name: 'Main' });
    await rail.getByRole('link', { name: 'Home', exact: true }).waitFor();
    await expect.poll(() => rail.getByRole('link', { name: 'Bench tools' }).count(), { timeout: 10_000 }).toBe(1);
    await viewer.context().close();
  });
});
