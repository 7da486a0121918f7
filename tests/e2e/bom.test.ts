// An engineer at the bench: adds a part inline, imports a CSV (preview with row errors, then
// commit), records a reading typed with its unit, and edits the pack with "2700 mAh".
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launch, signedInPage } from './browser';

let browser: Browser;
let page: Page;
let teardownId: number;

/** The demo draft teardown of the Stackcell 20 PD (found through the API, not by a fixed id). */
async function findTeardown(p: Page, model: string): Promise<number> {
  for (let id = 1; id <= 40; id++) {
    const res = await p.request.get(`/api/teardowns/${id}`);
    if (res.ok() && (await res.json()).teardown.device.model === model) return id;
  }
  throw new Error(`No teardown of ${model}`);
}

beforeAll(async () => {
  browser = await launch();
  page = await signedInPage(browser, 'engineer');
  teardownId = await findTeardown(page, 'Stackcell 20 PD');
});
afterAll(() => browser?.close());

const row = (p: Page, text: string) => p.getByRole('row').filter({ hasText: text });

describe('parts, measurements and the pack at the bench', () => {
  it('adds a part inline: Enter saves the line and the entry row is ready for the next', async () => {
    await page.goto(`/teardowns/${teardownId}/parts`);
    await page.getByLabel('New part: designators').fill('R42');
    await page.getByLabel('New part: category').selectOption('passive');
    await page.getByLabel('New part: description').fill('E2E chip resistor, pull-down');
    await page.getByLabel('New part: marking').fill('103');
    await page.getByLabel('New part: marking').press('Enter');
    const added = row(page, 'E2E chip resistor, pull-down');
    await added.waitFor();
    // 103 = 10 × 10³ Ω [S: REFERENCES.md §1, SMD resistor codes]
    await expect.poll(() => added.textContent(), { timeout: 10_000 }).toContain('10.0 kΩ');
    // The line shows as soon as the list is updated; the entry row is cleared right after the save returns.
    await expect.poll(() => page.getByLabel('New part: description').inputValue(), { timeout: 10_000 }).toBe('');
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('aria-label')), { timeout: 10_000 }).toBe('New part: designators');
  });

  it('edits a line in place: Enter saves, the decoded value follows the marking', async () => {
    await row(page, 'E2E chip resistor, pull-down')
      .getByRole('button', { name: /^Edit R42/ })
      .click();
    const marking = page.getByRole('textbox', { name: 'Marking', exact: true });
    await marking.fill('4R7');
    await marking.press('Enter');
    await expect.poll(async () => row(page, 'E2E chip resistor, pull-down').textContent(), { timeout: 10_000 }).toContain('4.70 Ω');
  });

  it('shows that a marking reads another way too, and lists every reading from the keyboard [S: IEC 60062; EIA-96; CP: ranking]', async () => {
    await row(page, 'E2E chip resistor, pull-down')
      .getByRole('button', { name: /^Edit R42/ })
      .click();
    const marking = page.getByRole('textbox', { name: 'Marking', exact: true });
    await marking.fill('10R');
    await marking.press('Enter');
    const line = row(page, 'E2E chip resistor, pull-down');
    // 10R = 10 Ω (R-notation) first; as EIA-96, index 10 = 124 × 0.01 = 1.24 Ω
    const other = line.getByRole('button', { name: /or 1\.24 Ω \(EIA-96\)/ });
    await other.waitFor({ timeout: 10_000 });
    await expect.poll(() => line.textContent(), { timeout: 10_000 }).toContain('10.0 Ω');
    await other.focus();
    await page.keyboard.press('Enter');
    await expect.poll(() => other.getAttribute('aria-expanded'), { timeout: 10_000 }).toBe('true');
    const list = page.getByRole('list', { name: 'Readings of the marking, most likely first' });
    await expect.poll(() => list.textContent(), { timeout: 10_000 }).toMatch(/10\.0 Ω.*Letter-and-digit code.*most likely.*1\.24 Ω.*EIA-96 code/);
  });

  it('imports a CSV: the preview names the bad row and column, nothing is saved until it is fixed', async () => {
    await page.getByRole('button', { name: 'Import CSV' }).click();
    const paste = page.getByLabel('…or paste it here');
    await paste.fill('Designators;Category;Description;Marking;Qty\nJ9;connector;E2E header 2 pins;;1\nX9;gizmo;E2E mystery;;1\n');
    await page.getByRole('button', { name: 'Preview' }).click();
    const problems = page.getByRole('list', { name: 'Problems in the file' });
    await problems.waitFor();
    await expect.poll(() => problems.textContent(), { timeout: 10_000 }).toMatch(/Row 3, Category: Unknown category "gizmo"/);
    await expect
      .poll(
        () =>
          page
            .getByRole('button', { name: /^Import/ })
            .last()
            .isDisabled(),
        { timeout: 10_000 },
      )
      .toBe(true);

    await paste.fill('Designators;Category;Description;Marking;Qty\nJ9;connector;E2E header 2 pins;;1\nC99;capacitor;E2E bulk capacitor;226;2\n');
    await page.getByRole('button', { name: 'Preview' }).click();
    await page.getByText('2 rows ready to import').waitFor();
    await page.getByRole('button', { name: 'Import 2 parts' }).click();
    // The preview (which lists the same rows) closes once the import is committed.
    await page.getByRole('button', { name: 'Import 2 parts' }).waitFor({ state: 'detached' });
    await row(page, 'E2E bulk capacitor').waitFor();
    // 226 = 22 × 10⁶ pF = 22 µF [S: REFERENCES.md §1, capacitor 3-digit code]
    await expect.poll(() => row(page, 'E2E bulk capacitor').textContent(), { timeout: 10_000 }).toContain('22.0 µF');
    await row(page, 'E2E header 2 pins').waitFor();
  });

  it('records a reading typed with its unit and sees it in the table', async () => {
    await page.goto(`/teardowns/${teardownId}/measurements`);
    await page.getByRole('combobox', { name: 'Quantity' }).first().selectOption('resistance');
    await page.getByRole('textbox', { name: 'What was measured', exact: true }).fill('E2E heater element, front');
    await page.getByRole('textbox', { name: 'Value with unit' }).fill('3.02 Ω');
    await page.getByRole('textbox', { name: 'Value with unit' }).press('Enter');
    const reading = row(page, 'E2E heater element, front');
    await reading.waitFor();
    await expect.poll(() => reading.textContent(), { timeout: 10_000 }).toContain('3.02 Ω');
    // Ready for the next reading: the value is cleared and focused.
    await expect.poll(() => page.getByRole('textbox', { name: 'Value with unit' }).inputValue()).toBe('');

    // A voltage typed for a current is refused, naming the field.
    await page.getByRole('combobox', { name: 'Quantity' }).first().selectOption('current');
    await page.getByRole('textbox', { name: 'Value with unit' }).fill('3.7 V');
    await page.getByRole('textbox', { name: 'Value with unit' }).press('Enter');
    await expect.poll(() => page.getByRole('alert').filter({ hasText: 'Value' }).first().textContent(), { timeout: 10_000 }).toMatch(/current/);
  });

  it('edits the pack with "2700 mAh": stored as 2.7 Ah, the typed text shown back', async () => {
    await page.goto(`/teardowns/${teardownId}/power`);
    await page.getByText('Lithium cell: before you open the case').waitFor();
    const capacity = page.getByLabel('Rated capacity (per cell)');
    await capacity.fill('2700 mAh');
    await page.getByRole('button', { name: 'Save pack' }).click();
    await page.getByText('Pack saved.').waitFor();
    await page.reload();
    await expect.poll(() => page.getByLabel('Rated capacity (per cell)').inputValue(), { timeout: 10_000 }).toBe('2700 mAh');
    await page.getByText('= 2.70 Ah').waitFor();
    const pack = await (await page.request.get(`/api/teardowns/${teardownId}/pack`)).json();
    expect(pack.pack.capacityAh).toBeCloseTo(2.7, 12);
    expect(pack.pack.entered.capacityAh).toBe('2700 mAh');
  });
});
