// Editing a teardown that is not a plain draft, in the browser: in review it is read-only until its
// engineer withdraws it from review; published, a change asks first in the one dialog (keep it
// published: nothing saved; save: back to draft).
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { TeardownDto } from '@splitcase/contracts';
import { launch, signedInPage } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

async function csrf(page: Page): Promise<string> {
  return (await (await page.request.get('/api/auth/csrf')).json()).token;
}

async function post(page: Page, url: string, data: unknown, status = 201) {
  const res = await page.request.post(url, { headers: { 'X-CSRF-Token': await csrf(page) }, data });
  expect(res.status(), `${url}: ${await res.text()}`).toBe(status);
  return res.json();
}

/** A fresh teardown of an invented device, submitted for review (the shared demo stays as it is). */
async function teardownInReview(page: Page, model: string): Promise<TeardownDto> {
  const { device } = await post(page, '/api/devices', { maker: 'Testwright', model, category: 'pocket-heater' });
  const { teardown } = await post(page, '/api/teardowns', { deviceId: device.id, unitLabel: 'Unit L' });
  await post(page, `/api/teardowns/${teardown.id}/measurements`, { quantity: 'resistance', subject: 'Heater flex, cold', value: '3.02 Ω' });
  return (await post(page, `/api/teardowns/${teardown.id}/submit`, {}, 200)).teardown;
}

const quickEntry = async (page: Page, subject: string, value: string) => {
  await page.getByRole('combobox', { name: 'Quantity' }).first().selectOption('resistance');
  await page.getByRole('textbox', { name: 'What was measured', exact: true }).fill(subject);
  await page.getByRole('textbox', { name: 'Value with unit' }).fill(value);
  await page.getByRole('textbox', { name: 'Value with unit' }).press('Enter');
};

describe('a teardown in review', () => {
  it('is read-only for its engineer until withdrawn from review; then it is a draft to edit and submit again', async () => {
    const page = await signedInPage(browser, 'engineer');
    const t = await teardownInReview(page, `Review Lock ${Date.now().toString(36)}`);
    await page.goto(`/teardowns/${t.id}/measurements`);
    await page.getByRole('row').filter({ hasText: 'Heater flex, cold' }).waitFor();
    await page.getByRole('note').filter({ hasText: 'In review, so read-only' }).waitFor();
    await expect(page.getByRole('textbox', { name: 'Value with unit' }).count()).resolves.toBe(0);
    await expect(page.getByRole('button', { name: 'Submit for review' }).count()).resolves.toBe(0);

    await page.getByRole('button', { name: 'Withdraw from review to edit' }).click();
    await page.locator('header').getByText('Draft', { exact: true }).waitFor();
    await page.getByRole('button', { name: 'Submit for review' }).waitFor();
    await quickEntry(page, 'Heater flex, warm', '3.4 Ω');
    await page.getByRole('row').filter({ hasText: 'Heater flex, warm' }).waitFor();
    await expect.poll(async () => (await (await page.request.get(`/api/teardowns/${t.id}`)).json()).teardown.status, { timeout: 10_000 }).toBe('draft');
    await page.context().close();
  });

  it('another engineer sees it read-only, without the withdraw action', async () => {
    const owner = await signedInPage(browser, 'engineer');
    const t = await teardownInReview(owner, `Review Lock Other ${Date.now().toString(36)}`);
    await owner.context().close();
    const page = await signedInPage(browser, 'engineer2');
    await page.goto(`/teardowns/${t.id}/measurements`);
    await page.getByRole('row').filter({ hasText: 'Heater flex, cold' }).waitFor();
    await page.locator('header').getByText('In review', { exact: true }).waitFor();
    await expect(page.getByRole('textbox', { name: 'Value with unit' }).count()).resolves.toBe(0);
    await expect(page.getByRole('button', { name: 'Withdraw from review to edit' }).count()).resolves.toBe(0);
    await page.context().close();
  });
});

describe('a published teardown', () => {
  it('asks before a change: keep it published saves nothing; save moves it back to draft', async () => {
    const page = await signedInPage(browser, 'engineer');
    const t = await teardownInReview(page, `Publish Ask ${Date.now().toString(36)}`);
    const lead = await signedInPage(browser, 'lead');
    await post(lead, `/api/teardowns/${t.id}/approve`, {}, 200);
    await lead.context().close();

    await page.goto(`/teardowns/${t.id}/measurements`);
    await page.locator('header').getByText('Published', { exact: true }).waitFor();
    await quickEntry(page, 'Heater flex, hot', '3.6 Ω');
    const dialog = page.getByRole('dialog');
    await dialog.getByText('Move this teardown back to draft?').waitFor();
    await dialog.getByRole('button', { name: 'Keep it published' }).click();
    await expect.poll(async () => (await (await page.request.get(`/api/teardowns/${t.id}/measurements`)).json()).measurements.length, { timeout: 10_000 }).toBe(1);
    expect((await (await page.request.get(`/api/teardowns/${t.id}`)).json()).teardown.status).toBe('published');

    await page.getByRole('textbox', { name: 'Value with unit' }).press('Enter');
    await dialog.getByRole('button', { name: 'Save and move to draft' }).click();
    await page.getByRole('row').filter({ hasText: 'Heater flex, hot' }).waitFor();
    await page.locator('header').getByText('Draft', { exact: true }).waitFor();
    await page.context().close();
  });
});
