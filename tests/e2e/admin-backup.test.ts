// The admin page says when the last backup was made: nothing yet on a fresh workspace, then the date
// of a backup taken while the server runs. No serious or critical accessibility violation either way.
import { dirname } from 'node:path';
import AxeBuilder from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { testEnv } from '../../apps/api/src/config/env';
import { APP_VERSION } from '../../apps/api/src/http/create-app';
import { createBackup } from '../../apps/api/src/modules/system/backup';
import { launch, signedInPage } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

async function seriousViolations(page: Page) {
  const results = await new AxeBuilder({ page: page as never }).analyze();
  return results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`);
}

describe('last backup on the admin page', () => {
  it('shows none, then the date of a backup made while the server runs', async () => {
    const page = await signedInPage(browser, 'admin');
    await page.goto('/admin/users');
    await expect.poll(() => page.getByTestId('last-backup').textContent(), { timeout: 10_000 }).toMatch(/No backup yet\. Run npm run backup on the server\./);
    expect(await seriousViolations(page)).toEqual([]);

    const env = testEnv({ dataDir: dirname(inject('dbPath')) });
    const { manifest } = await createBackup(env, { appVersion: APP_VERSION });
    const shown = new Date(manifest.createdAt).toLocaleString('en-GB', { year: 'numeric', month: 'short', day: 'numeric', hour: '2-digit', minute: '2-digit' });
    await page.reload();
    await expect.poll(() => page.getByTestId('last-backup').textContent(), { timeout: 10_000 }).toContain(`Last backup: ${shown}`);
    expect(await page.getByTestId('last-backup').locator('time').getAttribute('datetime')).toBe(manifest.createdAt);
    expect(await seriousViolations(page)).toEqual([]);
    await page.context().close();
  });
});
