// The teardown workspace end to end: an engineer adds a device and starts a teardown, edits it, sees
// the figures panel follow the records, accepts a suggested finding and submits; a lead approves; a
// viewer reads it published.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { openOrm } from '../../apps/api/src/db/orm';
import { LoadSchema } from '../../apps/api/src/modules/power/load.entity';
import { PackSchema } from '../../apps/api/src/modules/power/pack.entity';
import { launch, signedInPage } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

/**
 * The power system of the new teardown, written straight to the database (this branch has no power
 * system screen): one 2.7 Ah 3.7 V Li-ion cell, two 3.0 Ω heater elements in parallel at 3.65 V.
 */
async function recordPowerSystem(teardownId: number) {
  const orm = await openOrm(inject('dbPath'));
  try {
    const em = orm.em.fork();
    em.create(PackSchema, { teardown: teardownId, chemistry: 'li-ion', cellNominalVolts: 3.7, cellRatedAh: 2.7, series: 1, parallel: 1, packMassKg: 0.046, protection: true } as never);
    em.create(LoadSchema, { teardown: teardownId, kind: 'heater', label: 'Heater flexes', resistanceOhms: 3, supplyVolts: 3.65, count: 2, connection: 'parallel', duty: 1 } as never);
    await em.flush();
  } finally {
    await orm.close();
  }
}

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

  it('an engineer adds a device, starts a teardown, edits it, accepts a suggested finding and submits it', async () => {
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
    await expect(page.getByText(/Enter a capacity such as "2700 mAh"/).textContent()).resolves.toContain('bananas');
    await page.getByLabel('Capacity on the label').fill('4000 mAh');
    await page.getByRole('button', { name: 'Add device' }).click();
    await page.getByRole('heading', { name: 'Testwright Pocketwarm E2E' }).waitFor();
    await page.getByText('4000 mAh', { exact: true }).waitFor();

    await page.getByRole('button', { name: 'Start a teardown' }).click();
    const dialog = page.getByRole('dialog');
    await expect(dialog.getByRole('note', { name: /Lithium cell/ }).textContent()).resolves.toMatch(/Discharge the cell first/);
    await dialog.getByLabel('Unit').fill('Unit E');
    await dialog.getByRole('button', { name: 'Start the teardown' }).click();
    await page.waitForURL(/\/teardowns\/\d+$/);
    teardownUrl = new URL(page.url()).pathname;
    const teardownId = Number(teardownUrl.split('/').pop());
    await page.getByRole('heading', { name: /Testwright Pocketwarm E2E/ }).waitFor();

    // No records yet: the panel says how figures appear.
    const panel = page.locator('aside[aria-label="Figures"]');
    await panel.getByText(/No figures yet/).waitFor();
    await expect(panel.getByText(/not certification results/).count()).resolves.toBe(1);

    await page.getByLabel('Summary').fill('Single-cell pocket heater, two flexible heaters in parallel, no sensor found yet.');
    await recordPowerSystem(teardownId);
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await page.getByText('Saved.').waitFor();

    // The save invalidated the teardown's queries: the panel now shows the figures of the new records.
    // [REFERENCES §3; C] 2 × 3.0 Ω in parallel at 3.65 V: 8.881667 W, 2.433333 A; [C] 3.7 V × 2.7 Ah = 9.99 Wh
    await expect(figure(page, 'Total load power').textContent()).resolves.toBe('8.88 W');
    await expect(figure(page, 'Current from the pack').textContent()).resolves.toBe('2.43 A');
    await expect(figure(page, 'Pack energy').textContent()).resolves.toBe('9.99 Wh');
    await expect(figure(page, 'Air-transport class').textContent()).resolves.toBe('Up to 100 Wh');
    await page.getByRole('button', { name: /^Pack energy/ }).click();
    await expect(panel.getByText('Formula').first().isVisible()).resolves.toBe(true);

    const suggestion = panel.locator('[data-suggestion="thermal.no-sensor"]');
    await suggestion.getByText('Heater without temperature sensing').waitFor();
    await suggestion.getByRole('button', { name: 'Accept' }).click();
    await suggestion.getByText('Accepted', { exact: true }).waitFor();
    await page.getByRole('navigation', { name: 'Teardown sections' }).getByRole('link', { name: 'Findings' }).click();
    const finding = page.locator('[data-finding-id]').filter({ hasText: 'From a suggestion' });
    await finding.waitFor();
    await expect(finding.count()).resolves.toBe(1);
    await expect(finding.textContent()).resolves.toMatch(/no part is recorded as a sensor/);

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
    await expect(figure(page, 'Pack energy').textContent()).resolves.toBe('9.99 Wh');
    await page.locator('[data-suggestion="thermal.no-sensor"]').getByText('Accepted', { exact: true }).waitFor();
    await expect(page.locator('[data-suggestion="thermal.no-sensor"]').getByRole('button', { name: 'Accept' }).count()).resolves.toBe(0);
    await page.context().close();
  });
});
